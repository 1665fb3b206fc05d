import { describe, expect, it } from 'vitest';
import { getModel, isModelId, modelIds, scanModel } from './index';
import type { FieldModel, SurveyPoints } from './field-model';
import { RingfallError } from '../errors';
import { expectClose } from '../../../test/support/expect-close';
import { centralDifference } from '../../../test/support/central-difference';

const survey = (distance: number[], radial: number[] = distance.map(() => 0), kind: SurveyPoints['kind'] = 'magnitude'): SurveyPoints => ({
  n: distance.length,
  distance: Float64Array.from(distance),
  radial: Float64Array.from(radial),
  field: new Float64Array(distance.length),
  kind,
});

const predict = (model: FieldModel, params: number[], points: SurveyPoints): number[] => {
  const out = new Float64Array(points.n);
  model.evaluate(Float64Array.from(params), points, out);
  return Array.from(out);
};

describe('model catalog', () => {
  it('modelIds lists the DESIGN.md catalog and getModel() returns each model under its id', () => {
    // DESIGN.md "The fit-model catalog" table
    expect(modelIds).toEqual(['loop', 'thick-coil', 'solenoid', 'coil-pair', 'rectangle', 'dipole', 'power-law', 'inverse-square', 'inverse-cube']);
    for (const id of modelIds) {
      expect(getModel(id).id).toBe(id);
      expect(isModelId(id)).toBe(true);
    }
    expect(isModelId('helix')).toBe(false);
    expect(isModelId('toString')).toBe(false);
  });

  it('each model has exactly the DESIGN.md parameters, in order, with SI units', () => {
    // DESIGN.md catalog table (parameter names are part of the CLI and JSON contract)
    const expected: Record<string, [string, string][]> = {
      'loop': [['ampereTurns', 'A'], ['radius', 'm'], ['probeOffset', 'm'], ['background', 'T']],
      'thick-coil': [['ampereTurns', 'A'], ['innerRadius', 'm'], ['outerRadius', 'm'], ['length', 'm'], ['probeOffset', 'm'], ['background', 'T']],
      'solenoid': [['ampereTurns', 'A'], ['radius', 'm'], ['length', 'm'], ['probeOffset', 'm'], ['background', 'T']],
      'coil-pair': [['ampereTurns', 'A'], ['radius', 'm'], ['separation', 'm'], ['probeOffset', 'm'], ['background', 'T']],
      'rectangle': [['ampereTurns', 'A'], ['width', 'm'], ['height', 'm'], ['probeOffset', 'm'], ['background', 'T']],
      'dipole': [['moment', 'A·m²'], ['probeOffset', 'm'], ['background', 'T']],
      'power-law': [['amplitude', 'T·m^n'], ['exponent', '1'], ['probeOffset', 'm'], ['background', 'T']],
      'inverse-square': [['amplitude', 'T·m^n'], ['probeOffset', 'm'], ['background', 'T']],
      'inverse-cube': [['amplitude', 'T·m^n'], ['probeOffset', 'm'], ['background', 'T']],
    };
    for (const id of modelIds) {
      const model = getModel(id);
      expect(model.parameters.map((p) => [p.name, p.unit])).toEqual(expected[id]);
      for (const p of model.parameters) {
        expect(p.lower).toBeLessThan(p.upper);
        expect(p.description.length).toBeGreaterThan(5);
      }
      expect(model.physical).toBe(!id.includes('power') && !id.startsWith('inverse'));
    }
  });

  it('each parameter says its role, and a name has the same role in every model', () => {
    // DOMAIN.md §5 (amplitude scales the curve, geometry changes its shape) and §3.1, §3.4
    // (probe offset, background); the exponent of DESIGN.md's power law
    const expected = new Map<string, string>([
      ['ampereTurns', 'amplitude'], ['moment', 'amplitude'], ['amplitude', 'amplitude'],
      ['radius', 'geometry'], ['innerRadius', 'geometry'], ['outerRadius', 'geometry'], ['length', 'geometry'],
      ['separation', 'geometry'], ['width', 'geometry'], ['height', 'geometry'],
      ['probeOffset', 'offset'], ['background', 'background'], ['exponent', 'exponent'],
    ]);
    for (const id of modelIds) for (const p of getModel(id).parameters) expect(p.role, `${id} ${p.name}`).toBe(expected.get(p.name));
    // a scan fits the centre of the scan in place of the probe offset (DEVELOPERS.md, scans)
    expect(scanModel(getModel('loop')).parameters.map((p) => p.role)).toEqual(['amplitude', 'geometry', 'centre', 'background']);
  });

  it('getModel() rejects an unknown id with code MODEL_UNKNOWN naming the choices', () => {
    // STYLE.md errors: class, code and a message fragment
    const thrown = (() => { try { getModel('helix'); } catch (e) { return e; } })();
    expect(thrown).toBeInstanceOf(RingfallError);
    expect((thrown as RingfallError).code).toBe('MODEL_UNKNOWN');
    expect((thrown as RingfallError).message).toContain('Use one of: loop, thick-coil');
  });
});

describe('model readings and distance datums', () => {
  it('loop reads μ0NI/2R at the winding plane and follows DOMAIN §1.1 along the axis, plus background', () => {
    // DOMAIN.md §9 rows 1–4 (R = 0.1 m, NI = 1 A)
    const values = predict(getModel('loop'), [1, 0.1, 0, 0], survey([0, 0.1, 0.2, 1]));
    [6.2831853106e-6, 2.2214414703e-6, 5.619851788e-7, 6.190102037e-9].forEach((v, i) => expectClose(values[i]!, v, { rel: 1e-9 }));
    // the probe offset moves the sensing point out: distance 0.08 + offset 0.02 reads like z = 0.1 m
    expectClose(predict(getModel('loop'), [1, 0.1, 0.02, 5e-5], survey([0.08]))[0]!, 2.2214414703e-6 + 5e-5, { rel: 1e-9 });
  });

  it('loop reads |B| for magnitude and the signed B_z for axial readings off the axis', () => {
    // DOMAIN.md §9 row 9: outside in the plane B_z = −1.789118915e-6 T, B_ρ = 0; row 7 components
    expectClose(predict(getModel('loop'), [1, 0.1, 0, 0], survey([0], [0.15], 'axial'))[0]!, -1.789118915e-6, { rel: 1e-9 });
    expectClose(predict(getModel('loop'), [1, 0.1, 0, 0], survey([0], [0.15]))[0]!, 1.789118915e-6, { rel: 1e-9 });
    expectClose(predict(getModel('loop'), [1, 0.1, 0, 0], survey([0.05], [0.05]))[0]!, Math.hypot(4.345848938e-6, 1.616890842e-6), { rel: 1e-9 });
  });

  it('solenoid and thick-coil distances start at the near face of the winding', () => {
    // DOMAIN.md §9 rows 15–16 (end face and 0.05 m beyond it) and rows 19–20
    const solenoid = predict(getModel('solenoid'), [100, 0.02, 0.1, 0, 0], survey([0, 0.05]));
    expectClose(solenoid[0]!, 6.16117009736e-4, { rel: 1e-10 });
    expectClose(solenoid[1]!, 3.94277479621e-5, { rel: 1e-10 });
    const thick = predict(getModel('thick-coil'), [500, 0.02, 0.04, 0.05, 0, 0], survey([0, 0.025, 0.075]));
    expectClose(thick[0]!, 5.38206558032e-3, { rel: 1e-10 });
    expectClose(thick[1]!, 1.76991145567e-3, { rel: 1e-10 });
    expectClose(thick[2]!, 2.79502027672e-4, { rel: 1e-10 });
    // swapped radii give the same coil
    expect(predict(getModel('thick-coil'), [500, 0.04, 0.02, 0.05, 0, 0], survey([0.01], [0.03]))).toEqual(
      predict(getModel('thick-coil'), [500, 0.02, 0.04, 0.05, 0, 0], survey([0.01], [0.03])));
  });

  it('coil-pair distances start at the midpoint; rectangle and dipole at the coil plane', () => {
    // DOMAIN.md §9 rows 23 (Helmholtz centre), 28 (rectangle centre), 31 (dipole on axis)
    expectClose(predict(getModel('coil-pair'), [1, 0.1, 0.1, 0, 0], survey([0]))[0]!, 8.991762861e-6, { rel: 1e-9 });
    expectClose(predict(getModel('rectangle'), [1, 0.2, 0.1, 0, 0], survey([0]))[0]!, 8.94427191487e-6, { rel: 1e-10 });
    expectClose(predict(getModel('dipole'), [Math.PI * 0.01, 0, 0], survey([0.1]))[0]!, 6.283185311e-6, { rel: 1e-9 });
  });

  it('power laws read amplitude/(d + offset)^n + background', () => {
    // DESIGN.md catalog: B = amplitude / (d + probeOffset)^exponent
    expectClose(predict(getModel('power-law'), [2e-6, 1.5, 0.01, 1e-7], survey([0.03]))[0]!, 2e-6 / 0.04 ** 1.5 + 1e-7, { rel: 1e-14 });
    expectClose(predict(getModel('inverse-square'), [2e-6, 0.01, 0], survey([0.03]))[0]!, 2e-6 / 0.04 ** 2, { rel: 1e-14 });
    expectClose(predict(getModel('inverse-cube'), [2e-6, 0.01, 0], survey([0.03]))[0]!, 2e-6 / 0.04 ** 3, { rel: 1e-14 });
    expect(predict(getModel('inverse-cube'), [2e-6, -0.05, 0], survey([0.03]))[0]).toBeNaN();
  });
});

describe('canonicalParameters()', () => {
  it('rectangle reports the longer side as width when every reading is on the axis, and only then', () => {
    // DOMAIN.md §1.6: the on-axis field is symmetric in the two sides, so both orders predict the same readings
    const model = getModel('rectangle');
    const onAxis = survey([0, 0.05, 0.1]);
    const params = Float64Array.of(10, 0.1, 0.2, 0.002, 0);
    const before = predict(model, Array.from(params), onAxis);
    expect(model.canonicalParameters!(params, onAxis, [false, false, false, false, false])).toBe(true);
    expect(Array.from(params)).toEqual([10, 0.2, 0.1, 0.002, 0]);
    predict(model, Array.from(params), onAxis).forEach((value, i) => expectClose(value, before[i]!, { rel: 1e-15 }));
    // already canonical, a side held by the user, or a reading off the axis: left alone
    expect(model.canonicalParameters!(params, onAxis, [false, false, false, false, false])).toBe(false);
    const swapped = Float64Array.of(10, 0.1, 0.2, 0.002, 0);
    expect(model.canonicalParameters!(swapped, onAxis, [false, true, false, false, false])).toBe(false);
    expect(model.canonicalParameters!(swapped, survey([0, 0.05], [0, 0.03]), [false, false, false, false, false])).toBe(false);
    expect(Array.from(swapped)).toEqual([10, 0.1, 0.2, 0.002, 0]);
  });
});

describe('analytic Jacobians', () => {
  const cases: [string, number[], number[], number[]][] = [
    ['loop', [400, 0.05, 0.003, 2e-5], [0, 0.01, 0.04, 0.1, 0.3, 0.02], [0, 0, 0.02, 0.03, 0.1, 0.06]],
    ['thick-coil', [500, 0.02, 0.04, 0.05, 0.002, 1e-5], [0, 0.01, 0.03, 0.08, 0.004], [0, 0.01, 0, 0.05, 0.03]],
    ['thick-coil', [500, 0.04, 0.02, 0.05, 0.002, 1e-5], [0.01, 0.03], [0.02, 0]],
    ['solenoid', [100, 0.02, 0.1, 0.001, 0], [0, 0.01, 0.05, 0.2, 0.003], [0, 0.01, 0, 0.04, 0.021]],
    ['coil-pair', [50, 0.1, 0.12, 0.004, -1e-5], [0, 0.02, 0.08, 0.3], [0, 0.05, 0, 0.1]],
    ['rectangle', [10, 0.2, 0.1, 0.002, 0], [0, 0.02, 0.05, 0.3, 0.04], [0, 0, 0.03, 0.2, -0.12]],
    ['dipole', [0.3, 0.01, 1e-6], [0.05, 0.1, 0.4], [0, 0.05, 0.1]],
    ['power-law', [3e-7, 2.4, 0.004, 1e-6], [0.02, 0.05, 0.1], [0, 0.01, 0]],
    ['inverse-square', [3e-7, 0.004, 1e-6], [0.02, 0.05, 0.1], [0, 0.01, 0]],
    ['inverse-cube', [3e-9, 0.004, 1e-6], [0.02, 0.05, 0.1], [0, 0.01, 0]],
  ];
  for (const [id, params, distance, radial] of cases) {
    for (const kind of ['magnitude', 'axial'] as const) {
      it(`${id} jacobian() matches central differences of evaluate() to 1e-6 relative (${kind})`, () => {
        // independent check: finite differences of the (separately verified) predictions
        const model = getModel(id);
        const points = survey(distance, radial, kind);
        const k = params.length;
        const analytic = new Float64Array(points.n * k);
        model.jacobian!(Float64Array.from(params), points, analytic);
        for (let j = 0; j < k; j++) {
          const typical = j === k - 1 ? 1e-4 : Math.abs(params[j]!) || 0.01;
          const numeric = centralDifference((value) => {
            const varied = [...params];
            varied[j] = value;
            return predict(model, varied, points);
          }, params[j]!, typical);
          const columnSize = Math.max(...numeric.map(Math.abs));
          for (let i = 0; i < points.n; i++) {
            expectClose(analytic[i * k + j]!, numeric[i]!, { rel: 1e-6, abs: 1e-6 * columnSize }, `${id} ∂/∂${model.parameters[j]!.name} at point ${i}`);
          }
        }
      });
    }
  }
});

describe('components()', () => {
  it('every catalog model gives the source field alone at one position, consistent with evaluate()', () => {
    // field-model.ts contract: reading = |B| or B_z of components + background
    const params: Record<string, number[]> = {
      'loop': [400, 0.05, 0.003, 2e-5],
      'thick-coil': [500, 0.02, 0.04, 0.05, 0.002, 1e-5],
      'solenoid': [100, 0.02, 0.1, 0.001, 3e-6],
      'coil-pair': [50, 0.1, 0.12, 0.004, -1e-5],
      'rectangle': [10, 0.2, 0.1, 0.002, 0],
      'dipole': [0.3, 0.01, 1e-6],
      'power-law': [3e-7, 2.4, 0.004, 1e-6],
      'inverse-square': [3e-7, 0.004, 1e-6],
      'inverse-cube': [3e-9, 0.004, 1e-6],
    };
    const out = new Float64Array(2);
    for (const id of modelIds) {
      const model = getModel(id);
      const p = params[id]!;
      model.components!(Float64Array.from(p), 0.03, 0.02, out);
      const background = p[p.length - 1]!;
      expectClose(predict(model, p, survey([0.03], [0.02]))[0]!, Math.hypot(out[0]!, out[1]!) + background, { rel: 1e-14 }, id);
      expectClose(predict(model, p, survey([0.03], [0.02], 'axial'))[0]!, out[0]! + background, { rel: 1e-14 }, id);
    }
  });

  it('loop components() at 10 mm out and 20 mm off axis of a 1 A·turn, 50 mm loop match the elliptic closed form', () => {
    // computed with mpmath 1.3.0 (DOMAIN.md §1.2 with ellipk/ellipe, 30 digits): a = 0.05, z = 0.01, ρ = 0.02
    const out = new Float64Array(2);
    getModel('loop').components!(Float64Array.of(1, 0.05, 0, 0), 0.01, 0.02, out);
    expectClose(out[0]!, 1.3050886516024164e-5, { rel: 1e-13 });
    expectClose(out[1]!, 1.8077389170466586e-6, { rel: 1e-13 });
  });
});

