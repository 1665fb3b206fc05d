import type { FitResult } from '../../fit/fit-result';
import { getModel, nearFaceModels } from '../../models';
import type { ModelId } from '../../models/field-model';
import type { ReadingType, SurveyUnits } from '../../survey/survey';
import { surveyUnits } from '../../units';
import { bestPhysicalFit, convergedFit } from '../best-fit';
import { beyondSurvey, fittedModel, probeOffsetOf, surveyedFieldRange, type FittedModel } from '../fitted-model';
import { fallDistance } from './fall-distance';
import { thresholdCautions } from './threshold-cautions';
import { thresholdInterval, type ThresholdIntervalOptions } from './threshold-interval';
import type { ThresholdLevel } from './threshold-level';

export interface ThresholdResult {
  readonly level: { readonly value: number; readonly unit: 'T'; readonly label?: string; readonly flag?: string };
  readonly model: ModelId;
  readonly distance: { readonly value: number; readonly unit: 'm'; readonly ci95: readonly [number, number] | null } | null;
  readonly extrapolated: boolean;
  readonly naive: {
    readonly model: ModelId;
    readonly distance: { readonly value: number; readonly unit: 'm' } | null;
    /** naive distance / physical-model distance. */
    readonly ratio?: number | null;
    readonly extrapolated?: boolean;
  } | null;
  readonly notes: readonly string[];
  /** The fitted power law's distance (descriptive baseline) and its ratio to the physical model's. */
  readonly powerLaw?: {
    readonly model: ModelId;
    readonly exponent: number;
    readonly distance: { readonly value: number; readonly unit: 'm' } | null;
    readonly ratio: number | null;
    readonly extrapolated: boolean;
  } | null;
  /** How the 95 % interval was obtained: delta method, or Monte Carlo when the curve is strongly nonlinear. */
  readonly intervalMethod?: 'delta' | 'monte-carlo' | null;
  /** Surveyed distances as field-point distances from the datum, m. */
  readonly surveyedRange?: readonly [number, number] | null;
  /** DOMAIN.md §4.5 cautions that go with every threshold distance. */
  readonly cautions?: readonly string[];
}

/** What the threshold analysis needs besides the fits. */
export interface ThresholdContext extends ThresholdIntervalOptions {
  /** Detector type of the survey's readings (null when not stated). */
  readonly readingType: ReadingType | null;
  /** The units the survey's file was written in; the notes write fields and lengths in them (surveyUnits). */
  readonly units?: SurveyUnits;
}

/**
 * For each level, the distance from the datum at which the best physical model's on-axis
 * field falls below it (fallDistance on the fitted curve, beyond its maximum), with a 95 %
 * interval (thresholdInterval), beside what the fitted inverse-square law and the fitted
 * power law would say and their ratios to it (DOMAIN.md §1.9–1.10). Naive curves are
 * solved on the survey's distance scale and moved to the field point by the physical
 * model's probe offset, so all distances share one datum. A distance beyond the surveyed
 * range is marked extrapolated. Every result carries the DOMAIN.md §4.5 cautions.
 *
 * @param fits every fit of one survey (CONTRACT.md models)
 * @param levels from parseThresholdLevel
 */
export function thresholdDistances(fits: readonly FitResult[], levels: readonly ThresholdLevel[], context: ThresholdContext): ThresholdResult[] {
  const physical = bestPhysicalFit(fits, getModel);
  const chosen = physical ?? bestConverged(fits);
  if (chosen === null) {
    return levels.map((level) => ({
      level: levelOf(level),
      model: fits[0]?.model ?? 'loop',
      distance: null,
      extrapolated: false,
      naive: null,
      notes: ['No model converged, so no distance can be given.', ...level.notes],
      intervalMethod: null,
      surveyedRange: null,
      cautions: thresholdCautions,
    }));
  }
  const fitted = fittedModel(chosen, getModel(chosen.model));
  // A scan's naive curves are centred on the coil (|position − centre|): from a near face they are half a length nearer.
  const scan = chosen.params['centre'] !== undefined;
  const offset = scan ? -0.5 * (nearFaceModels.has(chosen.model) ? chosen.params['length']?.value ?? 0 : 0) : probeOffsetOf(fitted);
  const range = surveyedFieldRange(fitted, probeOffsetOf(fitted));
  const scale = lengthScale(fitted, range);
  const beyond = (z: number | null) => beyondSurvey(z, range);
  const units = surveyUnits(context);
  return levels.map((level) => {
    const estimate = thresholdInterval(fitted, level.value, scale, context);
    const naive = naiveDistance(convergedFit(fits, 'inverse-square'), level.value, offset, scale);
    const power = convergedFit(fits, 'power-law');
    const powerDistance = naiveDistance(power, level.value, offset, scale);
    const ratio = (z: number | null) => (z !== null && estimate.distance ? z / estimate.distance : null);
    const notes = [...commonNotes(fitted, physical !== null), ...(scan ? [scanNote] : []), ...estimate.notes, ...readingTypeNotes(level, context.readingType), ...level.notes];
    if (estimate.distance === null) notes.unshift(`The fitted ${chosen.model} field stays below ${units.format(level.value, 'field')} everywhere on the axis beyond the datum.`);
    if (beyond(estimate.distance) && range) notes.push(`Extrapolated: the survey reaches ${units.format(range[1], 'length')} from the datum; this distance rests on the model, not on readings.`);
    if (level.flag) notes.push(`Level source: ${level.flag}.`);
    return {
      level: { ...levelOf(level) },
      model: chosen.model,
      distance: estimate.distance === null ? null : { value: estimate.distance, unit: 'm', ci95: estimate.ci95 },
      extrapolated: beyond(estimate.distance),
      naive: naive === null ? null : { model: 'inverse-square', distance: naive === undefined ? null : { value: naive, unit: 'm' }, ratio: ratio(naive ?? null), extrapolated: beyond(naive ?? null) },
      powerLaw: power === null ? null : {
        model: 'power-law',
        exponent: power.params['exponent']?.value ?? Number.NaN,
        distance: powerDistance === undefined || powerDistance === null ? null : { value: powerDistance, unit: 'm' },
        ratio: ratio(powerDistance ?? null),
        extrapolated: beyond(powerDistance ?? null),
      },
      notes,
      intervalMethod: estimate.method,
      surveyedRange: range,
      cautions: thresholdCautions,
    } satisfies ThresholdResult;
  });
}

const scanNote = 'The survey is a scan along the axis: the distance is measured from the fitted coil (its winding plane, the midpoint of a pair, or the near face of a long coil), not from the ruler\'s zero; the field is the same on both sides of the coil.';

function levelOf(level: ThresholdLevel): ThresholdResult['level'] {
  return { value: level.value, unit: 'T', ...(level.label ? { label: level.label } : {}), ...(level.flag ? { flag: level.flag } : {}) };
}

function bestConverged(fits: readonly FitResult[]): FitResult | null {
  return fits.filter((f) => f.converged && Number.isFinite(f.stats.aicc)).sort((a, b) => a.stats.aicc - b.stats.aicc)[0] ?? null;
}

/** The coil's largest dimension, else the surveyed reach, else 0.1 m: the grid scale of fallDistance. */
function lengthScale(fitted: FittedModel, range: readonly [number, number] | null): number {
  const geometry = fitted.point.model.parameters.map((p, j) => (p.role === 'geometry' ? Math.abs(fitted.values[j]!) : 0));
  const largest = Math.max(0, ...geometry.filter(Number.isFinite));
  return largest > 0 ? largest : range !== null && range[1] > 0 ? range[1] : 0.1;
}

/**
 * Distance (field point from the datum) where a descriptive fit's curve, background
 * removed and its own offset kept, falls to the level; undefined when it never reaches
 * it, null when there is no such fit.
 */
function naiveDistance(fit: FitResult | null, level: number, offset: number, scale: number): number | null | undefined {
  if (fit === null) return null;
  const fitted = fittedModel(fit, getModel(fit.model));
  const values = new Float64Array(fitted.values);
  fitted.point.model.parameters.forEach((p, j) => { if (p.role === 'background') values[j] = 0; });
  const reading = fallDistance((d) => fitted.point.field(values, d, 0), level, scale).distance;
  return reading === null ? undefined : reading + offset;
}

function commonNotes(fitted: FittedModel, physical: boolean): string[] {
  const notes = ['On the coil axis, measured from the distance datum (winding plane or near face) to the field point; the coil\'s own field, background removed. Off axis near the windings the field can be higher.'];
  if (!physical) notes.push(`No physical coil model converged; this distance comes from the descriptive ${fitted.fit.model} curve and must not be extrapolated.`);
  return notes;
}

function readingTypeNotes(level: ThresholdLevel, readingType: ReadingType | null): string[] {
  if (level.readingType === null) return [];
  if (readingType === null) return [`The level is a ${level.readingType} value and the survey does not state its detector type; confirm the readings are ${level.readingType}.`];
  if (readingType === level.readingType) return [];
  if (level.readingType === 'rms' && readingType === 'peak') return ['The level is rms and the readings are peak: for a sine the rms field is peak/√2, so this distance errs on the far (safe) side.'];
  if (level.readingType === 'dc') return [`The level is for static fields and the readings are ${readingType}.`];
  return [`The level is ${level.readingType} and the readings are ${readingType}; compare like with like.`];
}
