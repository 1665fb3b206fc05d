import { RingfallError } from '../errors';
import type { FieldModel, ModelId } from '../models/field-model';
import type { RelativePlusAbsolute } from '../units/tolerance';
import type { AbortFlag } from './engine/least-squares-types';
import type { RobustLoss } from './strategy/robust-fit';

/** The models fitted when none are named (CONTRACT.md `--model` default). */
export const defaultModels: readonly ModelId[] = ['loop', 'dipole', 'power-law', 'inverse-square', 'inverse-cube'];

/** How {@link fitSurvey} fits a survey. Everything SI. */
export interface FitSurveyOptions {
  /** Models to fit, in report order. Default {@link defaultModels}. */
  readonly models?: readonly ModelId[];
  /** Parameters held at a value, by name (SI): { radius: 0.045 }. Applies to every model that has the name. */
  readonly fixed?: Readonly<Record<string, number>>;
  /** Instrument accuracy: σᵢ = relative·|Bᵢ| + absolute (T). Replaces the file's uncertainty column. */
  readonly instrumentUncertainty?: RelativePlusAbsolute | null;
  /** Standard uncertainty of every distance (m), carried by effective variance (DOMAIN.md §3.8). */
  readonly positionUncertainty?: number | null;
  /** Robust loss with outlier flags (robust-fit.ts), or none. */
  readonly robust?: RobustLoss | null;
  /** |standardised residual| beyond which a robust fit flags a reading. Default 3. */
  readonly outlierCut?: number;
  /** Seed of the multi-start (same seed, same report). Default 1. */
  readonly seed?: number;
  /**
   * Most extra starts besides the data-driven one. Default 8. They stop early when the
   * first fit is settled or two of them agree (search-model-fit.ts), unless exhaustiveStarts.
   */
  readonly starts?: number;
  /** Run every one of the `starts` extra starts (slower; checks the adaptive rule). Default false. */
  readonly exhaustiveStarts?: boolean;
  /** Checked between iterations: an aborted fit returns what it has, converged false. */
  readonly signal?: AbortFlag;
  /** Budget of cost evaluations per least-squares run (engine default 200·(k + 1)). */
  readonly maxEvaluations?: number;
}

/**
 * Check the fixed parameters against the models to fit: every name must belong to at
 * least one of them and lie inside that parameter's bounds. A name some models lack
 * applies to the others only (the fit of such a model says so in its warnings).
 *
 * @throws RingfallError `FIT_UNKNOWN_PARAMETER` naming the valid names;
 *   `FIT_FIXED_OUT_OF_BOUNDS` for a value outside a parameter's bounds (e.g. radius ≤ 0) or not finite.
 * @example checkFixedParameters([loopModel], { radii: 0.045 }) // throws: … Parameters — loop: ampereTurns, radius, probeOffset, background.
 */
export function checkFixedParameters(models: readonly FieldModel[], fixed: Readonly<Record<string, number>>): void {
  for (const [name, value] of Object.entries(fixed)) {
    const specs = models.flatMap((model) => model.parameters.filter((p) => p.name === name).map((p) => ({ model, spec: p })));
    if (specs.length === 0) {
      const valid = models.map((model) => `${model.id}: ${model.parameters.map((p) => p.name).join(', ')}`).join('; ');
      throw new RingfallError(
        'FIT_UNKNOWN_PARAMETER',
        `Fixed parameter: "${name}" is not a parameter of ${models.map((m) => m.id).join(', ')} (--fix). Parameters — ${valid}.`,
        { value: name, where: '--fix' },
      );
    }
    for (const { model, spec } of specs) {
      // A length of 0 is no coil: lengths must be more than 0, not just at least their lower bound.
      const openAtZero = spec.lower === 0 && spec.role === 'geometry';
      if (!Number.isFinite(value) || value < spec.lower || value > spec.upper || (openAtZero && value === 0)) {
        const problem = Number.isFinite(value)
          ? `${name} = ${withUnit(String(value), spec.unit)} is outside what ${model.id} allows (${describeBounds(spec.lower, spec.upper, spec.unit, openAtZero)}) (--fix). Give a value inside.`
          : `${name} = ${value} is not a finite number (--fix). Give a finite value${spec.unit === '1' ? '' : ` in ${spec.unit}`}.`;
        throw new RingfallError(
          'FIT_FIXED_OUT_OF_BOUNDS',
          `Fixed parameter: ${problem}`,
          { value, where: '--fix' },
        );
      }
    }
  }
}

/** "0.045 m"; a dimensionless value ('1') without a unit. */
function withUnit(value: string, unit: string): string {
  return unit === '1' ? value : `${value} ${unit}`;
}

function describeBounds(lower: number, upper: number, unit: string, openAtZero: boolean): string {
  if (upper === Infinity) return `${openAtZero ? 'more than' : 'at least'} ${withUnit(String(lower), unit)}`;
  if (lower === -Infinity) return `at most ${withUnit(String(upper), unit)}`;
  return `${lower} to ${withUnit(String(upper), unit)}`;
}
