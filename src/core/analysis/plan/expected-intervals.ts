import type { ParameterUnit } from '../../models/field-model';
import { studentTQuantile } from '../../stats/student-t-quantile';
import { formatNumber } from '../../units';
import { momentEstimate } from '../../fit/diagnostics/far-field-moment';
import { choleskyFactor, choleskyInverse } from '../../linalg/cholesky';
import { informationMatrix, sensitivityRows, type DesignPoint, type DesignProblem } from './design-problem';

/** Expected 95 % half-width of one free parameter under a design. */
export interface ExpectedParameter {
  readonly name: string;
  readonly unit: ParameterUnit;
  readonly value: number;
  /** t_{0.975, n−k}·√C_jj, SI; null when the design does not determine the parameters. */
  readonly halfWidth: number | null;
  /** halfWidth/|value|, or null. */
  readonly relative: number | null;
}

/** What a set of probe positions is expected to deliver, before any reading is taken. */
export interface ExpectedIntervals {
  readonly points: readonly DesignPoint[];
  readonly parameters: readonly ExpectedParameter[];
  /** Far-field moment (A·m²) and its expected half-width, for coil models. */
  readonly moment: { readonly value: number; readonly halfWidth: number | null; readonly relative: number | null } | null;
  /** Expected correlation between the amplitude and the first geometry parameter, or null. */
  readonly correlation: number | null;
  readonly determined: boolean;
  readonly warnings: readonly string[];
}

/** |ρ| above which amplitude and geometry count as not separated (DOMAIN.md §7.6 product rule). */
export const farFieldCorrelation = 0.95;

/**
 * Expected 95 % intervals of the free parameters for a design: covariance C = (JᵀWJ)⁻¹
 * from the noise model at the rough parameter values (the linearised covariance of
 * DOMAIN.md §7.4 with stated σ), half-widths t_{0.975, n−k}·√C_jj with Student's t because
 * a fit that estimates its scale from the scatter widens them so (DOMAIN.md §7.5). The
 * moment's half-width follows by the delta method. A design whose amplitude–geometry
 * correlation exceeds 0.95 in magnitude is flagged as far-field only (§7.6).
 */
export function expectedIntervals(problem: DesignProblem, points: readonly DesignPoint[]): ExpectedIntervals {
  const k = problem.free.length;
  const names = problem.free.map((j) => problem.model.parameters[j]!);
  const covariance = points.length > k ? covarianceOf(informationMatrix(sensitivityRows(problem, points), k), k) : null;
  const coverage = studentTQuantile(0.975, points.length - k);
  const parameters = names.map((spec, a) => {
    const value = problem.values[problem.free[a]!]!;
    const halfWidth = covariance ? coverage * Math.sqrt(covariance[a * k + a]!) : null;
    return { name: spec.name, unit: spec.unit, value, halfWidth, relative: halfWidth !== null && value !== 0 ? halfWidth / Math.abs(value) : null };
  });
  const amplitude = names.findIndex((p) => p.role === 'amplitude');
  const geometry = names.findIndex((p) => p.role === 'geometry');
  const correlation = covariance && amplitude >= 0 && geometry >= 0
    ? covariance[amplitude * k + geometry]! / Math.sqrt(covariance[amplitude * k + amplitude]! * covariance[geometry * k + geometry]!)
    : null;
  const moment = momentInterval(problem, covariance, coverage);
  const warnings: string[] = [];
  if (!covariance) {
    warnings.push(`${points.length} positions cannot determine the ${k} free parameters (${names.map((p) => p.name).join(', ')}): add positions or fix parameters.`);
  } else if (correlation !== null && Math.abs(correlation) > farFieldCorrelation) {
    const momentText = moment?.relative == null ? '' : moment.relative < 0.1
      ? `, so only the moment N·I·area is determined (±${formatNumber(100 * moment.relative, 2)} %)`
      : `, and even the moment N·I·area is poorly determined (±${formatNumber(100 * moment.relative, 2)} %)`;
    warnings.push(
      `This plan stays in the far field: ${names[amplitude]!.name} and ${names[geometry]!.name} are correlated (ρ = ${formatNumber(correlation, 5)})${momentText}. ` +
        'Add positions nearer than about one coil radius.',
    );
  }
  return { points, parameters, moment, correlation, determined: covariance !== null, warnings };
}

/**
 * (JᵀWJ)⁻¹ after equilibration by the diagonal, M̃ = D^(−½)·M·D^(−½), so that the
 * singularity test compares correlations, not parameter units; null when singular.
 */
function covarianceOf(information: Float64Array, k: number): Float64Array | null {
  const scale = Array.from({ length: k }, (_, a) => Math.sqrt(information[a * k + a]!));
  if (!scale.every((s) => s > 0 && Number.isFinite(s))) return null;
  const scaled = information.map((value, index) => value / (scale[Math.floor(index / k)]! * scale[index % k]!));
  const lower = choleskyFactor(scaled, k, 1e-14);
  if (!lower) return null;
  return choleskyInverse(lower, k).map((value, index) => value / (scale[Math.floor(index / k)]! * scale[index % k]!));
}

function momentInterval(problem: DesignProblem, covariance: Float64Array | null, coverage: number): ExpectedIntervals['moment'] {
  if (problem.model.id === 'dipole') return null;
  const estimate = momentEstimate(problem.model, problem.values, problem.free, covariance, coverage);
  if (estimate === null) return null;
  const halfWidth = estimate.ci95 === null ? null : estimate.ci95[1] - estimate.value;
  return { value: estimate.value, halfWidth, relative: halfWidth === null ? null : halfWidth / Math.abs(estimate.value) };
}
