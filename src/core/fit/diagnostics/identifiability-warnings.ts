import type { ModelId } from '../../models/field-model';
import { formatNumber } from '../../units/format-quantity';
import type { FitWarningInput } from './fit-warning-input';
import { formatParameter } from './format-parameter';

/** The moment in the model's own symbols, for the far-field sentence. */
const momentFormula: Partial<Record<ModelId, string>> = {
  'loop': 'N·I·π·R²',
  'solenoid': 'N·I·π·R²',
  'coil-pair': '2·N·I·π·R²',
  'rectangle': 'N·I·w·h',
  'thick-coil': 'N·I·π·(a₁² + a₁a₂ + a₂²)/3',
};

/** What a reader can do when one of these is undetermined. */
const remedy: Readonly<Record<string, string>> = {
  amplitude: 'a power law describes the curve over the surveyed range, not the coil',
  probeOffset: 'add readings close to the coil, or fix it (--fix probeOffset=…) from the probe\'s drawing',
  centre: 'add readings on both sides of the coil, through its centre',
  background: 'add readings far from the coil or one with the coil switched off, or fix it (--fix background=…)',
  exponent: 'a power law\'s exponent needs readings over a wider range of distances',
};

/**
 * Say in plain words what the readings cannot determine (DOMAIN.md §7.6). When the coil's
 * strength and size are undetermined because every reading is far out (nearest ≥ 2 coil
 * sizes), say that only the moment is determined, with its value and uncertainty, and
 * where to add readings; otherwise name the parameters that trade off, with their
 * correlation, and the moment when it is known. Pairs of determined parameters with
 * |ρ| > 0.95 get one sentence: their intervals are not independent.
 */
export function identifiabilityWarnings(input: FitWarningInput): string[] {
  const { model, solution, uncertainty, moment, params } = input;
  const warnings: string[] = [];
  const freeNames = solution.freeIndices.map((j) => model.parameters[j]!.name);
  const undetermined = freeNames.filter((name) => params[name]?.determined === false);
  const isCoil = (name: string) => {
    const role = model.parameters.find((p) => p.name === name)?.role;
    return model.physical && role !== 'offset' && role !== 'centre' && role !== 'background';
  };
  const coil = undetermined.filter(isCoil);
  const k = freeNames.length;
  const correlationOf = (a: string, b: string): number | null => {
    const i = freeNames.indexOf(a);
    const j = freeNames.indexOf(b);
    return uncertainty.correlation === null || i < 0 || j < 0 ? null : uncertainty.correlation[i * k + j]!;
  };
  if (coil.length > 0) {
    const size = largestLength(input);
    const nearest = nearestFieldPoint(input);
    const names = joinWords(coil);
    const pair = coil.length === 2 ? correlationOf(coil[0]!, coil[1]!) : null;
    const correlation = pair === null ? '' : ` (correlation ${formatNumber(pair, 5)})`;
    // Claim the moment only when the data pin it down (a covariance exists and σ(m) ≤ |m|/4).
    const momentKnown = moment !== null && moment.stderr !== null && moment.stderr <= 0.25 * Math.abs(moment.value);
    const momentText = !momentKnown || model.id === 'dipole'
      ? ''
      : `the moment ${momentFormula[model.id] ?? 'N·I × area'} = ${formatParameter(moment.value, 'A·m²')}` +
        ` (± ${formatParameter(moment!.stderr!, 'A·m²', 2)})`;
    if (size !== null && nearest >= 2 * size.value && momentText !== '' && coil.length >= 2) {
      warnings.push(
        `These readings all lie in the far field (the nearest is ${formatNumber(nearest / size.value, 2)} × the ${size.name} from the coil): ` +
          `they determine ${momentText} but not ${names} separately${correlation}; add readings closer than one ${size.name}.`,
      );
    } else {
      warnings.push(
        `These readings cannot ${coil.length >= 2 ? `separate ${names}${correlation}` : `determine ${names}${partnerText(coil[0]!)}`}, so no interval is given for ${coil.length === 1 ? 'it' : 'them'}` +
          (momentText === '' ? '' : `; they do determine ${momentText}`) +
          '. Add readings where the curve\'s shape changes (near the coil and out to a few coil sizes), or fix what the label states.',
      );
    }
  }
  const rest = undetermined.filter((n) => !isCoil(n));
  if (!model.physical && rest.length >= 2) {
    warnings.push(`${joinWords(rest)} are not determined by these readings (they trade off against each other), so they have no intervals: this power law describes the curve over the surveyed range, not the coil.`);
    rest.length = 0;
  }
  for (const name of rest) {
    warnings.push(`${name} is not determined by these readings${partnerText(name)}, so it has no interval; ${remedy[name] ?? 'fix it or add readings'}.`);
  }
  const strong = uncertainty.identifiability.strongPairs.filter(
    (p) => params[freeNames[p.first]!]?.determined !== false && params[freeNames[p.second]!]?.determined !== false,
  );
  if (strong.length > 0 && model.physical) {
    const list = strong.map((p) => `${freeNames[p.first]} and ${freeNames[p.second]} (ρ = ${formatNumber(p.correlation, 3)})`);
    warnings.push(`Strongly correlated: ${joinWords(list)}. Their intervals are not independent; a change in one is largely made up by the other.`);
  }
  return warnings;

  /** " (it trades off against radius, ρ = −0.998)" for the most correlated other free parameter. */
  function partnerText(name: string): string {
    let partner: string | null = null;
    let strongest = 0;
    for (const other of freeNames) {
      const rho = other === name ? null : correlationOf(name, other);
      if (rho !== null && Math.abs(rho) > Math.abs(strongest)) {
        strongest = rho;
        partner = other;
      }
    }
    return partner === null ? '' : ` (it trades off against ${partner}, ρ = ${formatNumber(strongest, 4)})`;
  }
}

/** The largest length parameter of the coil (not the probe offset), by name and value (m). */
function largestLength(input: FitWarningInput): { name: string; value: number } | null {
  let best: { name: string; value: number } | null = null;
  input.model.parameters.forEach((spec, j) => {
    if (spec.role !== 'geometry') return;
    const value = Math.abs(input.solution.params[j]!);
    if (best === null || value > best.value) best = { name: spec.name, value };
  });
  return best;
}

/** Nearest field point to the coil centre, √((d + probeOffset)² + ρ²), or √((p − centre)² + ρ²) on a scan, m. */
function nearestFieldPoint(input: FitWarningInput): number {
  const offset = input.params['probeOffset']?.value ?? 0;
  const centre = input.params['centre']?.value;
  let nearest = Infinity;
  for (let i = 0; i < input.points.n; i++) {
    const axial = centre === undefined ? input.points.distance[i]! + offset : input.points.distance[i]! - centre;
    nearest = Math.min(nearest, Math.hypot(axial, input.points.radial[i]!));
  }
  return nearest;
}

/** "a", "a and b", "a, b and c". */
export function joinWords(words: readonly string[]): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}
