import { isRingfallError, RingfallError } from '../../errors';
import { getModel, nearFaceModels } from '../../models';
import { formatQuantity } from '../../units';
import { parameterRole } from '../parameter-roles';
import { sensitivityRows, type DesignPoint, type DesignProblem } from './design-problem';
import { expectedIntervals, type ExpectedIntervals } from './expected-intervals';
import { optimalDesign } from './optimal-design';

/** Where the probe can go and how many readings to plan. */
export interface PlanOptions {
  /** Number of positions. */
  readonly count: number;
  /** Nearest and farthest distance the probe can be placed at, m (with `signed`, the ends of the ruler range). */
  readonly reach: readonly [number, number];
  /**
   * A scan through the coil (the problem's model is a scanModel): positions are signed,
   * on a ruler along the axis, and the reach may cross the coil's centre.
   */
  readonly signed?: boolean;
  /** Probe size: least separation between two positions, m. */
  readonly probeSize: number;
  /** Largest radial offset for off-axis positions, m; 0 or omitted: on axis only. */
  readonly maxRadial?: number;
  /** Names of the parameters that matter; default the free amplitude, geometry and exponent parameters. */
  readonly interest?: readonly string[];
  /** A plan to compare, e.g. the distances the user meant to use. */
  readonly compare?: readonly DesignPoint[];
}

/** A recommended plan beside an evenly spaced one of the same size and, if given, the user's. */
export interface MeasurementPlan {
  readonly recommended: ExpectedIntervals;
  readonly evenlySpaced: ExpectedIntervals;
  readonly compared: ExpectedIntervals | null;
  /**
   * For a scan (PlanOptions.signed): the recommended plan of the same size on one side only,
   * outward from the coil's datum with the probe offset free, to show what the second side
   * buys. Null otherwise, or when one side cannot hold the positions.
   */
  readonly oneSided: ExpectedIntervals | null;
  /** True for a scan through the coil (PlanOptions.signed): positions are signed ruler positions. */
  readonly scan: boolean;
  /** Names of the parameters the plan was optimised for. */
  readonly interest: readonly string[];
  readonly notes: readonly string[];
}

const axialCandidates = 160;
const radialSteps = [0.25, 0.5, 0.75, 1, 1.25, 1.5];

/**
 * Recommend probe positions for a survey of a coil whose rough parameters are known:
 * a candidate grid over the reach (on axis, and off axis when `maxRadial` > 0), then the
 * Ds-optimal choice (optimalDesign) for the parameters that matter, with the other free
 * parameters (probe offset, background) as nuisance. Returns the expected 95 % intervals
 * of the recommended plan, an evenly spaced plan of the same size, and the user's plan.
 *
 * @throws RingfallError PLAN_REACH (reach empty or too short for the count at this probe
 *   size), PLAN_COUNT (fewer positions than free parameters + 1), PLAN_INTEREST (unknown
 *   or fixed parameter named)
 */
export function planMeasurements(problem: DesignProblem, options: PlanOptions): MeasurementPlan {
  const [near, far] = options.reach;
  const k = problem.free.length;
  const freeNames = problem.free.map((j) => problem.model.parameters[j]!.name);
  if (!((options.signed === true || near >= 0) && far > near)) {
    throw new RingfallError('PLAN_REACH', `Plan reach: ${formatQuantity(near, 'length')} to ${formatQuantity(far, 'length')} is not a range. Give the ${options.signed === true ? 'two ends of the scan on the ruler, e.g. --reach -150mm..150mm' : 'nearest and farthest probe distance, e.g. --reach 5mm..200mm'}.`, { value: options.reach });
  }
  if (!Number.isInteger(options.count) || options.count <= k) {
    throw new RingfallError('PLAN_COUNT', `Plan points: ${options.count} positions for ${k} free parameters (${freeNames.join(', ')}). Plan at least ${k + 1}, better ${2 * k + 2}, or fix parameters.`, { value: options.count });
  }
  if ((options.count - 1) * options.probeSize > far - near && !(options.maxRadial! > 0)) {
    throw new RingfallError('PLAN_REACH', `Plan reach: ${options.count} positions ${formatQuantity(options.probeSize, 'length')} apart do not fit between ${formatQuantity(near, 'length')} and ${formatQuantity(far, 'length')}. Plan fewer points, widen the reach, or give a smaller probe size.`, { value: options.reach });
  }
  const interestNames = options.interest ?? freeNames.filter((name) => ['amplitude', 'geometry', 'exponent'].includes(parameterRole(name)));
  const interest = interestNames.map((name) => {
    const index = freeNames.indexOf(name);
    if (index < 0) throw new RingfallError('PLAN_INTEREST', `Plan parameter: "${name}" is not a free parameter of ${problem.model.id} (free: ${freeNames.join(', ')}). Name a free parameter.`, { value: name });
    return index;
  });

  const { candidates, rows } = usableCandidates(problem, candidateGrid(problem, options));
  const chosen = optimalDesign({
    rows,
    k,
    coordinates: candidates.map((p) => [p.distance, p.radial] as const),
    count: options.count,
    spacing: options.probeSize,
    interest: interest.length > 0 ? interest : [...Array(k).keys()],
  });
  const even = Array.from({ length: options.count }, (_, i) => ({ distance: near + ((far - near) * i) / (options.count - 1), radial: 0 }));
  const mm = { symbol: 'mm', factor: 1e-3 };
  const notes = [`Noise model per reading: ${formatNumber100(problem.noise.relative)} % of the reading + ${formatQuantity(problem.noise.absolute, 'field', { significant: 3 })}, and ${formatQuantity(problem.noise.position, 'length', { significant: 3, unit: mm })} position uncertainty (standard uncertainties).`];
  if (chosen.length < options.count) notes.push(`Only ${chosen.length} positions fit the reach at this probe size.`);
  if (options.signed === true) notes.push('Positions are on a ruler along the axis, through the coil: zero is where the coil\'s centre sits on it (the winding plane, the midpoint of a pair, the mid-length of a solenoid), so negative positions are on the far side.');
  return {
    recommended: expectedIntervals(problem, chosen.map((c) => candidates[c]!)),
    evenlySpaced: expectedIntervals(problem, even),
    compared: options.compare ? expectedIntervals(problem, options.compare) : null,
    oneSided: options.signed === true ? oneSidedPlan(problem, options, interestNames) : null,
    scan: options.signed === true,
    interest: interest.length > 0 ? interestNames : freeNames,
    notes,
  };
}

/**
 * The scan's catalog model planned on one side: distances from its datum out to the
 * farther end of the scan's reach (less half the length for a near-face model), the
 * probe offset in place of the centre, the same count, spacing and interest.
 */
function oneSidedPlan(problem: DesignProblem, options: PlanOptions, interestNames: readonly string[]): ExpectedIntervals | null {
  const base = getModel(problem.model.id);
  const offsetIndex = base.parameters.findIndex((p) => parameterRole(p.name) === 'offset');
  const centreIndex = problem.model.parameters.findIndex((p) => p.role === 'centre');
  if (offsetIndex < 0 || centreIndex !== offsetIndex) return null;
  const values = Float64Array.from(problem.values);
  const centre = values[centreIndex]!;
  values[offsetIndex] = 0;
  const lengthIndex = base.parameters.findIndex((p) => p.name === 'length');
  const datumShift = nearFaceModels.has(base.id) && lengthIndex >= 0 ? 0.5 * values[lengthIndex]! : 0;
  const side = Math.max(Math.abs(options.reach[0] - centre), Math.abs(options.reach[1] - centre)) - datumShift;
  try {
    const plan = planMeasurements({ ...problem, model: base, values }, {
      count: options.count,
      reach: [0, side],
      probeSize: options.probeSize,
      interest: interestNames.map((name) => (name === 'centre' ? base.parameters[offsetIndex]!.name : name)),
      ...(options.maxRadial === undefined ? {} : { maxRadial: options.maxRadial }),
    });
    return plan.recommended;
  } catch (error) {
    if (isRingfallError(error)) return null;
    throw error;
  }
}

function formatNumber100(fraction: number): string {
  return String(Math.round(fraction * 1e6) / 1e4);
}

/**
 * The candidates where the model's reading and its sensitivities are finite: a dipole or a
 * power law diverges at its centre, which a scan's reach may cross.
 */
function usableCandidates(problem: DesignProblem, grid: readonly DesignPoint[]): { candidates: DesignPoint[]; rows: Float64Array } {
  const all = sensitivityRows(problem, grid);
  const k = problem.free.length;
  const keep = grid.map((_, i) => all.subarray(i * k, (i + 1) * k).every(Number.isFinite));
  if (keep.every(Boolean)) return { candidates: [...grid], rows: all };
  const candidates = grid.filter((_, i) => keep[i]);
  const rows = new Float64Array(candidates.length * k);
  let at = 0;
  grid.forEach((_, i) => {
    if (!keep[i]) return;
    rows.set(all.subarray(i * k, (i + 1) * k), at * k);
    at += 1;
  });
  return { candidates, rows };
}

/** Axial grid (at most 160 points, finer than half a probe size where possible) and, if asked, off-axis rows at fractions of the coil's size. */
function candidateGrid(problem: DesignProblem, options: PlanOptions): DesignPoint[] {
  const [near, far] = options.reach;
  const steps = Math.min(axialCandidates - 1, Math.max(40, Math.ceil((2 * (far - near)) / Math.max(options.probeSize, 1e-9))));
  const grid: DesignPoint[] = [];
  for (let i = 0; i <= steps; i += 1) grid.push({ distance: near + ((far - near) * i) / steps, radial: 0 });
  const maxRadial = options.maxRadial ?? 0;
  if (maxRadial > 0) {
    const size = Math.max(...problem.model.parameters.map((p, j) => (p.role === 'geometry' ? problem.values[j]! : 0)), maxRadial / 2);
    const radii = radialSteps.map((f) => f * size).filter((r) => r <= maxRadial);
    const coarse = Math.min(40, steps);
    for (const radial of radii) for (let i = 0; i <= coarse; i += 1) grid.push({ distance: near + ((far - near) * i) / coarse, radial });
  }
  return grid;
}
