import { describe, expect, it } from 'vitest';
import { getModel } from './index';
import type { FieldModel, SurveyPoints } from './field-model';
import { scanSize, surveyReach } from './initial-guess';
import { brentMinimum } from '../numeric/brent-minimum';
import { mulberry32 } from '../random/mulberry32';

/**
 * regression pin, not truth: scanSize as it was before its coarse-to-fine pass, evaluating
 * all 48 candidates. The coarse-to-fine pass must choose the same start.
 */
function fullGridScanSize(model: FieldModel, points: SurveyPoints, shape: (size: number, out: Float64Array) => void, hint?: number): Float64Array {
  const predicted = new Float64Array(points.n);
  const params = new Float64Array(model.parameters.length);
  const inverse = Float64Array.from(points.field, (y) => (y === 0 || !Number.isFinite(y) ? 0 : 1 / y));
  let amplitude = 1;
  const misfit = (size: number): number => {
    shape(size, params);
    model.evaluate(params, points, predicted);
    let numerator = 0;
    let denominator = 0;
    for (let i = 0; i < points.n; i++) {
      const q = predicted[i]! * inverse[i]!;
      predicted[i] = q;
      if (inverse[i] === 0 || !Number.isFinite(q)) continue;
      numerator += q;
      denominator += q * q;
    }
    amplitude = 1;
    if (!(denominator > 0)) return Infinity;
    amplitude = numerator / denominator;
    let cost = 0;
    for (let i = 0; i < points.n; i++) {
      const q = predicted[i]!;
      if (inverse[i] === 0 || !Number.isFinite(q)) continue;
      cost += (1 - amplitude * q) ** 2;
    }
    return cost;
  };
  const reach = surveyReach(points);
  let bestSize = reach;
  let bestCost = misfit(reach);
  let bestAmplitude = amplitude;
  const consider = (size: number): void => {
    const cost = misfit(size);
    if (cost < bestCost) [bestCost, bestSize, bestAmplitude] = [cost, size, amplitude];
  };
  const ratio = 1000 ** (1 / 47);
  for (let i = 0; i < 48; i++) consider(reach * 0.01 * ratio ** i);
  if (hint !== undefined && hint > 0 && Number.isFinite(hint)) consider(hint);
  const refined = Math.exp(brentMinimum((x) => misfit(Math.exp(x)), Math.log(bestSize / ratio), Math.log(bestSize * ratio), 1e-6, 24, Math.log(bestSize), bestCost));
  if (misfit(refined) <= bestCost) [bestSize, bestAmplitude] = [refined, amplitude];
  const result = new Float64Array(model.parameters.length);
  shape(bestSize, result);
  result[0] = bestAmplitude;
  return result;
}

describe('scanSize() coarse to fine', () => {
  it('chooses the same start as the pass over every candidate, for loop and solenoid surveys with noise', () => {
    const random = mulberry32(15);
    const shapes: [string, (s: number, out: Float64Array) => void, number[]][] = [
      ['loop', (s, out) => out.set([1, s, 0, 0]), [400, 0.05, 0.003, 1e-5]],
      ['solenoid', (s, out) => out.set([1, s, s, 0, 0]), [300, 0.03, 0.12, 0.002, 0]],
    ];
    for (const [id, shape, truth] of shapes) {
      const model = getModel(id as 'loop');
      for (let trial = 0; trial < 40; trial++) {
        const n = 8 + Math.floor(random() * 25);
        const far = 0.05 + random() * 0.5;
        const distance = Float64Array.from({ length: n }, (_, i) => (far * (i + random())) / n);
        const points: SurveyPoints = { n, distance, radial: new Float64Array(n), field: new Float64Array(n), kind: 'axial' };
        const scaled = Float64Array.from(truth, (v, j) => (j === 1 || j === 2 ? v * (0.2 + 4 * random()) : v));
        model.evaluate(scaled, points, points.field as Float64Array);
        for (let i = 0; i < n; i++) (points.field as Float64Array)[i]! *= 1 + 0.03 * (random() - 0.5);
        const hint = random() < 0.5 ? undefined : far * random();
        expect(Array.from(scanSize(model, points, shape, 0, hint)), `${id} trial ${trial}`).toEqual(Array.from(fullGridScanSize(model, points, shape, hint)));
      }
    }
  });
});
