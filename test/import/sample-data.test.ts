import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { RingfallError } from '../../src/core/errors';
import type { ParameterSpec } from '../../src/core/models/field-model';
import { importSurveys, type ImportResult } from '../../src/io/index';
import { parseSpecText } from '../../src/io/spec/parse-spec-text';
import { buildSampleData, type TruthEntry } from '../../scripts/sample-data/build-sample-data';
import { catalogReading } from '../../scripts/sample-data/catalog-reading';
import { loopOffAxis, loopOnAxis, rectangleOnAxis, thickCoilOnAxis } from './closed-form-fields';
import { expectClose } from '../support/expect-close';

const folder = join(import.meta.dirname, '..', '..', 'sample-data');
const read = (path: string) => readFileSync(join(folder, path), 'utf8');
const { files, truth } = buildSampleData();
const truthOf = (file: string) => truth.find((t) => t.file === file) as TruthEntry;

describe('closed-form fields used to check the sample data (test/import/closed-form-fields.ts)', () => {
  it('loopOnAxis() matches DOMAIN.md §9 rows 1–4 (R = 0.1 m, NI = 1 A)', () => {
    // DOMAIN.md §9 rows 1–4 [C], mpmath
    expectClose(loopOnAxis(1, 0.1, 0), 6.2831853106e-6, { rel: 1e-9 });
    expectClose(loopOnAxis(1, 0.1, 0.1), 2.2214414703e-6, { rel: 1e-9 });
    expectClose(loopOnAxis(1, 0.1, 0.2), 5.619851788e-7, { rel: 1e-9 });
    expectClose(loopOnAxis(1, 0.1, 1), 6.190102037e-9, { rel: 1e-9 });
  });

  it('loopOffAxis() matches DOMAIN.md §9 rows 7, 9, 10, 11 and 13', () => {
    // DOMAIN.md §9 rows 7, 9–11 [C], quadrature-checked; row 13 paraxial series
    expectClose(loopOffAxis(1, 0.1, 0.05, 0.05).radial, 1.616890842e-6, { rel: 1e-9 });
    expectClose(loopOffAxis(1, 0.1, 0.05, 0.05).axial, 4.345848938e-6, { rel: 1e-9 });
    expectClose(loopOffAxis(1, 0.1, 0.15, 0).axial, -1.789118915e-6, { rel: 1e-9 });
    expectClose(loopOffAxis(1, 0.1, 0.2, 0.1).radial, 4.042227104e-7, { rel: 1e-9 });
    expectClose(loopOffAxis(1, 0.1, 0.2, 0.1).axial, -6.310294832e-8, { rel: 1e-8 });
    expectClose(loopOffAxis(1, 0.1, 0.1, 0.05).radial, 3.293511623e-6, { rel: 1e-9 });
    expectClose(loopOffAxis(1, 0.1, 0.1, 0.05).axial, 1.708765523e-6, { rel: 1e-9 });
    expectClose(loopOffAxis(1, 0.1, 1e-6, 0.05).radial, 2.697528858e-11, { rel: 1e-8 });
  });

  it('rectangleOnAxis() and thickCoilOnAxis() match DOMAIN.md §9 rows 18–20 and 28–29', () => {
    // DOMAIN.md §9 rows 28–29 [C]
    expectClose(rectangleOnAxis(1, 0.2, 0.1, 0), 8.94427191487e-6, { rel: 1e-9 });
    expectClose(rectangleOnAxis(1, 0.2, 0.1, 0.05), 4.57238085568e-6, { rel: 1e-9 });
    expectClose(rectangleOnAxis(1, 0.2, 0.1, 0.1), 1.73333333428e-6, { rel: 1e-9 });
    // DOMAIN.md §9 rows 18–20 [C] (N = 500, I = 1 A, a₁ = 20 mm, a₂ = 40 mm, L = 50 mm)
    expectClose(thickCoilOnAxis(500, 0.02, 0.04, 0.05, 0), 8.11025818787e-3, { rel: 1e-9 });
    expectClose(thickCoilOnAxis(500, 0.02, 0.04, 0.05, 0.025), 5.38206558032e-3, { rel: 1e-9 });
    expectClose(thickCoilOnAxis(500, 0.02, 0.04, 0.05, 0.1), 2.79502027672e-4, { rel: 1e-9 });
  });
});

describe('sample-data generator fields (scripts/sample-data/catalog-reading.ts)', () => {
  it('catalogReading() of the model catalog equals the closed forms at every sample coil, on and off axis', () => {
    const distances = [0, 0.002, 0.01, 0.03, 0.05, 0.1, 0.2, 0.3];
    for (const entry of truth.flatMap((t) => t.surveys ?? [t])) {
      const p = entry.params;
      const axial = catalogReading(entry.model as 'loop', p, 'axial');
      const magnitude = catalogReading(entry.model as 'loop', p, 'magnitude');
      for (const d of distances) {
        const z = d + (p['probeOffset'] ?? NaN);
        const background = p['background'] ?? NaN;
        // DOMAIN.md §1.1, §1.2, §1.4, §1.6 closed forms (independent code, checked against §9 above)
        if (entry.model === 'loop') {
          expectClose(axial(d), loopOnAxis(p['ampereTurns'] ?? NaN, p['radius'] ?? NaN, z) + background, { rel: 1e-9, abs: 1e-15 }, `${entry.coil} d=${d}`);
          const off = loopOffAxis(p['ampereTurns'] ?? NaN, p['radius'] ?? NaN, 0.03, z);
          expectClose(magnitude(d, 0.03), Math.hypot(off.axial, off.radial) + background, { rel: 1e-9, abs: 1e-15 }, `${entry.coil} d=${d} ρ=30 mm`);
        } else if (entry.model === 'coil-pair') {
          // a scan (params.centre): d is a signed ruler position; the two loops sit ± separation/2 about the centre
          const x = d - 0.1 - (p['centre'] ?? NaN);
          const pair = (z: number) => loopOnAxis(p['ampereTurns'] ?? NaN, p['radius'] ?? NaN, z - (p['separation'] ?? NaN) / 2) + loopOnAxis(p['ampereTurns'] ?? NaN, p['radius'] ?? NaN, z + (p['separation'] ?? NaN) / 2);
          expectClose(axial(d - 0.1), pair(x) + background, { rel: 1e-9 }, `${entry.coil} position ${d - 0.1}`);
        } else if (entry.model === 'rectangle') {
          expectClose(axial(d), rectangleOnAxis(p['ampereTurns'] ?? NaN, p['width'] ?? NaN, p['height'] ?? NaN, z) + background, { rel: 1e-9 });
        } else {
          expect(entry.model).toBe('thick-coil');
          const centre = z + (p['length'] ?? NaN) / 2;
          expectClose(axial(d), thickCoilOnAxis(p['ampereTurns'] ?? NaN, p['innerRadius'] ?? NaN, p['outerRadius'] ?? NaN, p['length'] ?? NaN, centre) + background, { rel: 1e-9 });
        }
      }
    }
  });
});

describe('sample-data/ files', () => {
  it('the committed sample files are exactly what scripts/make-sample-data.ts generates (seeded)', () => {
    for (const [path, text] of files) expect(read(path), path).toBe(text);
  });

  it('every sample CSV file says it is invented data in a "# note:" line', () => {
    for (const path of [...files.keys()].filter((p) => p.endsWith('.csv'))) expect(read(path), path).toMatch(/^# note: INVENTED sample data/mu);
  });

  /** Residual of each reading from the truth, in units of the noise model's standard deviation. */
  function standardizedResiduals(result: ImportResult, entry: TruthEntry, predict: (distance: number, radial: number, params: Readonly<Record<string, number>>) => number): number[] {
    const surveys = entry.surveys ?? [entry];
    return surveys.flatMap((expected) => {
      const survey = result.surveys.find((s) => s.coil === expected.coil && s.date === expected.date);
      expect(survey, `${expected.coil} ${expected.date}`).toBeDefined();
      expect(survey?.readingType).toBe(expected.readingType);
      return (survey?.readings ?? []).map((reading) => {
        const model = predict(reading.distance + (expected.params['probeOffset'] ?? 0), reading.radial, expected.params) + (expected.params['background'] ?? 0);
        const sd = Math.hypot(entry.noise.relativeSd * model, entry.noise.floorSd, 0.05 * model * entry.noise.positionSd / 1e-3);
        return (reading.field - model) / sd;
      });
    });
  }

  const loop = (z: number, rho: number, p: Readonly<Record<string, number>>) => {
    const { axial, radial } = loopOffAxis(p['ampereTurns'] ?? NaN, p['radius'] ?? NaN, rho, z);
    return rho === 0 ? axial : Math.hypot(axial, radial);
  };
  // rows per file, counted from scripts/sample-data: healthyOrderMm (25 distances + 3 repeats of 20 mm),
  // applicatorDistancesMm (25), the mat's 15 and the thick coil's 17 distances, the 5 × 6 grid, fleet 3 coils × 5 dates × 12,
  // the pair scan's 55 positions
  const cases: [file: string, predict: typeof loop, rows: number][] = [
    ['qa-107-2025-03-11-healthy.csv', loop, 28],
    ['qa-107-2026-03-10-degraded.csv', loop, 25],
    ['qa-214-2026-02-17-mislabeled.csv', loop, 25],
    ['qm-03-2026-01-20-mat.csv', (z, _rho, p) => rectangleOnAxis(p['ampereTurns'] ?? NaN, p['width'] ?? NaN, p['height'] ?? NaN, z), 15],
    ['qt-9-2026-02-03-thick.csv', (z, _rho, p) => thickCoilOnAxis(p['ampereTurns'] ?? NaN, p['innerRadius'] ?? NaN, p['outerRadius'] ?? NaN, p['length'] ?? NaN, z + (p['length'] ?? NaN) / 2), 17],
    ['qa-330-2026-03-02-offaxis-grid.csv', loop, 30],
    ['fleet-log-2025-2026.csv', loop, 180],
    // a scan: the "distance" is the signed ruler position, probeOffset absent (0); the loops at centre ± separation/2
    ['qh-70-2026-03-05-pair-scan.csv', (z, _rho, p) => loopOnAxis(p['ampereTurns'] ?? NaN, p['radius'] ?? NaN, z - (p['centre'] ?? NaN) - (p['separation'] ?? NaN) / 2)
      + loopOnAxis(p['ampereTurns'] ?? NaN, p['radius'] ?? NaN, z - (p['centre'] ?? NaN) + (p['separation'] ?? NaN) / 2), 55],
  ];
  for (const [file, predict, rows] of cases) {
    it(`${file} imports whole and agrees with TRUTH.json within the stated noise`, () => {
      const result = importSurveys(read(file), { source: file });
      expect(result.counts).toMatchObject({ dataRows: rows, used: rows, rejected: 0 });
      const residuals = standardizedResiduals(result, truthOf(file), predict);
      expect(residuals).toHaveLength(rows);
      // noise is N(0, 1) per reading by construction; 5 SD allows rounding and placement scatter
      for (const r of residuals) expect(Math.abs(r)).toBeLessThan(5);
      // the mean of n ≥ 15 N(0, 1) residuals has SD ≤ 1/√15 ≈ 0.26, so 1.5 is about 6 SD (closed form)
      expect(Math.abs(residuals.reduce((a, b) => a + b, 0) / rows)).toBeLessThan(1.5);
    });
  }

  it('fleet-log-2025-2026.csv holds 15 surveys: three coils on five dates', () => {
    const result = importSurveys(read('fleet-log-2025-2026.csv'), { source: 'fleet' });
    expect(result.surveys).toHaveLength(15);
    expect(new Set(result.surveys.map((s) => s.coil))).toEqual(new Set(['QA-107', 'QA-330', 'QA-412']));
  });

  it('flawed/bad-rows.csv gives the rejections TRUTH.json expects and uses the rest', () => {
    const entry = truthOf('flawed/bad-rows.csv');
    const result = importSurveys(read('flawed/bad-rows.csv'), { source: 'bad-rows.csv' });
    const codes = [...result.surveys.flatMap((s) => s.rejected), ...result.unassigned].map((r) => r.code).sort();
    expect(result.counts.used).toBe(entry.expected?.['used']);
    expect(codes).toEqual(entry.expected?.['rejectedCodes']);
  });

  it('flawed/no-field-unit.csv is refused with IMPORT_FIELD_UNIT_MISSING and imports with fieldUnit mT', () => {
    const text = read('flawed/no-field-unit.csv');
    expect(() => importSurveys(text, { source: 'no-unit.csv' })).toThrow(RingfallError);
    try {
      importSurveys(text, { source: 'no-unit.csv' });
    } catch (error) {
      expect((error as RingfallError).code).toBe('IMPORT_FIELD_UNIT_MISSING');
    }
    // the healthy QA-107 survey: healthyOrderMm has 28 distances (scripts/sample-data/build-sample-data.ts)
    expect(importSurveys(text, { source: 'no-unit.csv', fieldUnit: 'mT' }).counts.used).toBe(28);
  });

  it('flawed/reversed-probe.csv is flipped, with a note, and then agrees with TRUTH.json', () => {
    const file = 'flawed/reversed-probe.csv';
    const result = importSurveys(read(file), { source: file });
    expect(result.surveys[0]?.notes[0]).toContain('probe read reversed');
    const residuals = standardizedResiduals(result, truthOf(file), loop);
    for (const r of residuals) expect(Math.abs(r)).toBeLessThan(5);
  });

  it('every spec file reads with the project spec reader under the DESIGN.md parameter names', () => {
    // DESIGN.md "The fit-model catalog": parameter names and SI units per model id
    const names: Record<string, [string, ParameterSpec['unit']][]> = {
      loop: [['ampereTurns', 'A'], ['radius', 'm'], ['probeOffset', 'm'], ['background', 'T']],
      rectangle: [['ampereTurns', 'A'], ['width', 'm'], ['height', 'm'], ['probeOffset', 'm'], ['background', 'T']],
      'thick-coil': [['ampereTurns', 'A'], ['innerRadius', 'm'], ['outerRadius', 'm'], ['length', 'm'], ['probeOffset', 'm'], ['background', 'T']],
      'coil-pair': [['ampereTurns', 'A'], ['radius', 'm'], ['separation', 'm'], ['probeOffset', 'm'], ['background', 'T']],
    };
    const role = (name: string): ParameterSpec['role'] => (name === 'ampereTurns' ? 'amplitude' : name === 'probeOffset' ? 'offset' : name === 'background' ? 'background' : 'geometry');
    const catalog = (id: string) => names[id]?.map(([name, unit]) => ({ name, unit, role: role(name), lower: -Infinity, upper: Infinity, description: name }));
    const specPaths = [...files.keys()].filter((p) => p.endsWith('.spec.json'));
    // seven coils' specs plus all-coils.spec.json (scripts/sample-data/build-spec-files.ts)
    expect(specPaths).toHaveLength(8);
    for (const path of specPaths) expect(parseSpecText(read(path), path, catalog, Object.keys(names)).length, path).toBeGreaterThan(0);
    expect(parseSpecText(read('specs/all-coils.spec.json'), 'all', catalog, Object.keys(names)).flatMap((s) => s.coils ?? [])).toEqual(['QA-107', 'QA-214', 'QA-330', 'QA-412', 'QM-03', 'QT-9', 'QH-70']);
  });
});
