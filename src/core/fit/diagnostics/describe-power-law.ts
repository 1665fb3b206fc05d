import type { FieldModel, ModelId, SurveyPoints } from '../../models/field-model';
import { logLogLine } from '../../numeric/log-log-line';
import { formatNumber } from '../../units/format-quantity';
import { surveyUnits, type DisplayUnit, type SurveyUnitChoice } from '../../units/survey-units';
import type { FitResult } from '../fit-result';
import { runsTest } from './runs-test';

/** Runs-test probability below which the residuals count as systematic (common practice). */
const systematic = 0.05;

/**
 * One sentence on what a descriptive power-law fit gets wrong (DOMAIN.md §1.9): the
 * apparent exponent over the surveyed distances (minus the least-squares slope of ln|B|
 * on ln d over readings with d > 0: "apparent exponent 1.62 over 5–200 mm") beside the
 * law's own (fitted or assumed) exponent,
 * where its residuals go systematic (residual signs ordered by distance: a runs test,
 * runs-test.ts, and which side of the readings the curve runs on among the nearest and
 * farthest third), and how it would misjudge extrapolation: its coil field (background
 * left out) at twice the farthest distance against the best physical model's.
 *
 * @param physical the best converged physical fit, or null; modelOf the catalog lookup.
 */
export function describePowerLaw(
  fit: FitResult, physical: FitResult | null, modelOf: (id: ModelId) => FieldModel, shared: PowerLawContext = powerLawContext(fit, physical, modelOf),
): string {
  const { order, line, range, farthest } = shared;
  const exponent = fit.params['exponent'];
  const assumed = fit.model === 'inverse-square' ? 2 : fit.model === 'inverse-cube' ? 3 : null;
  const own = exponent
    ? `its fitted exponent is ${formatNumber(exponent.value, 3)}` + (exponent.ci95 ? ` (95 % ${formatNumber(exponent.ci95[0], 3)} to ${formatNumber(exponent.ci95[1], 3)})` : '')
    : `it assumes ${assumed ?? 'a fixed exponent'}`;
  const head = line === null
    ? `${fit.model} (${own} over ${range})`
    : `${fit.model} (the readings' apparent exponent is ${formatNumber(-line.slope, 3)} over ${range}; ${own})`;
  const residuals = order.map((i) => fit.points[i]!.residual);
  const runs = runsTest(residuals);
  let pattern: string;
  if (runs.probability < systematic) {
    const third = Math.max(1, Math.floor(order.length / 3));
    pattern = `its residuals go systematic — ${runs.runs} runs of same-sign residuals by distance where ${formatNumber(runs.expected, 2)} are expected by chance (runs test p = ${formatNumber(runs.probability, 2)}); ` +
      `the curve runs ${side(residuals.slice(0, third), 'nearest')} and ${side(residuals.slice(-third), 'farthest')}`;
  } else {
    pattern = `its residuals show no systematic runs over this range (runs test p = ${formatNumber(runs.probability, 2)})`;
  }

  let extrapolation = '';
  if (physical !== null && farthest > 0) {
    const at = 2 * farthest;
    const power = coilField(fit, modelOf, at);
    const coil = shared.physicalField;
    if (Number.isFinite(power) && Number.isFinite(coil) && coil !== 0) {
      const ratio = power / coil;
      const verdict = ratio >= 1 ? `${formatNumber(ratio, 3)}× too high` : `${formatNumber((1 - ratio) * 100, 2)} % too low`;
      const field = (value: number) => shared.units.format(Math.abs(value), 'field', { significant: 3 });
      extrapolation = `; extrapolated to ${inUnit(at, shared.length)} ${shared.length.symbol} (twice the farthest reading) it gives ${field(power)} where ${physical.model} gives ${field(coil)} (${verdict})`;
    }
  }
  return `${head}: ${pattern}${extrapolation}.`;
}

/** What every power-law sentence about one survey shares (see {@link powerLawContext}). */
export interface PowerLawContext {
  /** Indices of the readings ordered by distance (ties in survey order). */
  readonly order: readonly number[];
  /** Least-squares line of ln|B| on ln d over the readings with d > 0, or null. */
  readonly line: { readonly slope: number; readonly intercept: number } | null;
  /** "12.5–300 mm": the distances the apparent exponent is read over. */
  readonly range: string;
  /** How the survey's values are written (surveyUnits), and the unit of its distances. */
  readonly units: SurveyUnitChoice;
  readonly length: DisplayUnit;
  readonly farthest: number;
  /** The physical fit's coil field at twice the farthest distance (T), NaN without one. */
  readonly physicalField: number;
}

/** powerLawContext's distances and fields of the line, reused from call to call (grown when short; views of the first entries handed on). */
let lineScratch = { distance: new Float64Array(64), field: new Float64Array(64) };

/**
 * The parts of {@link describePowerLaw} that depend only on the readings and the best
 * physical fit, worked out once for all the power laws of a survey (compareModels).
 *
 * @param any one fit of the survey (its points give the readings)
 * @param units the survey's units (surveyUnits): distances and fields are written in them; mm and a unit chosen from the value when absent
 */
export function powerLawContext(any: FitResult, physical: FitResult | null, modelOf: (id: ModelId) => FieldModel, units: SurveyUnitChoice = surveyUnits(null)): PowerLawContext {
  const points = any.points;
  const order = points.map((_, i) => i);
  // Most surveys are already in order of distance: sort only when not (the same order either way).
  let ordered = true;
  for (let i = 1; i < points.length && ordered; i++) ordered = points[i - 1]!.distance <= points[i]!.distance;
  if (!ordered) order.sort((i, j) => points[i]!.distance - points[j]!.distance || i - j);
  const positive = order.filter((i) => points[i]!.distance > 0);
  if (lineScratch.distance.length < positive.length) lineScratch = { distance: new Float64Array(2 * positive.length), field: new Float64Array(2 * positive.length) };
  const distance = lineScratch.distance.subarray(0, positive.length);
  const field = lineScratch.field.subarray(0, positive.length);
  positive.forEach((i, k) => {
    distance[k] = points[i]!.distance;
    field[k] = points[i]!.field;
  });
  const line = logLogLine(distance, field);
  const span = line === null ? order : positive;
  const farthest = points[order[order.length - 1]!]?.distance ?? 0;
  const length = units.unit('length', farthest, { symbol: 'mm', factor: 1e-3 });
  const range = `${inUnit(points[span[0]!]?.distance ?? 0, length)}–${inUnit(points[span[span.length - 1]!]?.distance ?? 0, length)} ${length.symbol}`;
  const physicalField = physical !== null && farthest > 0 ? coilField(physical, modelOf, 2 * farthest) : NaN;
  return { order, line, range, units, length, farthest, physicalField };
}

/** "below 5 of the 6 nearest readings" (most residuals y − f positive) or "above …". */
function side(residuals: readonly number[], where: string): string {
  const above = residuals.filter((r) => r > 0).length;
  const below = residuals.filter((r) => r < 0).length;
  return above >= below
    ? `below ${above} of the ${residuals.length} ${where} readings`
    : `above ${below} of the ${residuals.length} ${where} readings`;
}

/**
 * One on-axis point for {@link coilField}, reused from call to call (a call runs to
 * completion and only `distance` changes): no arrays made per sentence.
 */
const onePoint = { n: 1, distance: new Float64Array(1), radial: new Float64Array(1), field: new Float64Array(1), kind: 'magnitude' } satisfies SurveyPoints;
const onePrediction = new Float64Array(1);

/** A fit's predicted on-axis reading at one stated distance with the background left out (T). */
function coilField(fit: FitResult, modelOf: (id: ModelId) => FieldModel, distance: number): number {
  const model = modelOf(fit.model);
  const values = new Float64Array(model.parameters.length);
  for (let j = 0; j < values.length; j++) {
    const p = model.parameters[j]!;
    values[j] = p.role === 'background' ? 0 : fit.params[p.name]?.value ?? NaN;
  }
  onePoint.distance[0] = distance;
  model.evaluate(values, onePoint, onePrediction);
  return onePrediction[0]!;
}

/** A distance in `unit` to 3 significant digits without trailing zeros: 0.002 m in mm → "2", 0.0455 m in mm → "45.5". */
function inUnit(metres: number, unit: DisplayUnit): string {
  return String(Number((metres / unit.factor).toPrecision(3)));
}
