import { describe, expect, it } from 'vitest';
import { escapeHtml, html, inlineJson } from './html';
import { renderReportDocument, renderSurveySection } from './index';
import { fabricatedReport, standInLookup } from './testing-fixture';
import { niceLogBound, niceTicks } from './nice-ticks';
import { drawChartsSource, installTickLabels, oneTwoFiveLabels } from './figure';

const attack = '<img src=x onerror=alert(1)>';

describe('report view', () => {
  it('escapeHtml() turns the five HTML-special characters into entities (OWASP XSS rule #1)', () => {
    expect(escapeHtml(`<a href="x">'&'</a>`)).toBe('&lt;a href=&quot;x&quot;&gt;&#39;&amp;&#39;&lt;/a&gt;');
  });

  it('html`` escapes interpolated text but keeps nested html`` markup', () => {
    expect(html`<td>${attack}</td>${html`<b>ok</b>`}`.value).toBe('<td>&lt;img src=x onerror=alert(1)&gt;</td><b>ok</b>');
  });

  it('inlineJson() cannot close its script element', () => {
    const text = inlineJson({ coil: '</script><script>alert(1)</script>' }).value;
    expect(text).not.toContain('</script');
    expect(JSON.parse(text)).toEqual({ coil: '</script><script>alert(1)</script>' });
  });

  it('renderSurveySection() shows a coil id of markup as text, everywhere it appears', () => {
    const markup = renderSurveySection(fabricatedReport(attack), standInLookup, 'rf-survey-1').value;
    expect(markup).not.toContain('<img');
    expect(markup).toContain('&lt;img src=x onerror=alert(1)&gt;');
    // the rejected cell "<b>x</b>" of the fixture is text too
    expect(markup).not.toContain('<b>x</b>');
  });

  it('renderSurveySection() shows the fitted ampere-turns with their interval', () => {
    const markup = renderSurveySection(fabricatedReport('HX-2'), standInLookup, 'rf-survey-1').value;
    // fixture: 120 A ± 2 × 1.2 A
    expect(markup).toMatch(/data-param="ampereTurns" data-value="120"><th scope="row">ampereTurns<\/th><td class="rf-num">120.0 A<\/td><td class="rf-num">117.6 to 122.4 A/);
  });

  it('renderSurveySection() copes with 200,000 readings, drawing an even sample and saying so', () => {
    // Math.max(...values) overflows V8's call stack near 10⁵ arguments; the view must not use it on readings
    const markup = renderSurveySection(fabricatedReport('BIG', 200_000), standInLookup, 'rf-survey-1').value;
    // drawnReadingsLimit (chart-spec.ts) is 1500; every fixture reading lies on the axis
    expect(markup).toContain('1500 of 200000 on-axis readings are drawn');
  });

  it('renderReportDocument() is self-contained: inline library, CSP forbidding outside requests, no src/href to elsewhere', () => {
    const doc = renderReportDocument({ surveys: [fabricatedReport('A'), { ...fabricatedReport('A'), date: '2025-03-14' }] }, { chartLibrary: 'window.Chart = function () {}; "</script>";', lookup: standInLookup });
    expect(doc).toContain(`default-src 'none'`);
    expect(doc).not.toMatch(/\s(src|href)="(?!#)/);
    expect(doc).toContain('window.Chart = function () {}; "<\\/script>";');
    // two surveys × (falloff, residuals) + the fleet history chart of coil A
    expect(doc.match(/<canvas /g)?.length).toBe(5);
    expect(doc).toContain('History: ampere-turns of each coil over time');
  });

  it('niceTicks(0, 100, 5) gives steps of 20', () => {
    // Heckbert's nice numbers: rough step 20 → 2×10¹
    expect(niceTicks(0, 100, 5)).toEqual([0, 20, 40, 60, 80, 100]);
    // rough step 0.1/4 = 0.025 → 2×10⁻², the multiples of 0.02 inside ±0.05
    expect(niceTicks(-0.05, 0.05, 4)).toEqual([-0.04, -0.02, 0, 0.02, 0.04]);
  });

  it('niceLogBound() rounds out to 1, 2 or 5 × 10ⁿ', () => {
    // the 1-2-5 series of round values per decade (common practice for log axes)
    expect(niceLogBound(0.0017, -1)).toBeCloseTo(0.001, 15);
    expect(niceLogBound(172, 1)).toBe(200);
    expect(niceLogBound(4.9, -1)).toBe(2);
    expect(niceLogBound(5.1, 1)).toBe(10);
  });

  it('installTickLabels() labels a marked log axis at 1, 2 and 5 × 10ⁿ only', () => {
    // the 1-2-5 series of round values per decade (common practice for log axes)
    const config = { options: { scales: { x: { ticks: { rfLabels: oneTwoFiveLabels } }, y: { ticks: {} } } } };
    const numeric = (value: number) => `<${value}>`;
    installTickLabels(config, { formatters: { numeric } });
    const label = (config.options.scales.x.ticks as { callback?: (value: number, index: number, all: unknown[]) => string }).callback!;
    const values = [0.1, 0.2, 0.3, 0.5, 0.6, 1, 2, 3, 5, 6, 7, 8, 9, 10, 20, 200, 400, 500, 1000];
    expect(values.filter((v) => label(v, 0, []) !== '')).toEqual([0.1, 0.2, 0.5, 1, 2, 5, 10, 20, 200, 500, 1000]);
    expect(label(0.2, 0, [])).toBe('<0.2>');
    // an unmarked axis keeps Chart.js's own labels; the exported report's script does the same
    expect(config.options.scales.y.ticks).toEqual({});
    expect(drawChartsSource).toContain(`rfLabels !== '${oneTwoFiveLabels}'`);
  });
});
