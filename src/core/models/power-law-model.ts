import type { FieldModel, ModelId, ParameterSpec, SurveyPoints } from './field-model';
import { logLogLine } from '../numeric/log-log-line';
import { medianOf } from '../numeric/order-statistics';
import { readingSign } from './initial-guess';
import { backgroundParameter, probeOffsetParameter } from './model-reading';

const amplitudeParameter: ParameterSpec = {
  name: 'amplitude', unit: 'T·m^n', role: 'amplitude', lower: -Infinity, upper: Infinity,
  description: 'amplitude A of B = A/r^n (T·m^n, n the exponent)',
};
const exponentParameter: ParameterSpec = {
  name: 'exponent', unit: '1', role: 'exponent', lower: 0, upper: Infinity,
  description: 'apparent exponent n over the surveyed range (not a property of the coil)',
};

/** The fixed-exponent start's |B|·d^n, reused from call to call (grown when short; a view of the first n handed on). */
let scaledScratch = new Float64Array(64);

/** r = √((d + δ)² + ρ²), or the signed d + δ on the axis. */
function distanceFromSource(axial: number, rho: number): number {
  return rho === 0 ? axial : Math.sqrt(axial * axial + rho * rho);
}

/** r^−n (exactly 1/r² and 1/r³ for n = 2, 3; exp(−n·ln r) otherwise), NaN for r ≤ 0; logR = ln r. */
function inversePower(r: number, exponent: number, logR: number): number {
  const inv = 1 / r;
  return r > 0 ? (exponent === 2 ? inv * inv : exponent === 3 ? inv * inv * inv : Math.exp(-exponent * logR)) : NaN;
}

/**
 * The descriptive power laws of DOMAIN.md §1.9, B = amplitude / r^n + background with
 * r = √((distance + probeOffset)² + ρ²), which on the axis is DESIGN.md's
 * amplitude/(d + probeOffset)^n. A power law has no direction, so the reading kind does not
 * change the prediction; `components` puts the value in the axial slot with radial 0.
 * On the axis (ρ = 0) r is the signed distance + probeOffset, so a point at or behind the
 * datum gives NaN (the fit rejects such steps); off the axis r is the root above.
 *
 * `power-law` fits n: parameters [amplitude (T·m^n), exponent (1), probeOffset (m),
 * background (T)]; `inverse-square` and `inverse-cube` fix n = 2, 3: [amplitude,
 * probeOffset, background].
 *
 * Jacobian: analytic, ∂/∂A = r^−n, ∂/∂n = −A r^−n ln r, ∂/∂δ = −nA r^(−n−2)(d + δ), ∂/∂bg = 1.
 * Initial guess: the ordinary least-squares line through (ln d, ln|B|) — the slope is the
 * datasheet exponent (DOMAIN.md §9 row 64) and the intercept ln A; for a fixed n,
 * A = median(|B|·d^n); sign of the median reading for axial data.
 */
function powerLaw(id: ModelId, label: string, fixedExponent: number | null): FieldModel {
  const free = fixedExponent === null;
  const k = free ? 4 : 3;
  const model: FieldModel = {
    id,
    label,
    physical: false,
    parameters: free
      ? [amplitudeParameter, exponentParameter, probeOffsetParameter, backgroundParameter]
      : [amplitudeParameter, probeOffsetParameter, backgroundParameter],
    components(params: Float64Array, distance: number, radial: number, out: Float64Array): void {
      const axial = distance + params[k - 2]!;
      const r = radial === 0 ? axial : Math.sqrt(axial * axial + radial * radial);
      out[0] = r > 0 ? params[0]! * Math.pow(r, -(free ? params[1]! : fixedExponent)) : NaN;
      out[1] = 0;
    },
    evaluate(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
      const amplitude = params[0]!;
      const exponent = free ? params[1]! : fixedExponent;
      const offset = params[k - 2]!;
      const background = params[k - 1]!;
      for (let i = 0; i < points.n; i++) {
        const axial = points.distance[i]! + offset;
        const rho = points.radial[i]!;
        const r = rho === 0 ? axial : Math.sqrt(axial * axial + rho * rho);
        const inv = 1 / r;
        out[i] = (r > 0 ? amplitude * (exponent === 2 ? inv * inv : exponent === 3 ? inv * inv * inv : Math.exp(-exponent * Math.log(r))) : NaN) + background;
      }
    },
    sourceDistances(offset: number, points: SurveyPoints, r: Float64Array, logR: Float64Array): void {
      for (let i = 0; i < points.n; i++) {
        const axial = points.distance[i]! + offset;
        const rho = points.radial[i]!;
        const distance = rho === 0 ? axial : Math.sqrt(axial * axial + rho * rho);
        r[i] = distance;
        logR[i] = Math.log(distance);
      }
    },
    evaluateAtDistances(params: Float64Array, r: Float64Array, logR: Float64Array, out: Float64Array): void {
      // evaluate's expression, with its r and ln r read instead of worked out
      const amplitude = params[0]!;
      const exponent = free ? params[1]! : fixedExponent;
      const background = params[k - 1]!;
      for (let i = 0; i < out.length; i++) {
        const distance = r[i]!;
        const inv = 1 / distance;
        out[i] = (distance > 0 ? amplitude * (exponent === 2 ? inv * inv : exponent === 3 ? inv * inv * inv : Math.exp(-exponent * logR[i]!)) : NaN) + background;
      }
    },
    jacobian(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
      const amplitude = params[0]!;
      const exponent = free ? params[1]! : fixedExponent;
      const offset = params[k - 2]!;
      for (let i = 0; i < points.n; i++) {
        const axial = points.distance[i]! + offset;
        const r = distanceFromSource(axial, points.radial[i]!);
        // ln r only where it is read: the exponent's column, and r^−n for an exponent other than 2 or 3 (a fixed one is 2 or 3).
        const logR = free ? Math.log(r) : NaN;
        const power = inversePower(r, exponent, logR);
        const row = k * i;
        out[row] = power;
        if (free) out[row + 1] = -amplitude * power * logR;
        out[row + k - 2] = (-exponent * amplitude * power * axial) / (r * r);
        out[row + k - 1] = 1;
      }
    },
    normalEquations(params, points, weight, columnScale, residuals, gram, gradientOut): void {
      // jacobian's derivatives, summed in registers (the same products in the same order);
      // the exponent's column only when it is a parameter.
      const amplitude = params[0]!;
      const exponent = free ? params[1]! : fixedExponent;
      const offset = params[k - 2]!;
      const sA = columnScale[0]!;
      const sN = free ? columnScale[1]! : 0;
      const sD = columnScale[k - 2]!;
      const sB = columnScale[k - 1]!;
      let gAA = 0, gNA = 0, gNN = 0, gDA = 0, gDN = 0, gDD = 0, gBA = 0, gBN = 0, gBD = 0, gBB = 0;
      let bA = 0, bN = 0, bD = 0, bB = 0;
      for (let i = 0; i < points.n; i++) {
        const axial = points.distance[i]! + offset;
        const r = distanceFromSource(axial, points.radial[i]!);
        const logR = free ? Math.log(r) : NaN;
        const power = inversePower(r, exponent, logR);
        const w = weight[i]!;
        const res = residuals[i]!;
        const jA = power * w * sA;
        const jD = ((-exponent * amplitude * power * axial) / (r * r)) * w * sD;
        const jB = 1 * w * sB;
        bA += jA * res; bD += jD * res; bB += jB * res;
        gAA += jA * jA; gDA += jD * jA; gDD += jD * jD; gBA += jB * jA; gBD += jB * jD; gBB += jB * jB;
        if (free) {
          const jN = (-amplitude * power * logR) * w * sN;
          bN += jN * res;
          gNA += jN * jA; gNN += jN * jN; gDN += jD * jN; gBN += jB * jN;
        }
      }
      const A = 0;
      const D = k - 2;
      const B = k - 1;
      gram[A * k + A] = gAA;
      gram[D * k + A] = gDA; gram[D * k + D] = gDD;
      gram[B * k + A] = gBA; gram[B * k + D] = gBD; gram[B * k + B] = gBB;
      gradientOut[A] = bA; gradientOut[D] = bD; gradientOut[B] = bB;
      if (free) {
        gram[1 * k + A] = gNA; gram[1 * k + 1] = gNN; gram[D * k + 1] = gDN; gram[B * k + 1] = gBN;
        gradientOut[1] = bN;
      }
    },
    initialGuess(points: SurveyPoints): Float64Array {
      const sign = readingSign(points);
      const line = free ? logLogLine(points.distance, points.field) : null;
      const exponent = fixedExponent ?? (line !== null && -line.slope > 0 ? -line.slope : 2);
      let amplitude: number;
      if (line !== null && -line.slope > 0) {
        amplitude = Math.exp(line.intercept);
      } else {
        // |B|·d^n per reading by a loop (TypedArray map calls back per entry); NaN where d ≤ 0
        if (scaledScratch.length < points.distance.length) scaledScratch = new Float64Array(2 * points.distance.length);
        const scaled = scaledScratch.subarray(0, points.distance.length);
        for (let i = 0; i < scaled.length; i++) {
          const d = points.distance[i]!;
          scaled[i] = d > 0 ? Math.abs(points.field[i]!) * d ** exponent : NaN;
        }
        amplitude = medianOf(scaled);
      }
      const start = Number.isFinite(amplitude) && amplitude > 0 ? sign * amplitude : sign * 1e-6;
      return free ? Float64Array.of(start, exponent, 0, 0) : Float64Array.of(start, 0, 0);
    },
  };
  return model;
}

/** Catalog model `power-law`: B = A/(d + δ)^n + background with n fitted (DOMAIN.md §1.9). */
export const powerLawModel = powerLaw('power-law', 'power law A/r^n (descriptive)', null);
/** Catalog model `inverse-square`: B = A/(d + δ)² + background (DOMAIN.md §1.9). */
export const inverseSquareModel = powerLaw('inverse-square', 'inverse square A/r² (descriptive)', 2);
/** Catalog model `inverse-cube`: B = A/(d + δ)³ + background, the dipole's on-axis law (DOMAIN.md §1.9). */
export const inverseCubeModel = powerLaw('inverse-cube', 'inverse cube A/r³ (descriptive)', 3);
