import { describe, expect, it } from 'vitest';
import { dipoleField } from '../physics/dipole-field';
import { loopField } from '../physics/loop-field';
import { loopFieldGradient } from '../physics/loop-field-gradient';
import { fieldReading, fieldReadingDerivative } from './model-reading';
import { modelIds, getModel } from './catalog';
import type { SurveyPoints } from './field-model';

const survey = (distance: number[], radial: number[], kind: SurveyPoints['kind']): SurveyPoints => ({
  n: distance.length, distance: Float64Array.from(distance), radial: Float64Array.from(radial), field: new Float64Array(distance.length), kind,
});
const distance = [0, 0.004, 0.02, 0.05, 0.11, 0.3];
const layouts: [string, number[]][] = [['on the axis', distance.map(() => 0)], ['off the axis', [0.01, 0, 0.03, 0.08, 0.02, 0.2]]];

describe('array kernels give the per-point formulas to the last bit', () => {
  for (const kind of ['axial', 'magnitude'] as const) {
    for (const [where, radial] of layouts) {
      it(`loop, ${kind} readings ${where}: evaluate and jacobian equal loopField / loopFieldGradient per point`, () => {
        // independent method: the physics functions called point by point, as the model did before its kernel
        const model = getModel('loop');
        const params = Float64Array.of(350, 0.05, 0.003, 2e-6);
        const points = survey(distance, radial, kind);
        const value = new Float64Array(points.n);
        const jacobian = new Float64Array(4 * points.n);
        model.evaluate(params, points, value);
        model.jacobian!(params, points, jacobian);
        const b = new Float64Array(2);
        const g = new Float64Array(7);
        for (let i = 0; i < points.n; i++) {
          const z = distance[i]! + params[2]!;
          loopField(params[0]!, params[1]!, z, radial[i]!, b);
          expect(value[i]).toBe(fieldReading(kind, b[0]!, b[1]!) + params[3]!);
          loopFieldGradient(1, params[1]!, z, radial[i]!, g);
          const bz = params[0]! * g[0]!;
          const br = params[0]! * g[1]!;
          expect(jacobian[4 * i]).toBe(fieldReadingDerivative(kind, bz, br, g[0]!, g[1]!));
          expect(jacobian[4 * i + 1]).toBe(fieldReadingDerivative(kind, bz, br, params[0]! * g[5]!, params[0]! * g[6]!));
          expect(jacobian[4 * i + 2]).toBe(fieldReadingDerivative(kind, bz, br, params[0]! * g[2]!, params[0]! * g[3]!));
          expect(jacobian[4 * i + 3]).toBe(1);
        }
      });
    }
  }

  for (const [where, radial] of layouts) {
    it(`dipole, magnitude readings ${where}: evaluate equals dipoleField per point`, () => {
      // independent method: the physics function called point by point, as the model did before its kernel
      const params = Float64Array.of(0.8, 0.002, -3e-6);
      const points = survey(distance.slice(1), radial.slice(1), 'magnitude');
      const value = new Float64Array(points.n);
      getModel('dipole').evaluate(params, points, value);
      const b = new Float64Array(2);
      for (let i = 0; i < points.n; i++) {
        dipoleField(params[0]!, points.distance[i]! + params[1]!, points.radial[i]!, b);
        expect(value[i]).toBe(fieldReading('magnitude', b[0]!, b[1]!) + params[2]!);
      }
    });
  }

  it('every evaluateAtDistances equals evaluate, bit for bit, from the r and ln r of sourceDistances', () => {
    // independent method: the model's own evaluate; exponents 2 and 3 exactly take its 1/r², 1/r³ branches,
    // and an offset that puts the first point behind the datum gives NaN there in both
    let checked = 0;
    for (const id of modelIds) {
      const model = getModel(id);
      if (model.sourceDistances === undefined || model.evaluateAtDistances === undefined) continue;
      const offsetIndex = model.parameters.findIndex((p) => p.role === 'offset');
      const exponentIndex = model.parameters.findIndex((p) => p.role === 'exponent');
      for (const [where, radial] of layouts) {
        const points = survey(distance, radial, 'axial');
        for (const offset of [0.0013, -0.002]) {
          for (const exponent of [2, 3, 2.37, 1.9999999999999998]) {
            const params = Float64Array.from(model.parameters, (p) => (p.role === 'amplitude' ? 3e-7 : p.role === 'background' ? -2e-6 : 0));
            params[offsetIndex] = offset;
            if (exponentIndex >= 0) params[exponentIndex] = exponent;
            const direct = new Float64Array(points.n);
            model.evaluate(params, points, direct);
            const r = new Float64Array(points.n);
            const logR = new Float64Array(points.n);
            model.sourceDistances(offset, points, r, logR);
            const fromDistances = new Float64Array(points.n);
            model.evaluateAtDistances(params, r, logR, fromDistances);
            expect(Array.from(fromDistances), `${id} ${where} δ ${offset} n ${exponent}`).toEqual(Array.from(direct));
            checked += 1;
          }
        }
      }
    }
    // the three power laws (DOMAIN.md §1.9)
    expect(checked).toBe(3 * 2 * 2 * 4);
  });

  it('every normalEquations equals the accumulation of its own jacobian, bit for bit', () => {
    // independent method: JᵀJ and Jᵀr summed row by row from the row-major jacobian (the engine's fallback)
    for (const id of modelIds) {
      const model = getModel(id);
      if (model.normalEquations === undefined) continue;
      const p = model.parameters.length;
      for (const kind of ['axial', 'magnitude'] as const) {
        for (const [, radial] of layouts) {
          const points = survey(distance, radial, kind);
          const params = model.initialGuess({ ...points, field: Float64Array.from(distance, (d) => 1e-3 / (1 + 100 * d)) });
          const weight = Float64Array.from(distance, (_, i) => 1000 + 37 * i);
          const scale = Float64Array.from({ length: p }, (_, j) => 1 + 0.25 * j);
          const residuals = Float64Array.from(distance, (_, i) => 0.1 * (i - 2.5));
          const jacobian = new Float64Array(points.n * p);
          model.jacobian!(params, points, jacobian);
          const gram = new Float64Array(p * p);
          const gradient = new Float64Array(p);
          for (let i = 0; i < points.n; i++) {
            for (let u = 0; u < p; u++) {
              const ju = jacobian[i * p + u]! * weight[i]! * scale[u]!;
              gradient[u]! += ju * residuals[i]!;
              for (let v = 0; v <= u; v++) gram[u * p + v]! += ju * (jacobian[i * p + v]! * weight[i]! * scale[v]!);
            }
          }
          const fusedGram = new Float64Array(p * p);
          const fusedGradient = new Float64Array(p);
          model.normalEquations(params, points, weight, scale, residuals, fusedGram, fusedGradient);
          expect(Array.from(fusedGradient), `${id} ${kind}`).toEqual(Array.from(gradient));
          for (let u = 0; u < p; u++) for (let v = 0; v <= u; v++) expect(fusedGram[u * p + v], `${id} ${u},${v}`).toBe(gram[u * p + v]);
        }
      }
    }
  });
});
