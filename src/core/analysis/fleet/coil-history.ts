import type { FitResult, ParameterEstimate } from '../../fit/fit-result';
import { getModel } from '../../models';
import type { ModelId } from '../../models/field-model';
import { studentTQuantile } from '../../stats';
import type { RelativePlusAbsolute } from '../../units';
import { yearsBetween } from '../../units/julian-year';
import { bestPhysicalFit, convergedFit } from '../best-fit';
import type { CheckStatus } from '../decide-conformity';
import { describeValue } from '../describe-value';
import { parameterRole } from '../parameter-roles';
import { selectSpec } from '../spec/select-spec';
import type { Spec } from '../spec/spec';
import type { FleetSurvey } from './fleet-survey';
import { geometryChanges } from './geometry-changes';
import { readTrend, trendWords } from './trend-reading';
import { weightedLine } from './weighted-line';

/** One survey's place in a coil's history (fleet section). */
export interface FleetEntry {
  readonly source: string;
  readonly date: string | null;
  /** Fitted ampere-turns with 95 % interval (A), null when not fitted or not determined. */
  readonly ampereTurns: { readonly value: number; readonly unit: 'A'; readonly ci95: readonly [number, number] | null } | null;
  /** Fitted geometry parameters (m) with 95 % intervals. */
  readonly geometry: Readonly<Record<string, { readonly value: number; readonly unit: 'm'; readonly ci95: readonly [number, number] | null }>>;
  /** ampereTurns / reference, with interval, or null. */
  readonly ratioToReference: { readonly value: number; readonly ci95: readonly [number, number] | null } | null;
  readonly verdict: CheckStatus | null;
}

/** One coil across its surveys (CONTRACT.md fleet section; extra fields are additions). */
export interface FleetCoil {
  readonly coil: string;
  readonly surveys: number;
  /** Date of the latest dated survey, or null. */
  readonly latest: string | null;
  /** 'degrading', 'geometry-changed', 'failed-spec', … */
  readonly flags: readonly string[];
  readonly trend: {
    readonly ampereTurnsPerYear: { readonly value: number; readonly unit: 'A/yr'; readonly ci95: readonly [number, number] } | null;
    /** What the trend says (trend-reading.ts): declining, rising, steady (inside ±steadyBand), or undetermined. */
    readonly status: 'declining' | 'rising' | 'steady' | 'undetermined';
    /** The reference's tolerance per year: a trend inside ±this is steady; null without a trend. */
    readonly steadyBand: { readonly value: number; readonly unit: 'A/yr' } | null;
    /** For an undetermined trend, how many more surveys at the same interval and precision would decide; else null. */
    readonly moreSurveys: number | null;
  };
  /** The model whose parameters are trended. */
  readonly model: ModelId | null;
  /** What the history is compared with: the spec's label or the first survey. */
  readonly reference: { readonly kind: 'spec' | 'first-survey'; readonly ampereTurns: number; readonly unit: 'A' } | null;
  /** Surveys in date order (undated last). */
  readonly history: readonly FleetEntry[];
  /** One sentence per flag with the numbers, and what was left out and why. */
  readonly explanations: readonly string[];
}

const normal975 = 1.959963984540054;

/**
 * One coil's history: surveys in date order (undated last), the fitted ampere-turns of the
 * trended model (the spec's, else the most common best physical model) against the spec's
 * label or the first survey, and a weighted straight-line trend of ampere-turns against
 * time in Julian years (units/julian-year.ts; weightedLine; 95 % interval with t_{n−2}, or 1.96 for two surveys).
 * Flags: **degrading** when the latest dated survey's decline from the reference is
 * significant and beyond tolerance — the upper end of its 95 % interval (against a first
 * survey: of the difference, t with the smaller degrees of freedom) lies below the
 * reference less the tolerance, the same guarded rule as a failed spec check; a sudden drop
 * counts as well as a steady one, and the trend is reported beside it;
 * **geometry-changed** (geometryChanges); **failed-spec** when the latest survey failed
 * its spec.
 */
export function coilHistory(coil: string, surveys: readonly FleetSurvey[], specs: readonly Spec[], defaultTolerance: RelativePlusAbsolute): FleetCoil {
  // date order, undated last; on one date, by file name then order in the file (a stated
  // rule, so the order never depends on which worker finished first)
  const ordered = surveys
    .map((survey, index) => ({ survey, index }))
    .sort((a, b) => (a.survey.date === null ? 1 : 0) - (b.survey.date === null ? 1 : 0)
      || (a.survey.date ?? '').localeCompare(b.survey.date ?? '')
      || (a.survey.source < b.survey.source ? -1 : a.survey.source > b.survey.source ? 1 : 0)
      || a.index - b.index)
    .map(({ survey }) => survey);
  const spec = selectSpec(specs, coil);
  const model = spec?.model ?? commonModel(ordered);
  const fits = ordered.map((s) => (model === null ? null : convergedFit(s.fits, model)));
  const explanations: string[] = [];
  const labelTurns = spec?.params.find((p) => p.name === 'ampereTurns');
  const baseline = baselineOf(ordered, fits);
  const reference = labelTurns
    ? { kind: 'spec' as const, ampereTurns: labelTurns.value, unit: 'A' as const }
    : baseline ? { kind: 'first-survey' as const, ampereTurns: baseline.value, unit: 'A' as const } : null;
  const tolerance = labelTurns?.tolerance ?? defaultTolerance;
  const history: FleetEntry[] = ordered.map((survey, i) => entryOf(survey, fits[i] ?? null, reference?.ampereTurns ?? null));

  const dated = ordered.flatMap((survey, i) => {
    const estimate = usable(fits[i]?.params['ampereTurns']);
    return survey.date !== null && estimate !== null && !Number.isNaN(Date.parse(survey.date)) ? [{ survey, estimate, fit: fits[i]! }] : [];
  });
  const undated = ordered.filter((s) => s.date === null).length;
  if (reference?.kind === 'first-survey' && baseline !== null && baseline.surveys > 1) {
    explanations.push(`baseline: the ${baseline.surveys} surveys of ${baseline.date}, the earliest date, combined by inverse-variance weight (${describeValue(baseline.value, 'current', [baseline.value - normal975 * baseline.stderr, baseline.value + normal975 * baseline.stderr])}).`);
  }
  if (undated > 0) explanations.push(`${undated} survey(s) without a date are listed last and left out of the trend.`);
  if (model === null) explanations.push('No physical model converged on any survey, so there is nothing to trend.');
  let trend: FleetCoil['trend'] = { ampereTurnsPerYear: null, status: 'undetermined', steadyBand: null, moreSurveys: null };
  const flags: string[] = [];
  const times = dated.map((d) => yearsBetween(dated[0]!.survey.date!, d.survey.date!));
  let trendSentence: string | null = null;
  if (dated.length >= 2 && new Set(times).size >= 2) {
    const line = weightedLine(times, dated.map((d) => d.estimate.value), dated.map((d) => d.estimate.stderr));
    const q = line.degreesOfFreedom > 0 ? studentTQuantile(0.975, line.degreesOfFreedom) : normal975;
    const ci95: [number, number] = [line.slope - q * line.slopeStandardError, line.slope + q * line.slopeStandardError];
    const referenceTurns = reference?.ampereTurns ?? dated[0]!.estimate.value;
    const band = tolerance.relative * Math.abs(referenceTurns) + tolerance.absolute;
    const reading = readTrend(line.slope, ci95, band, dated.length);
    trend = { ampereTurnsPerYear: { value: line.slope, unit: 'A/yr', ci95 }, status: reading.status, steadyBand: { value: band, unit: 'A/yr' }, moreSurveys: reading.moreSurveys };
    trendSentence = `ampere-turns change ${describeValue(line.slope, 'current', ci95)} per year over ${dated.length} dated surveys: ${trendWords(reading, (rate) => describeValue(rate, 'current'))}`;
  } else if (model !== null) {
    explanations.push(`trend undetermined: ${dated.length === 0 ? 'no dated survey has' : 'only one dated survey has'} determined ampere-turns; a trend needs surveys on at least two dates.`);
  }
  // The decline that matters: the latest survey against the reference, significant and beyond tolerance.
  const latest = [...dated].reverse()[0] ?? null;
  if (reference && latest && (reference.kind === 'spec' || (baseline !== null && latest.survey.date !== baseline.date))) {
    const limit = reference.ampereTurns - (tolerance.relative * Math.abs(reference.ampereTurns) + tolerance.absolute);
    const latestHigh = reference.kind === 'first-survey' ? upperOfDifference(latest, baseline!) + reference.ampereTurns : latest.estimate.ci95[1];
    const against = `${reference.kind === 'spec' ? 'the label\'s' : 'the first survey\'s'} ${describeValue(reference.ampereTurns, 'current')}`;
    const latestText = `the latest (${latest.survey.date}) ${describeValue(latest.estimate.value, 'current', latest.estimate.ci95)}`;
    if (latestHigh < limit) {
      flags.push('degrading');
      explanations.push(`degrading: ${latestText} lies, with its whole interval, below ${against} less the tolerance (${describeValue(limit, 'current')})${trendSentence ? `; ${trendSentence}` : ''}.`);
    } else if (trendSentence) {
      explanations.push(`${trendSentence}; ${latestText} is not below ${against} by more than the tolerance with 95 % confidence (limit ${describeValue(limit, 'current')}).`);
    }
  } else if (trendSentence) {
    explanations.push(`${trendSentence}.`);
  }
  const changes = geometryChanges(ordered, fits, spec, defaultTolerance);
  if (changes.length > 0) {
    flags.push('geometry-changed');
    explanations.push(...changes);
  }
  const last = ordered[ordered.length - 1];
  if (last?.verdict?.status === 'fail') {
    flags.push('failed-spec');
    explanations.push(`failed-spec: the latest survey (${last.source}) failed its spec${last.verdict.findings.length ? ` (${last.verdict.findings.join(', ')})` : ''}.`);
  }
  const latestDate = [...ordered].reverse().find((s) => s.date !== null)?.date ?? null;
  return { coil, surveys: ordered.length, latest: latestDate, flags, trend, model, reference, history, explanations };
}

/** An estimate with a positive standard error and an interval, or null. */
function usable(estimate: ParameterEstimate | undefined): { value: number; stderr: number; ci95: readonly [number, number]; name: string } | null {
  if (!estimate || estimate.fixed || !estimate.determined || estimate.ci95 === null || !(estimate.stderr! > 0)) return null;
  return { value: estimate.value, stderr: estimate.stderr!, ci95: estimate.ci95, name: estimate.name };
}

/** Upper 95 % bound of (latest − baseline), t with the smallest degrees of freedom of the fits involved (conservative). */
function upperOfDifference(latest: { estimate: { value: number; stderr: number }; fit: FitResult }, baseline: Baseline): number {
  const nu = Math.max(1, Math.min(latest.fit.stats.n - latest.fit.stats.k, baseline.degreesOfFreedom));
  return latest.estimate.value - baseline.value + studentTQuantile(0.975, nu) * Math.hypot(latest.estimate.stderr, baseline.stderr);
}

/** The history's baseline: the surveys of the earliest date with determined ampere-turns, combined. */
interface Baseline {
  readonly date: string;
  readonly value: number;
  readonly stderr: number;
  readonly surveys: number;
  /** The smallest n − k among the baseline's fits. */
  readonly degreesOfFreedom: number;
}

/**
 * The baseline a coil without a label is compared with: every survey of the earliest date
 * that has determined ampere-turns, combined by inverse-variance weight (value Σwᵢxᵢ/Σwᵢ,
 * standard error 1/√Σwᵢ, wᵢ = 1/σᵢ²), so two surveys on one day count alike whatever
 * their file names. Null when no dated survey has determined ampere-turns.
 */
function baselineOf(ordered: readonly FleetSurvey[], fits: readonly (FitResult | null)[]): Baseline | null {
  const candidates = ordered.flatMap((survey, i) => {
    const estimate = usable(fits[i]?.params['ampereTurns']);
    return survey.date !== null && !Number.isNaN(Date.parse(survey.date)) && estimate !== null ? [{ date: survey.date, estimate, fit: fits[i]! }] : [];
  });
  const first = candidates[0];
  if (first === undefined) return null;
  const sameDay = candidates.filter((c) => c.date === first.date);
  let sumW = 0;
  let sumWx = 0;
  for (const c of sameDay) {
    const w = 1 / c.estimate.stderr ** 2;
    sumW += w;
    sumWx += w * c.estimate.value;
  }
  return {
    date: first.date,
    value: sumWx / sumW,
    stderr: 1 / Math.sqrt(sumW),
    surveys: sameDay.length,
    degreesOfFreedom: Math.min(...sameDay.map((c) => c.fit.stats.n - c.fit.stats.k)),
  };
}

function entryOf(survey: FleetSurvey, fit: FitResult | null, reference: number | null): FleetEntry {
  const turns = fit?.params['ampereTurns'];
  const geometry: Record<string, { value: number; unit: 'm'; ci95: readonly [number, number] | null }> = {};
  for (const estimate of Object.values(fit?.params ?? {})) {
    if (parameterRole(estimate.name) === 'geometry') geometry[estimate.name] = { value: estimate.value, unit: 'm', ci95: estimate.ci95 };
  }
  return {
    source: survey.source,
    date: survey.date,
    ampereTurns: turns ? { value: turns.value, unit: 'A', ci95: turns.ci95 } : null,
    geometry,
    ratioToReference: turns && reference ? { value: turns.value / reference, ci95: turns.ci95 ? [turns.ci95[0] / reference, turns.ci95[1] / reference] : null } : null,
    verdict: survey.verdict?.status ?? null,
  };
}

/** The physical model that is best most often across the surveys (ties: the earliest survey's). */
function commonModel(surveys: readonly FleetSurvey[]): ModelId | null {
  const counts = new Map<ModelId, number>();
  for (const survey of surveys) {
    const best = bestPhysicalFit(survey.fits, getModel);
    if (best) counts.set(best.model, (counts.get(best.model) ?? 0) + 1);
  }
  let chosen: ModelId | null = null;
  for (const [model, count] of counts) if (chosen === null || count > counts.get(chosen)!) chosen = model;
  return chosen;
}

