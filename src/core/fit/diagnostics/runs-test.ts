import { logGamma } from '../../stats/log-gamma';

/** Result of {@link runsTest}. */
export interface RunsTest {
  /** Runs of equal signs (maximal blocks), after dropping zeros. */
  readonly runs: number;
  /** Mean number of runs under random order, 1 + 2·n₊·n₋/N. */
  readonly expected: number;
  readonly positives: number;
  readonly negatives: number;
  /** P(runs ≤ observed) under random order, exact; 1 when one sign is missing. */
  readonly probability: number;
}

/**
 * Wald–Wolfowitz runs test for too few runs (residuals that stay on one side of the
 * curve over stretches, DOMAIN.md §7.3): the exact lower-tail probability of the run
 * count given n₊ positive and n₋ negative signs (Swed & Eisenhart, Ann. Math. Statist.
 * 14 (1943) 66–87): with C = binomial coefficients and N = n₊ + n₋,
 * P(R = 2k) = 2·C(n₊−1, k−1)·C(n₋−1, k−1)/C(N, n₊),
 * P(R = 2k+1) = [C(n₊−1, k−1)·C(n₋−1, k) + C(n₊−1, k)·C(n₋−1, k−1)]/C(N, n₊).
 * Zeros are dropped. Order the values (e.g. residuals by distance) before calling.
 *
 * @param values signed numbers in the order to test.
 * @example runsTest([1, 1, 1, -1, -1, -1]) // runs 2, P(R ≤ 2) = 2/C(6, 3) = 0.1
 */
export function runsTest(values: ArrayLike<number>): RunsTest {
  // One pass: count the signs and the runs (a run ends where the sign changes), zeros dropped.
  let positives = 0;
  let total = 0;
  let runs = 0;
  let previous = 0;
  for (let i = 0; i < values.length; i++) {
    const value = values[i]!;
    if (value === 0 || Number.isNaN(value)) continue;
    const sign = Math.sign(value);
    if (sign > 0) positives += 1;
    if (sign !== previous) runs += 1;
    previous = sign;
    total += 1;
  }
  const negatives = total - positives;
  const expected = total === 0 ? 0 : 1 + (2 * positives * negatives) / total;
  if (positives === 0 || negatives === 0) return { runs, expected, positives, negatives, probability: 1 };
  const logAll = logChoose(total, positives);
  let probability = 0;
  for (let r = 2; r <= runs; r++) {
    const k = r >> 1;
    if (r % 2 === 0) {
      probability += Math.exp(Math.LN2 + logChoose(positives - 1, k - 1) + logChoose(negatives - 1, k - 1) - logAll);
    } else {
      probability += Math.exp(logChoose(positives - 1, k - 1) + logChoose(negatives - 1, k) - logAll);
      probability += Math.exp(logChoose(positives - 1, k) + logChoose(negatives - 1, k - 1) - logAll);
    }
  }
  return { runs, expected, positives, negatives, probability: Math.min(1, probability) };
}

/** ln C(n, k), −Infinity outside 0 ≤ k ≤ n. */
function logChoose(n: number, k: number): number {
  if (k < 0 || k > n || n < 0) return -Infinity;
  return logFactorial(n) - logFactorial(k) - logFactorial(n - k);
}

/** ln n! = ln Γ(n + 1), kept as computed: a survey's tests ask for the same few again and again. */
const logFactorials: number[] = [];

function logFactorial(n: number): number {
  if (n >= 4096) return logGamma(n + 1);
  for (let i = logFactorials.length; i <= n; i++) logFactorials.push(logGamma(i + 1));
  return logFactorials[n]!;
}
