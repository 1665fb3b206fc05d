import { mulberry32, normalRandom } from '../../src/core/random';

/** How a gaussmeter reading scatters (DOMAIN.md §3), all as standard deviations, SI. */
export interface NoiseModel {
  /** Scatter proportional to the reading (the "% of reading" term of §3.2), a fraction. */
  readonly relativeSd: number;
  /** Absolute scatter (the counts/floor term of §3.2, zero drift), T. */
  readonly floorSd: number;
  /** Placement scatter of the probe along the axis (§3.7), m. */
  readonly positionSd: number;
  /** Digits the meter displays (auto-ranging display). */
  readonly significantDigits: number;
}

/** A seeded N(0, 1) source: mulberry32 + Box–Muller from src/core/random. */
export function gaussianSource(seed: number): () => number {
  return normalRandom(mulberry32(seed));
}

/**
 * One displayed reading: the model's reading at the ruler distance plus placement scatter
 * (`positionSd`, §3.7) — the model itself adds the probe offset (§3.1) and background
 * (§3.4) — plus relative and absolute noise added in quadrature, rounded to the meter's
 * display digits.
 *
 * @param reading the true reading (T) at a ruler distance (m), offset and background included
 * @returns the displayed value, T
 */
export function noisyReading(reading: (distance: number) => number, rulerDistance: number, noise: NoiseModel, gaussian: () => number): number {
  const clean = reading(rulerDistance + noise.positionSd * gaussian());
  return roundToDigits(clean + noise.relativeSd * Math.abs(clean) * gaussian() + noise.floorSd * gaussian(), noise.significantDigits);
}

/** Round to `digits` significant digits, as a meter display shows it. */
export function roundToDigits(value: number, digits: number): number {
  return value === 0 ? 0 : Number(value.toPrecision(digits));
}

/** A number as a meter export writes it: plain decimal in the given unit, no exponent for display values. */
export function display(valueSi: number, unitFactor: number, digits: number): string {
  const value = roundToDigits(valueSi / unitFactor, digits);
  const magnitude = Math.abs(value);
  if (magnitude === 0) return '0';
  const decimals = Math.max(0, digits - 1 - Math.floor(Math.log10(magnitude)));
  return value.toFixed(Math.min(decimals, 12)).replace(/(\.\d*?)0+$/u, '$1').replace(/\.$/u, '');
}
