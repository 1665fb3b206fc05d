import { dipoleField, dipoleFieldGradient } from '../physics/dipole-field';
import { vacuumPermeability } from '../physics/vacuum-permeability';
import type { FieldModel, SurveyPoints } from './field-model';
import { medianOf } from '../numeric/order-statistics';
import { radialDistance, readingSign } from './initial-guess';
import { backgroundParameter, fieldReading, fieldReadingDerivative, probeOffsetParameter } from './model-reading';

/** The dipole start's distances √(d² + ρ²), reused from call to call (grown when short; only the first n read). */
let dipoleScratch = new Float64Array(64);

const field = new Float64Array(4);

/** Dipole field at z = distance + probeOffset from the datum, ρ = radial. */
function dipoleComponents(params: Float64Array, distance: number, radial: number, out: Float64Array): void {
  dipoleField(params[0]!, distance + params[1]!, radial, out);
}

/**
 * Catalog model `dipole`: a point magnetic dipole at the distance datum (DOMAIN.md §1.7),
 * parameters [moment (A·m²), probeOffset (m), background (T)]. The far field of every coil;
 * near a coil it over-estimates on axis.
 *
 * Datum: the dipole sits at the datum (winding plane of a flat coil); the sensing point is
 * at z = distance + probeOffset, ρ = radial. Reading = |B| or B_z plus background.
 *
 * Jacobian: analytic (dipoleFieldGradient). Initial guess: on axis B = μ0 m/(2π z³), so
 * m = 2π|B| r³/μ0 at each point (r = √(d² + ρ²)), median over the farther half of the
 * points, where the dipole form holds best; sign of the median reading for axial data.
 */
export const dipoleModel: FieldModel = {
  id: 'dipole',
  label: 'magnetic dipole (far field)',
  physical: true,
  parameters: [
    { name: 'moment', unit: 'A·m²', role: 'amplitude', lower: -Infinity, upper: Infinity, description: 'magnetic moment m = N·I·area' },
    probeOffsetParameter,
    backgroundParameter,
  ],
  components: dipoleComponents,
  evaluate(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
    // An array kernel: dipoleField called directly (no components callback), same bits.
    const moment = params[0]!;
    const offset = params[1]!;
    const background = params[2]!;
    for (let i = 0; i < points.n; i++) {
      dipoleField(moment, points.distance[i]! + offset, points.radial[i]!, field);
      out[i] = fieldReading(points.kind, field[0]!, field[1]!) + background;
    }
  },
  jacobian(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
    const moment = params[0]!;
    for (let i = 0; i < points.n; i++) {
      dipoleFieldGradient(1, points.distance[i]! + params[1]!, points.radial[i]!, field);
      const bz = moment * field[0]!;
      const br = moment * field[1]!;
      const row = 3 * i;
      out[row] = fieldReadingDerivative(points.kind, bz, br, field[0]!, field[1]!);
      out[row + 1] = fieldReadingDerivative(points.kind, bz, br, moment * field[2]!, moment * field[3]!);
      out[row + 2] = 1;
    }
  },
  normalEquations(params, points, weight, columnScale, residuals, gram, gradientOut): void {
    // jacobian's derivatives, summed in registers (the same products in the same order).
    const moment = params[0]!;
    const s0 = columnScale[0]!;
    const s1 = columnScale[1]!;
    const s2 = columnScale[2]!;
    let g00 = 0, g10 = 0, g11 = 0, g20 = 0, g21 = 0, g22 = 0;
    let b0 = 0, b1 = 0, b2 = 0;
    for (let i = 0; i < points.n; i++) {
      dipoleFieldGradient(1, points.distance[i]! + params[1]!, points.radial[i]!, field);
      const bz = moment * field[0]!;
      const br = moment * field[1]!;
      const w = weight[i]!;
      const r = residuals[i]!;
      const j0 = fieldReadingDerivative(points.kind, bz, br, field[0]!, field[1]!) * w * s0;
      const j1 = fieldReadingDerivative(points.kind, bz, br, moment * field[2]!, moment * field[3]!) * w * s1;
      const j2 = 1 * w * s2;
      b0 += j0 * r; b1 += j1 * r; b2 += j2 * r;
      g00 += j0 * j0; g10 += j1 * j0; g11 += j1 * j1; g20 += j2 * j0; g21 += j2 * j1; g22 += j2 * j2;
    }
    gram[0] = g00; gram[3] = g10; gram[4] = g11; gram[6] = g20; gram[7] = g21; gram[8] = g22;
    gradientOut[0] = b0; gradientOut[1] = b1; gradientOut[2] = b2;
  },
  initialGuess(points: SurveyPoints): Float64Array {
    if (dipoleScratch.length < points.n) dipoleScratch = new Float64Array(2 * points.n);
    const r = dipoleScratch;
    const order: number[] = [];
    // Most surveys are already in order of distance: sort only when not (the same order either way).
    let ordered = true;
    for (let i = 0; i < points.n; i++) {
      r[i] = radialDistance(points.distance[i]!, points.radial[i]!);
      if (r[i]! > 0 && Number.isFinite(r[i]!) && Number.isFinite(points.field[i]!)) {
        if (order.length > 0 && r[order[order.length - 1]!]! > r[i]!) ordered = false;
        order.push(i);
      }
    }
    if (!ordered) order.sort((i, j) => r[i]! - r[j]! || i - j);
    const farther = order.slice(Math.floor(order.length / 2));
    const moment = medianOf(farther.map((i) => (2 * Math.PI * Math.abs(points.field[i]!) * r[i]! ** 3) / vacuumPermeability));
    return Float64Array.of(readingSign(points) * (Number.isFinite(moment) && moment > 0 ? moment : 1), 0, 0);
  },
};
