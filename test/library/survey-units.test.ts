/**
 * Reports in the survey's own units: a survey logged in gauss and inches reads in G and
 * in (text, HTML, the spec check's sentences), one logged in mT and mm in mT and mm, and
 * the JSON report stays SI with the file's units beside the values.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyseSurvey } from '../../src/core/report/analyse-survey';
import { fromJsonReport } from '../../src/core/report/from-json-report';
import { renderTextReport } from '../../src/core/report/render-text';
import type { SurveyReport } from '../../src/core/report/report';
import { toJsonReport } from '../../src/core/report/to-json-report';
import type { Survey } from '../../src/core/survey/survey';
import { importSurveys, type ImportOptions } from '../../src/io';
import { parseSpecs } from '../../src/io/spec/parse-specs';
import { parseThresholdLevel } from '../../src/core/analysis/thresholds/threshold-level';
import { catalogLookup, renderSurveySection } from '../../src/render';
import { expectClose } from '../support/expect-close';
import { schemaErrors } from '../support/json-schemas';

// 1 G = 1e-4 T exactly, so 1 mT = 10 G (SI Brochure, 9th ed., Table 8, non-SI units)
const gaussPerMillitesla = 10;
// 1 in = 25.4 mm exactly (international yard and pound agreement, 1959)
const millimetresPerInch = 25.4;

const healthy = 'sample-data/qa-107-2025-03-11-healthy.csv';
const specs = parseSpecs(readFileSync('sample-data/specs/qa-107.spec.json', 'utf8'), 'qa-107.spec.json');

/** The healthy sample as logged (mT, mm), and the same readings as a gauss and inch meter would log them. */
function surveys(): { metric: Survey; imperial: Survey } {
  const text = readFileSync(healthy, 'utf8');
  const lines = text.split(/\r?\n/);
  const header = lines.findIndex((line) => line.startsWith('distance'));
  const converted = lines.map((line, i) => {
    if (i < header || line.trim() === '') return line;
    if (i === header) return 'distance (in),B (G)';
    const [distance, field] = line.split(',');
    return `${(Number(distance) / millimetresPerInch).toPrecision(12)},${(Number(field) * gaussPerMillitesla).toPrecision(12)}`;
  }).join('\n');
  return { metric: one(text, { source: healthy }), imperial: one(converted, { source: 'qa-107 in gauss and inches' }) };
}

function one(text: string, options: ImportOptions): Survey {
  const [survey] = importSurveys(text, options).surveys;
  return survey!;
}

function analyse(survey: Survey): SurveyReport {
  return analyseSurvey(survey, { fit: { models: ['loop', 'inverse-square'] }, specs, thresholds: [parseThresholdLevel('0.5 mT')] });
}

/** The number in front of `unit` on the report line that starts with `label`. */
function numberOn(text: string, label: RegExp, unit: string): number {
  const line = text.split('\n').find((l) => label.test(l));
  expect(line, `a line matching ${label}`).toBeDefined();
  const match = new RegExp(`(-?[0-9.]+) ${unit}(?![A-Za-z])`).exec(line!);
  expect(match, `"${unit}" on "${line}"`).not.toBeNull();
  return Number(match![1]);
}

describe('reports in the survey\'s own units', () => {
  it('the importer records the units of the file\'s columns, from the header, an option or a hand mapping', () => {
    const { metric, imperial } = surveys();
    expect(metric.units).toEqual({ field: 'mT', distance: 'mm' });
    expect(imperial.units).toEqual({ field: 'G', distance: 'in' });
    // the mislabeled sample's header is "distance_mm,field_G"
    expect(one(readFileSync('sample-data/qa-214-2026-02-17-mislabeled.csv', 'utf8'), { source: 'qa-214' }).units).toEqual({ field: 'G', distance: 'mm' });
    const bare = 'distance,B\n1,20\n2,15\n3,11\n4,8\n';
    expect(one(bare, { source: 'bare', fieldUnit: 'uT', distanceUnit: 'cm' }).units).toEqual({ field: '\u00b5T', distance: 'cm' });
    const mapped = one(bare, { source: 'mapped', mapping: [{ column: 0, role: 'distance', unit: 'in' }, { column: 'B', role: 'field', unit: 'G' }] });
    expect(mapped.units).toEqual({ field: 'G', distance: 'in' });
    // components: the unit of the Bx, By, Bz columns
    expect(one(readFileSync('sample-data/qa-330-2026-03-02-offaxis-grid.csv', 'utf8'), { source: 'qa-330' }).units).toEqual({ field: 'mT', distance: 'mm' });
  });

  it('a survey logged in gauss and inches reads in G and in: the text report\'s numbers are the mT/mm report\'s converted', () => {
    const { metric, imperial } = surveys();
    const mm = renderTextReport({ surveys: [analyse(metric)] });
    const inch = renderTextReport({ surveys: [analyse(imperial)] });
    // 4 significant digits either side: the converted value agrees to the rounding of both (± half a unit in the 4th digit)
    const radiusMm = numberOn(mm, /^ {2}radius /, 'mm');
    expectClose(numberOn(inch, /^ {2}radius /, 'in'), radiusMm / millimetresPerInch, { rel: 1e-3 });
    expectClose(numberOn(inch, /^ {2}probeOffset /, 'in'), numberOn(mm, /^ {2}probeOffset /, 'mm') / millimetresPerInch, { rel: 2e-3 });
    expectClose(numberOn(inch, /^ {2}background /, 'G'), numberOn(mm, /^ {2}background /, 'mT') * gaussPerMillitesla, { rel: 2e-3 });
    expectClose(numberOn(inch, /^ {2}\* loop /, 'G'), numberOn(mm, /^ {2}\* loop /, 'mT') * gaussPerMillitesla, { rel: 5e-3 });
    // currents are no unit of the meter's: the same in both
    expect(numberOn(inch, /^ {2}ampereTurns /, 'A')).toBe(numberOn(mm, /^ {2}ampereTurns /, 'A'));
    // the threshold level 0.5 mT = 5 G and its distance in inches
    expect(inch).toMatch(/^ {2}5\.00 G +[0-9.]+ in +[0-9.]+ to [0-9.]+ in/m);
    expectClose(numberOn(inch, /^ {2}5\.00 G /, 'in'), numberOn(mm, /^ {2}0\.500 mT /, 'mm') / millimetresPerInch, { rel: 5e-3 });
    // the spec check's sentences: the label's 45 mm radius = 1.77 in, the claimed 5 mT = 50.0 G
    expect(inch).toMatch(/radius [0-9.]+ in \([0-9.]+–[0-9.]+\) vs 1\.77 in ± 10 % on the label/);
    expect(inch).toMatch(/vs 50\.0 G ± 15 % claimed/);
    // no metric value left above the fixed cautions, but for the checks' names, which keep the spec's words ("field at 50.0 mm from the surface")
    expect(inch.slice(0, inch.indexOf('Cautions'))).not.toMatch(/ mT\b|[0-9] mm\b(?! from the)/);
  });

  it('an mT/mm survey reads in mT and mm, as its file was written', () => {
    const mm = renderTextReport({ surveys: [analyse(surveys().metric)] });
    expect(mm).toMatch(/^ {2}radius +4[0-9.]+ mm +[0-9.]+ to [0-9.]+ mm$/m);
    expect(mm).toMatch(/^ {2}background +[0-9.]+ mT/m);
    expect(mm).toMatch(/vs 5\.00 mT ± 15 % claimed/);
    expect(mm.slice(0, mm.indexOf('Cautions'))).not.toMatch(/[0-9] (G|in|µT)\b/);
  });

  it('the HTML section of a gauss and inch survey shows G and in, its parameter values stay SI in the markup', () => {
    const report = analyse(surveys().imperial);
    const section = String(renderSurveySection(report, catalogLookup, 'survey-1'));
    expect(section).toContain('<dt>units</dt><dd>G, in (as in the file)</dd>');
    const radius = /<tr data-param="radius" data-value="([^"]+)"><th scope="row">radius<\/th><td class="rf-num">([0-9.]+) in<\/td>/.exec(section);
    expect(radius).not.toBeNull();
    expectClose(Number(radius![2]), Number(radius![1]) * 1000 / millimetresPerInch, { rel: 1e-3 });
    expect(section).toMatch(/<td class="rf-num">[0-9.]+ G<\/td>/);
    // chart axes in the file's units
    expect(section).toContain('distance from datum to sensing point (in)');
    expect(section).toContain('field |B| (G)');
  });

  it('the JSON report keeps SI values and names the file\'s units; a saved report reads them back', () => {
    const { metric, imperial } = surveys();
    const [si, converted] = [analyse(metric), analyse(imperial)].map((survey) => toJsonReport({ surveys: [survey] }));
    expect(converted!.surveys[0]!.units).toEqual({ field: 'G', distance: 'in' });
    expect(si!.surveys[0]!.units).toEqual({ field: 'mT', distance: 'mm' });
    // the same readings in other units: the same SI results (the inch values carry 12 digits)
    const radius = (json: typeof si) => json!.surveys[0]!.fits.find((fit) => fit.model === 'loop')!.params['radius']!.value!;
    expectClose(radius(converted), radius(si), { rel: 1e-6 });
    expect(radius(si)).toBeLessThan(0.1);
    const json = JSON.parse(JSON.stringify(converted)) as Record<string, unknown>;
    expect(schemaErrors('report', json)).toEqual([]);
    const back = fromJsonReport(json, 'saved.json');
    expect(back.surveys[0]!.units).toEqual({ field: 'G', distance: 'in' });
    // a unit the schema does not know is refused by it
    const surveysJson = json['surveys'] as Record<string, unknown>[];
    expect(schemaErrors('report', { ...json, surveys: [{ ...surveysJson[0]!, units: { field: 'Oe', distance: 'in' } }] })).not.toEqual([]);
  });
});
