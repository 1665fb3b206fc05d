import type { FitResult } from '../core/fit/fit-result';
import { formatEstimate } from '../core/report/render-text';
import type { SurveyReport } from '../core/report/report';
import { formatNumber, surveyUnits, type SurveyUnitChoice } from '../core/units';
import { falloffChart } from './falloff-chart';
import { scanProfileChart } from './scan-profile-chart';
import { poseView } from './pose-view';
import { fieldMap } from './field-map';
import { chartFigure } from './figure';
import { html, type SafeHtml } from './html';
import { residualsChart } from './residuals-chart';
import { bestFit, rankedFits, type ModelLookup } from './survey-facts';
import { specNotMadeSection, thresholdSection, verdictSection } from './verdict-section';
import { frameParameters } from '../core/models/frame-parameters';

/** How many set-aside rows are listed in the page; the JSON export has every one. */
const rejectedListed = 200;

/**
 * One survey's report as HTML: provenance, verdict, the coil as fitted (parameters with
 * 95 % intervals), falloff and residual charts, field map, model comparison, threshold
 * distances, warnings, rows set aside and cautions; fields and lengths in the units the
 * survey's file was written in (surveyUnits). Every text from the file is escaped. `id` prefixes element ids so several surveys fit one page.
 */
export function renderSurveySection(survey: SurveyReport, lookup: ModelLookup, id: string): SafeHtml {
  const best = bestFit(survey);
  const units = surveyUnits(survey);
  const falloff = falloffChart(survey, lookup);
  const profile = scanProfileChart(survey, lookup);
  const residuals = residualsChart(survey, lookup);
  const map = fieldMap(survey, lookup);
  const pose = poseView(survey);
  const warnings = [...survey.warnings, ...survey.fits.flatMap((f) => f.warnings.map((w) => `${f.model}: ${w}`))];
  return html`<section class="rf-survey" id="${id}" aria-labelledby="${id}-heading">
<header class="rf-survey-head">
<h2 id="${id}-heading">${survey.coil === null ? 'Coil (no id in the file)' : html`Coil <span class="rf-coil-id">${survey.coil}</span>`}${survey.date ? html` <span class="rf-date">${survey.date}</span>` : ''}</h2>
<dl class="rf-facts">
<div><dt>file</dt><dd>${survey.source}</dd></div>
<div><dt>detector</dt><dd>${survey.readingType ?? 'not stated'}</dd></div>
<div><dt>rows used</dt><dd>${survey.readings.used} of ${survey.readings.total}</dd></div>
${units.units ? html`<div><dt>units</dt><dd>${units.units.field}, ${units.units.distance} (as in the file)</dd></div>` : ''}
<div><dt>best model</dt><dd>${survey.best ?? 'none converged'}</dd></div>
</dl>
</header>
${survey.notes.length > 0 ? html`<ul class="rf-import-notes">${survey.notes.map((n) => html`<li>${n}</li>`)}</ul>` : ''}
${survey.spec?.applied === false ? specNotMadeSection(survey.spec) : ''}
${survey.verdict ? verdictSection(survey.verdict, survey.spec ?? null, units) : ''}
${best ? parameterBlock(best, lookup, 'The coil as fitted', units) : html`<p class="rf-empty">${survey.fits.some((fit) => fit.converged) ? 'No model can be ranked (too few readings); the warnings below say why.' : 'No model converged; the warnings below say why.'}</p>`}
${profile ? chartFigure(`${id}-scan`, 'Falloff along the scan: field against position on the ruler', profile) : ''}
${falloff ? chartFigure(`${id}-falloff`, profile ? 'Falloff from the coil\'s datum: both sides folded onto one axis' : 'Falloff: field against distance', falloff) : html`<p class="rf-empty">No falloff chart: no reading at a positive distance with a positive field.</p>`}
${residuals ? chartFigure(`${id}-residuals`, 'Residuals: what each model leaves over', residuals) : ''}
${'svg' in map
    ? html`<figure class="rf-figure rf-map" aria-labelledby="${id}-map-title"><figcaption id="${id}-map-title" class="rf-figure-title">Field around the coil (plane through the axis)</figcaption><div class="rf-canvas-box">${map.svg}</div>${map.notes.map((n) => html`<p class="rf-note">${n}</p>`)}</figure>`
    : html`<p class="rf-empty">${map.reason}</p>`}
${pose ? html`<figure class="rf-figure rf-map" aria-labelledby="${id}-pose-title"><figcaption id="${id}-pose-title" class="rf-figure-title">Where the coil sits in the map</figcaption><div class="rf-canvas-box">${pose.svg}</div>${pose.notes.map((n) => html`<p class="rf-note">${n}</p>`)}</figure>` : ''}
${comparisonBlock(survey, lookup, units)}
${survey.thresholds.length > 0 ? thresholdSection(survey.thresholds, units) : ''}
${warnings.length > 0 ? html`<section class="rf-block rf-warnings"><h3>Warnings</h3><ul>${warnings.map((w) => html`<li>${w}</li>`)}</ul></section>` : ''}
${rejectedBlock(survey)}
${survey.cautions.length > 0 ? html`<section class="rf-block rf-cautions"><h3>Cautions</h3><ul>${survey.cautions.map((c) => html`<li>${c}</li>`)}</ul></section>` : ''}
</section>`;
}

/** Parameter table of one fit: value, 95 % interval, and what the parameter means. */
export function parameterBlock(fit: FitResult, lookup: ModelLookup, title: string, units: SurveyUnitChoice = surveyUnits(null)): SafeHtml {
  const model = lookup(fit.model);
  const describe = (name: string) => (frameParameters.find((p) => p.name === name) ?? model?.parameters.find((p) => p.name === name))?.description ?? '';
  const weight = fit.stats.akaikeWeight;
  return html`<section class="rf-block rf-params" data-model="${fit.model}"><h3>${title}: ${model?.label ?? fit.model}</h3>
<p class="rf-sub">${fit.converged ? 'converged' : 'did not converge'} (${fit.stopReason}) after ${fit.iterations} iterations${weight === null ? '' : `; Akaike weight ${formatNumber(weight, 3)}`}.
${fit.uncertaintyScale === 'estimated' ? ' Intervals use the scatter of the readings (no instrument uncertainty was given).' : ' Intervals use the stated reading uncertainties.'}</p>
<table class="rf-table"><thead><tr><th scope="col">parameter</th><th scope="col">value</th><th scope="col">95% interval</th><th scope="col">meaning</th></tr></thead>
<tbody>${Object.values(fit.params).map((estimate) => {
    const shown = formatEstimate(estimate, units);
    return html`<tr data-param="${estimate.name}" data-value="${String(estimate.value)}"><th scope="row">${estimate.name}</th><td class="rf-num">${shown.value}</td><td class="${estimate.determined || estimate.fixed ? 'rf-num' : 'rf-num rf-undetermined'}">${shown.interval}</td><td>${describe(estimate.name)}</td></tr>`;
  })}</tbody></table></section>`;
}

function comparisonBlock(survey: SurveyReport, lookup: ModelLookup, units: SurveyUnitChoice): SafeHtml | string {
  if (survey.fits.length === 0) return '';
  const ranked = rankedFits(survey);
  const minimum = Math.min(...ranked.filter((f) => f.converged && Number.isFinite(f.stats.aicc)).map((f) => f.stats.aicc));
  return html`<section class="rf-block rf-comparison"><h3>Models side by side</h3>
<p class="rf-sub">Same readings for every model. ΔAICc is the difference from the lowest AICc (small-sample Akaike criterion); the Akaike weight is each model's share of the evidence among these models.</p>
<table class="rf-table"><thead><tr><th scope="col">model</th><th scope="col">free parameters</th><th scope="col">RMS residual</th><th scope="col">reduced χ²</th><th scope="col">ΔAICc</th><th scope="col">Akaike weight</th></tr></thead>
<tbody>${ranked.map((fit) => html`<tr class="${fit.model === survey.best ? 'rf-best' : ''}"><th scope="row">${fit.model}${fit.model === survey.best ? ' (best)' : ''}</th><td class="rf-num">${fit.stats.k}</td><td class="rf-num">${units.format(fit.stats.rmse, 'field', { significant: 3 })}</td><td class="rf-num">${fit.stats.reducedChiSquare === null ? '—' : formatNumber(fit.stats.reducedChiSquare, 3)}</td><td class="rf-num">${!fit.converged ? `did not converge: ${fit.stopReason}` : Number.isFinite(fit.stats.aicc) ? formatNumber(fit.stats.aicc - minimum, 3) : 'too few readings'}</td><td class="rf-num">${fit.stats.akaikeWeight === null ? '—' : formatNumber(fit.stats.akaikeWeight, 3)}</td></tr>`)}</tbody></table>
${survey.comparison.map((sentence) => html`<p>${sentence}</p>`)}
${ranked.filter((fit) => fit.model !== survey.best).length > 0
    ? html`<details class="rf-other-fits"><summary>Parameters of the other models</summary>${ranked.filter((fit) => fit.model !== survey.best).map((fit) => parameterBlock(fit, lookup, 'Model', units))}</details>`
    : ''}
</section>`;
}

function rejectedBlock(survey: SurveyReport): SafeHtml | string {
  const rows = survey.readings.rejected;
  if (rows.length === 0) return '';
  return html`<section class="rf-block rf-rejected"><h3>Rows not used (${rows.length})</h3>
<table class="rf-table"><thead><tr><th scope="col">line</th><th scope="col">column</th><th scope="col">cell</th><th scope="col">reason</th></tr></thead>
<tbody>${rows.slice(0, rejectedListed).map((row) => html`<tr><td class="rf-num">${row.line}</td><td>${row.column ?? '—'}</td><td><code>${row.value ?? ''}</code></td><td>${row.reason}</td></tr>`)}</tbody></table>
${rows.length > rejectedListed ? html`<p class="rf-note">${rows.length - rejectedListed} more rows are listed in the JSON export.</p>` : ''}
</section>`;
}
