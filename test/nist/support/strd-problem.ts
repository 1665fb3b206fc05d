import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { LeastSquaresProblem } from '../../../src/core/fit/engine/least-squares-types';
import { parseStrd, type StrdProblem } from './parse-strd';
import { STRD_MODELS } from './strd-models';

/** The 27 StRD nonlinear problems, in NIST's order of difficulty (lower, average, higher). */
export const STRD_NAMES = [
  'Misra1a', 'Chwirut2', 'Chwirut1', 'Lanczos3', 'Gauss1', 'Gauss2', 'DanWood', 'Misra1b',
  'Kirby2', 'Hahn1', 'Nelson', 'MGH17', 'Lanczos1', 'Lanczos2', 'Gauss3', 'Misra1c', 'Misra1d', 'Roszman1', 'ENSO',
  'MGH09', 'Thurber', 'BoxBOD', 'Rat42', 'MGH10', 'Eckerle4', 'Rat43', 'Bennett5',
] as const;

/** Read and parse test/nist/data/NAME.dat. */
export function loadStrd(name: string): StrdProblem {
  return parseStrd(name, readFileSync(join(import.meta.dirname, '..', 'data', `${name}.dat`), 'utf8'));
}

/** The StRD problem as a least-squares problem, with or without its analytic Jacobian. */
export function strdLeastSquares(data: StrdProblem, analytic: boolean): LeastSquaresProblem {
  const model = STRD_MODELS[data.name];
  if (model === undefined) throw new Error(`no model for ${data.name}`);
  const p = data.certified.length;
  const x1 = data.x[0]!;
  const x2 = data.x[1] ?? x1;
  const observed = data.y.map((y) => (model.transform === undefined ? y : model.transform(y)));
  const gradient = new Float64Array(p);
  const problem: LeastSquaresProblem = {
    observed,
    parameterCount: p,
    predict(b, out) {
      for (let i = 0; i < observed.length; i++) out[i] = model.value(b, x1[i]!, x2[i]!);
    },
  };
  if (!analytic) return problem;
  return {
    ...problem,
    jacobian(b, out) {
      for (let i = 0; i < observed.length; i++) {
        model.gradient(b, x1[i]!, x2[i]!, gradient);
        for (let j = 0; j < p; j++) out[i * p + j] = gradient[j]!;
      }
    },
  };
}

/** Log relative error −log10(|estimate − certified|/|certified|), capped at 11 (NIST's 11 digits). */
export function logRelativeError(estimate: number, certified: number): number {
  if (!Number.isFinite(estimate)) return 0;
  const relative = Math.abs(estimate - certified) / Math.abs(certified);
  return relative === 0 ? 11 : Math.max(0, Math.min(11, -Math.log10(relative)));
}
