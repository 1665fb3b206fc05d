import type { ModelId } from '../../models/field-model';
import type { CheckStatus } from '../decide-conformity';

/** One comparison of a spec with the fit: a label parameter, a field claim, or the far-field moment (check-parameter, check-claim, check-moment). */
export interface SpecCheck {
  /** What was checked: "ampereTurns", "radius", "field at 0 mm". */
  readonly what: string;
  readonly status: CheckStatus;
  readonly expected: { readonly value: number; readonly unit: string };
  readonly measured: { readonly value: number; readonly unit: string; readonly ci95: readonly [number, number] | null };
  readonly tolerance: { readonly relative: number; readonly absolute: number };
  /** One sentence of evidence, with numbers and units. */
  readonly evidence: string;
  /** What was compared: a label parameter, a field claim, or the far-field moment derived from the label. */
  readonly kind?: 'parameter' | 'claim' | 'moment';
  /** Claims only: where the claimed distance is measured from (the device surface, or the winding). */
  readonly datum?: 'surface' | 'winding';
  /**
   * For an inconclusive check: the measurement that would decide it, in one sentence
   * (added points and where, or the uncertainty to reach). Absent when decided.
   */
  readonly toDecide?: string;
  /** Claims only: the same point under other curves, side by side (T). */
  readonly alternatives?: readonly { readonly model: ModelId; readonly value: number; readonly unit: 'T' }[];
}
