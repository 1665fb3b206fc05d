import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { afterEach, describe, expect, it } from 'vitest';
import { loopField } from './loop-field';
import { loopFieldBatch, loopFieldBatchEngine, type LoopFieldBatchEngine } from './loop-field-batch';
import { loopFieldKernelHex } from './loop-field-kernel';
import { loopByBiotSavart } from '../../../test/support/biot-savart';
import { expectClose } from '../../../test/support/expect-close';
import { compileKernel, kernelSourcePath } from '../../../scripts/loop-kernel-build';

const engines: LoopFieldBatchEngine[] = ['wasm-simd', 'typescript'];
const single = new Float64Array(2);

/** loopFieldBatch's output at every point, and loopField's, as [bz, br] pairs. */
function both(ampereTurns: number, radius: number, z: number[], rho: number[]) {
  const zs = Float64Array.from(z);
  const rhos = Float64Array.from(rho);
  const axial = new Float64Array(z.length);
  const radial = new Float64Array(z.length);
  loopFieldBatch(ampereTurns, radius, zs, rhos, axial, radial);
  return z.map((zi, i) => {
    loopField(ampereTurns, radius, zi, rho[i]!, single);
    return { batch: [axial[i], radial[i]], single: [single[0], single[1]] };
  });
}

afterEach(() => loopFieldBatchEngine.select('wasm-simd'));

describe('loopFieldBatch()', () => {
  it('runs the WebAssembly SIMD kernel under Node 20', () => {
    // Node ≥ 16.4 ships WebAssembly SIMD (V8 9.1); the page's browsers do too
    expect(loopFieldBatchEngine.current()).toBe('wasm-simd');
    loopFieldBatchEngine.select('typescript');
    expect(loopFieldBatchEngine.current()).toBe('typescript');
  });

  for (const engine of engines) {
    it(`returns exactly loopField() in every regime (${engine})`, () => {
      loopFieldBatchEngine.select(engine);
      expect(loopFieldBatchEngine.current()).toBe(engine);
      // on axis, paraxial, bulk, either side of m = 0.999, on and next to the wire, mirror
      // points, far away, an odd count (the kernel's padded lane)
      const z = [0.03, 0.05, 0.05, 0.02, 0.001, -0.3, 10, 0, 0.002, 0.002, 0, 1e-5, 1e3, -0.04, 0.07];
      const rho = [0, 1e-7, 0.05, -0.13, 0.0999, 0.2, 3, 0.1, 0.09419351781154074, 0.09419353665024618,
        0.05, 0.1, 200, -0.07, 0.3];
      for (const { batch, single: expected } of both(4, 0.1, z, rho)) expect(batch).toEqual(expected);
    });

    it(`returns exactly loopField() at arbitrary points, across chunk boundaries (${engine})`, () => {
      loopFieldBatchEngine.select(engine);
      // property: bit-for-bit equality (common practice: one formula, two implementations)
      const coordinate = fc.double({ min: -2, max: 2, noNaN: true });
      fc.assert(
        fc.property(
          fc.double({ min: 1e-3, max: 1, noNaN: true }),
          fc.array(fc.tuple(coordinate, coordinate), { minLength: 1, maxLength: 5000 }),
          (radius, points) => {
            const z = points.map((p) => p[0]);
            const rho = points.map((p) => p[1]);
            return both(2.5, radius, z, rho).every(
              ({ batch, single: expected }) => Object.is(batch[0], expected[0]) && Object.is(batch[1], expected[1]),
            );
          },
        ),
        { seed: 20261202, numRuns: 60 },
      );
    });
  }

  it('refuses a count longer than an array instead of reading past it', () => {
    const short = new Float64Array(3);
    const long = new Float64Array(5);
    expect(() => loopFieldBatch(1, 0.1, long, long, short, long)).toThrow(RangeError);
    expect(() => loopFieldBatch(1, 0.1, short, short, short, short, 4)).toThrow(/count 4/);
    expect(() => loopFieldBatch(1, 0.1, long, long, long, long, 0)).not.toThrow();
  });

  it('agrees with direct Biot–Savart integration over a survey-like cloud of points', () => {
    // independent: trapezoid rule on the Biot–Savart integrand (test/support/biot-savart.ts)
    const radius = 0.05;
    const z: number[] = [];
    const rho: number[] = [];
    for (let i = 0; i < 41; i++) {
      z.push(((i % 7) - 3) * 0.021 * radius * 7);
      rho.push((0.003 + 0.071 * i) * radius);
    }
    both(400, radius, z, rho).forEach(({ batch }, i) => {
      const [bz, br] = loopByBiotSavart(400, radius, z[i]!, rho[i]!);
      const size = Math.hypot(bz, br);
      expectClose(batch[0]!, bz, { abs: 2e-12 * size }, `B_z at z = ${z[i]}, ρ = ${rho[i]}`);
      expectClose(batch[1]!, br, { abs: 2e-12 * size }, `B_ρ at z = ${z[i]}, ρ = ${rho[i]}`);
    });
  });
});

describe('loop-field-kernel.ts', () => {
  it('holds exactly the bytes wat2wasm makes from loop-field-kernel.wat', async () => {
    // wabt 1.0.39 (the WebAssembly Binary Toolkit's wat2wasm, compiled to JS); run
    // `npm run build:kernel` after editing the .wat
    const bytes = await compileKernel(readFileSync(kernelSourcePath, 'utf8'));
    const hex = Array.from(bytes, (byte) => byte.toString(16).padStart(2, '0')).join('');
    expect(loopFieldKernelHex).toBe(hex);
  });
});
