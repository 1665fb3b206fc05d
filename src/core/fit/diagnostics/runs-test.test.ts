import { describe, expect, it } from 'vitest';
import { expectClose } from '../../../../test/support/expect-close';
import { runsTest } from './runs-test';

/** All arrangements of p plus signs and q minus signs, by recursion (an independent count). */
function arrangements(p: number, q: number): number[][] {
  if (p === 0 && q === 0) return [[]];
  const out: number[][] = [];
  if (p > 0) for (const rest of arrangements(p - 1, q)) out.push([1, ...rest]);
  if (q > 0) for (const rest of arrangements(p, q - 1)) out.push([-1, ...rest]);
  return out;
}

function countRuns(signs: readonly number[]): number {
  let runs = 1;
  for (let i = 1; i < signs.length; i++) if (signs[i] !== signs[i - 1]) runs += 1;
  return runs;
}

describe('runsTest(values)', () => {
  it('runsTest() example: + + + − − − has 2 runs, P(R ≤ 2) = 2/C(6, 3) = 0.1', () => {
    const result = runsTest([1, 1, 1, -1, -1, -1]);
    expect(result.runs).toBe(2);
    // two of the C(6,3) = 20 arrangements have 2 runs
    expectClose(result.probability, 0.1, { rel: 1e-12 });
    // 1 + 2·3·3/6 = 4 (Wald & Wolfowitz 1940 mean)
    expectClose(result.expected, 4, { rel: 1e-15 });
  });

  it('runsTest() lower tail equals the share of all arrangements with as few runs (exhaustive enumeration, n₊, n₋ ≤ 7)', () => {
    for (const [p, q] of [[3, 4], [5, 5], [7, 2], [6, 7], [1, 6]] as const) {
      const all = arrangements(p, q);
      const runCounts = all.map(countRuns);
      for (const signs of all.filter((_, i) => i % 7 === 0)) {
        const observed = countRuns(signs);
        const share = runCounts.filter((r) => r <= observed).length / all.length;
        expectClose(runsTest(signs).probability, share, { rel: 1e-10 }, `n₊ ${p}, n₋ ${q}, runs ${observed}`);
      }
    }
  });

  it('runsTest() drops zeros and NaN, and returns probability 1 when one sign is missing', () => {
    const result = runsTest([0, 1, NaN, 2, 0, 3]);
    expect(result).toMatchObject({ runs: 1, positives: 3, negatives: 0, probability: 1 });
  });

  // Swed & Eisenhart (1943) table of critical run counts, from memory: 6 for n₊ = n₋ = 10 at 0.025.
  it('runsTest() at n₊ = n₋ = 10: P(R ≤ 6) is below 0.025 and P(R ≤ 7) above it (critical value 6)', () => {
    const six = [1, 1, 1, 1, -1, -1, -1, 1, 1, 1, -1, -1, -1, 1, 1, 1, -1, -1, -1, -1];
    expect(runsTest(six).runs).toBe(6);
    expect(runsTest(six).probability).toBeLessThan(0.025);
    const seven = [1, 1, 1, 1, -1, -1, -1, 1, 1, 1, -1, -1, -1, 1, 1, -1, -1, -1, -1, 1];
    expect(runsTest(seven).runs).toBe(7);
    expect(runsTest(seven).probability).toBeGreaterThan(0.025);
  });
});
