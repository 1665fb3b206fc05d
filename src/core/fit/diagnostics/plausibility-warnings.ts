import { surveyUnits } from '../../units/survey-units';
import type { FitWarningInput } from './fit-warning-input';

/** Probe offsets outside this range (m) are questioned: recess plus housing is a few mm (common practice). */
const offsetRange = [-0.002, 0.02] as const;
/** A DC background beyond this (T) is more than Earth's field, 25–65 µT (DOMAIN.md §3.4). */
const largestDcBackground = 1e-4;
/** An AC (rms, peak) reading sees no static field; beyond this (T) a background is questioned (common practice). */
const largestAcBackground = 1e-5;

/**
 * Question a fitted probe offset or background that a real set-up would not have
 * (physical models only; power laws are descriptive): a sensing point more than 2 mm in
 * front of the stated distance or more than 20 mm behind it (DOMAIN.md §3.1); a DC
 * background above 100 µT, an AC background above 10 µT, or any background above a
 * quarter of the largest reading (DOMAIN.md §3.4, §5: the constant is then absorbing a
 * misfit of the curve's shape). Values in the survey's own units (surveyUnits).
 */
export function plausibilityWarnings(input: FitWarningInput): string[] {
  const warnings: string[] = [];
  const units = surveyUnits(input.survey);
  const offset = input.params['probeOffset'];
  if (offset && !offset.fixed) {
    const shown = units.format(Math.abs(offset.value), 'length', { significant: 3 });
    if (offset.value < offsetRange[0]) {
      warnings.push(`The fitted probe offset puts the sensing point ${shown} in front of the stated distance: check where distances were measured from (the winding plane, or the near face of a long coil).`);
    } else if (offset.value > offsetRange[1]) {
      warnings.push(`The fitted probe offset (${shown}) is more than a probe's recess plus a housing usually is (a few mm): check the distance datum, or this model may not describe the coil.`);
    }
  }
  const background = input.params['background'];
  if (background && !background.fixed) {
    let largest = 0;
    for (let i = 0; i < input.points.n; i++) largest = Math.max(largest, Math.abs(input.points.field[i]!));
    const size = Math.abs(background.value);
    const shown = units.format(background.value, 'field', { significant: 3 });
    const ac = input.survey.readingType === 'rms' || input.survey.readingType === 'peak';
    if (size > 0.25 * largest) {
      warnings.push(`The fitted background (${shown}) is more than a quarter of the largest reading: it is absorbing a misfit of the curve's shape rather than measuring a background.`);
    } else if (ac && size > largestAcBackground) {
      warnings.push(`The fitted background (${shown}) is large for ${input.survey.readingType} readings, which do not see static fields such as Earth's: check the meter's zero.`);
    } else if (!ac && size > largestDcBackground) {
      warnings.push(`The fitted background (${shown}) is more than Earth's field (25–65 µT): check the meter's zero and for steel or magnets nearby.`);
    }
  }
  return warnings;
}
