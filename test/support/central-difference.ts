/**
 * Central finite difference of a vector-valued function, (f(x + h) − f(x − h))/(2h),
 * with h = step·max(|x|, scale): truncation error O(h²), rounding O(ε/h), so a relative
 * step near ε^(1/3) ≈ 6e-6 balances them (common practice: Nocedal & Wright 2nd ed. §8.1).
 */
export function centralDifference(
  f: (x: number) => readonly number[], x: number, scale = 0, step = 6e-6,
): number[] {
  const h = step * Math.max(Math.abs(x), scale);
  const plus = f(x + h);
  const minus = f(x - h);
  return plus.map((value, i) => (value - minus[i]!) / (2 * h));
}
