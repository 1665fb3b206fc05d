import type { SpecCheck, SpecUse, ThresholdResult, Verdict } from '../core/report/report';
import { formatNumber, formatQuantity, surveyUnits, type DisplayUnit, type SurveyUnitChoice } from '../core/units';
import { html, type SafeHtml } from './html';

const statusWords: Readonly<Record<SpecCheck['status'], string>> = {
  pass: 'meets the spec',
  fail: 'does not meet the spec',
  inconclusive: 'cannot be decided from these readings',
};

/** A spec was given but none applies to this survey's coil: said plainly, never left out. */
export function specNotMadeSection(spec: SpecUse): SafeHtml {
  return html`<section class="rf-block rf-verdict rf-spec-not-made"><h3>Spec check not made</h3><p>${spec.reason ?? `No spec in ${spec.source} applies to this coil.`}</p></section>`;
}

/**
 * The spec verdict: status in words, which spec and model it used and the decision rule,
 * findings, each check with its evidence sentence.
 */
export function verdictSection(verdict: Verdict, spec: SpecUse | null = null, units: SurveyUnitChoice = surveyUnits(null)): SafeHtml {
  const shown = (value: number, unit: string) => quantity(value, unit, units);
  const basis = [
    spec?.applied === true ? `Checked against ${spec.source}` : null,
    verdict.model ? `with the ${verdict.model} model` : null,
  ].filter((part) => part !== null).join(' ');
  return html`<section class="${`rf-block rf-verdict rf-status-${verdict.status}`}"><h3>Verdict: <span class="${`rf-status rf-status-${verdict.status}`}">${verdict.status}</span> — the coil ${statusWords[verdict.status]}</h3>
${basis !== '' ? html`<p class="rf-sub rf-verdict-basis">${basis}.</p>` : ''}
${verdict.rule ? html`<p class="rf-sub rf-verdict-rule">Rule: ${verdict.rule}</p>` : ''}
${verdict.findings.length > 0 ? html`<p class="rf-findings">Findings: ${verdict.findings.map((f, i) => html`${i > 0 ? ', ' : ''}<strong>${f}</strong>`)}</p>` : ''}
${verdict.explanations.map((sentence) => html`<p>${sentence}</p>`)}
${verdict.checks.length > 0 ? html`<table class="rf-table rf-checks"><thead><tr><th scope="col">check</th><th scope="col">result</th><th scope="col">expected</th><th scope="col">measured (95% interval)</th></tr></thead>
${verdict.checks.map((check) => html`<tbody class="rf-check"><tr><th scope="row">${check.what}</th><td><span class="${`rf-status rf-status-${check.status}`}">${check.status}</span></td><td class="rf-num">${shown(check.expected.value, check.expected.unit)}${tolerance(check, shown)}</td><td class="rf-num">${shown(check.measured.value, check.measured.unit)}${check.measured.ci95 ? html`<br><span class="rf-sub">${shown(check.measured.ci95[0], check.measured.unit)} to ${shown(check.measured.ci95[1], check.measured.unit)}</span>` : ''}</td></tr>
<tr class="rf-evidence"><td colspan="4">${check.evidence}</td></tr></tbody>`)}</table>` : ''}
</section>`;
}

function tolerance(check: SpecCheck, quantity: (value: number, unit: string) => string): string {
  const parts: string[] = [];
  if (check.tolerance.relative > 0) parts.push(`${formatNumber(check.tolerance.relative * 100, 3)}%`);
  if (check.tolerance.absolute > 0) parts.push(quantity(check.tolerance.absolute, check.expected.unit));
  return parts.length > 0 ? ` ± ${parts.join(' + ')}` : '';
}

/** Lengths of a survey whose units are not known are shown in mm. */
const millimetres: DisplayUnit = { symbol: 'mm', factor: 1e-3 };

/** An SI value of T or m in the survey's unit (surveyUnits; mm for a length when not known), A in a sensible unit; as given otherwise. */
export function quantity(value: number, unit: string, units: SurveyUnitChoice = surveyUnits(null)): string {
  if (unit === 'T') return units.format(value, 'field', { significant: 4 });
  if (unit === 'm') return units.format(value, 'length', { significant: 4, fallback: millimetres });
  if (unit === 'A') return formatQuantity(value, 'current', { significant: 4 });
  return `${formatNumber(value, 4)}${unit && unit !== '1' ? ' ' + unit : ''}`;
}

/**
 * Threshold distances: per level the best physical model's distance with its 95 %
 * interval, beside what inverse-square and the fitted power law would say and their
 * ratios to it; extrapolations are marked; then the notes and the level's source.
 */
export function thresholdSection(thresholds: readonly ThresholdResult[], units: SurveyUnitChoice = surveyUnits(null)): SafeHtml {
  const mm = (value: number) => quantity(value, 'm', units);
  const beyond = html`<br><span class="rf-flag">beyond the surveyed range</span>`;
  const naiveCell = (distance: { value: number } | null | undefined, ratio: number | null | undefined, extrapolated: boolean | undefined, label: string) =>
    distance ? html`${mm(distance.value)} ${label}${ratio !== null && ratio !== undefined ? html`<br><span class="rf-sub">${formatNumber(ratio, 3)}× the model's</span>` : ''}${extrapolated ? beyond : ''}` : '—';
  return html`<section class="rf-block rf-thresholds"><h3>Where the field falls below a level</h3>
<p class="rf-sub">On the coil axis, from the datum to the field point, compared with the survey's detector type.</p>
<table class="rf-table"><thead><tr><th scope="col">level</th><th scope="col">coil model: distance (95% interval)</th><th scope="col">inverse square says</th><th scope="col">fitted power law says</th></tr></thead>
<tbody>${thresholds.map((t) => {
    const distance = t.distance;
    const naive = t.naive;
    const power = t.powerLaw ?? null;
    const naiveRatio = naive?.ratio ?? (distance && naive?.distance && distance.value > 0 ? naive.distance.value / distance.value : null);
    return html`<tr><th scope="row">${units.format(t.level.value, 'field', { significant: 3 })}${t.level.label ? html`<br><span class="rf-sub">${t.level.label}</span>` : ''}</th>
<td class="rf-num">${t.model}: ${distance ? mm(distance.value) : 'not reached'}${distance?.ci95 ? html`<br><span class="rf-sub">${mm(distance.ci95[0])} to ${mm(distance.ci95[1])}${t.intervalMethod === 'monte-carlo' ? ' (Monte Carlo)' : ''}</span>` : ''}${t.extrapolated ? beyond : ''}</td>
<td class="rf-num">${naiveCell(naive?.distance, naiveRatio, naive?.extrapolated, '')}</td>
<td class="rf-num">${power ? naiveCell(power.distance, power.ratio, power.extrapolated, `(n = ${formatNumber(power.exponent, 3)})`) : '—'}</td></tr>`;
  })}</tbody></table>
${thresholds.flatMap((t) => t.notes).filter((note, i, all) => all.indexOf(note) === i).map((note) => html`<p class="rf-note">${note}</p>`)}
</section>`;
}
