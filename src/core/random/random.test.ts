import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../test/support/expect-close';
import { mulberry32 } from './mulberry32';
import { normalRandom } from './normal-random';

/** Independent transcription of Ettinger's C reference with BigInt 32-bit arithmetic. */
function referenceMulberry32(seed: number, count: number): number[] {
  const mask = 0xffffffffn;
  let state = BigInt(seed >>> 0);
  const out: number[] = [];
  for (let i = 0; i < count; i++) {
    state = (state + 0x6d2b79f5n) & mask;
    let z = state;
    z = ((z ^ (z >> 15n)) * (z | 1n)) & mask;
    z = (z ^ (z + (((z ^ (z >> 7n)) * (z | 61n)) & mask))) & mask;
    out.push(Number(z ^ (z >> 14n)) / 4294967296);
  }
  return out;
}

describe('mulberry32(seed)', () => {
  it('mulberry32() matches a BigInt transcription of the C reference for several seeds', () => {
    for (const seed of [0, 1, 42, 0xdeadbeef, 2 ** 32 - 1]) {
      const random = mulberry32(seed);
      // independent computation: BigInt implementation of the published C code
      for (const expected of referenceMulberry32(seed, 1000)) expect(random()).toBe(expected);
    }
  });

  it('mulberry32() is reproducible and different seeds give different streams', () => {
    const a = mulberry32(7);
    const b = mulberry32(7);
    const c = mulberry32(8);
    const first = [a(), a(), a()];
    expect([b(), b(), b()]).toEqual(first);
    expect([c(), c(), c()]).not.toEqual(first);
  });

  it('mulberry32() draws lie in [0, 1) with mean 1/2 and variance 1/12', () => {
    const random = mulberry32(12345);
    const n = 200_000;
    let sum = 0;
    let sumSquares = 0;
    let outside = 0;
    for (let i = 0; i < n; i++) {
      const u = random();
      if (!(u >= 0 && u < 1)) outside += 1;
      sum += u;
      sumSquares += u * u;
    }
    expect(outside).toBe(0);
    const mean = sum / n;
    // uniform(0, 1): mean 1/2, variance 1/12; 5 standard errors of the estimates
    expectClose(mean, 0.5, { abs: 5 * Math.sqrt(1 / 12 / n) });
    expectClose(sumSquares / n - mean * mean, 1 / 12, { abs: 5 * Math.sqrt(1 / 180 / n) });
  });
});

describe('normalRandom(uniform)', () => {
  it('normalRandom() returns the Box–Muller pair of two uniforms in turn: cos first, then sin', () => {
    const gaussian = normalRandom(mulberry32(3));
    const uniform = mulberry32(3);
    for (let pair = 0; pair < 5; pair++) {
      // Box & Muller 1958, computed here from the same uniforms (1 − u keeps the logarithm finite)
      const radius = Math.sqrt(-2 * Math.log(1 - uniform()));
      const angle = 2 * Math.PI * uniform();
      expect(gaussian()).toBe(radius * Math.cos(angle));
      expect(gaussian()).toBe(radius * Math.sin(angle));
    }
  });

  it('normalRandom() gives mean 0, variance 1 and 95.0 % of draws inside ±1.959964', () => {
    const gaussian = normalRandom(mulberry32(99));
    const n = 200_000;
    let sum = 0;
    let sumSquares = 0;
    let inside = 0;
    for (let i = 0; i < n; i++) {
      const z = gaussian();
      sum += z;
      sumSquares += z * z;
      // A&S Table 26.1: Φ(1.959964) = 0.975
      if (Math.abs(z) < 1.959964) inside += 1;
    }
    // N(0, 1): SE of the mean 1/√n, of the variance √(2/n), of a proportion √(p(1−p)/n); 5 SE
    expectClose(sum / n, 0, { abs: 5 / Math.sqrt(n) });
    expectClose(sumSquares / n, 1, { abs: 5 * Math.sqrt(2 / n) });
    expectClose(inside / n, 0.95, { abs: 5 * Math.sqrt(0.95 * 0.05 / n) });
  });
});
