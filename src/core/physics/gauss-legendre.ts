/** Nodes and weights of an n-point Gauss–Legendre rule on [−1, 1]. */
export interface GaussLegendreRule {
  readonly nodes: Float64Array;
  readonly weights: Float64Array;
}

const cache = new Map<number, GaussLegendreRule>();

/**
 * The n-point Gauss–Legendre rule on [−1, 1], exact for polynomials of degree ≤ 2n − 1
 * (A&S 25.4.29). Nodes are the roots of P_n found by Newton's method from the
 * Tricomi initial guess cos(π(i − 1/4)/(n + 1/2)); weights 2/((1 − x²) P_n'(x)²)
 * (Golub & Welsch 1969 give the same rule as an eigenproblem). Cached per n.
 *
 * @param n number of nodes, 1 ≤ n ≤ 200
 * @throws RangeError for n outside 1…200
 * @example gaussLegendre(2).nodes // [−1/√3, 1/√3]
 */
export function gaussLegendre(n: number): GaussLegendreRule {
  const known = cache.get(n);
  if (known) return known;
  if (!Number.isInteger(n) || n < 1 || n > 200) {
    throw new RangeError(`gaussLegendre: n must be an integer in 1…200, received ${n}`);
  }
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  for (let i = 0; i < Math.ceil(n / 2); i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let derivative = 0;
    for (let iteration = 0; iteration < 100; iteration++) {
      // three-term recurrence for P_n(x) and P_{n−1}(x)
      let previous = 1;
      let current = x;
      for (let degree = 2; degree <= n; degree++) {
        const next = ((2 * degree - 1) * x * current - (degree - 1) * previous) / degree;
        previous = current;
        current = next;
      }
      const value = n === 1 ? x : current;
      const before = n === 1 ? 1 : previous;
      derivative = (n * (x * value - before)) / (x * x - 1);
      const step = value / derivative;
      x -= step;
      if (Math.abs(step) <= 1e-16) break;
    }
    const weight = 2 / ((1 - x * x) * derivative * derivative);
    nodes[i] = -x;
    nodes[n - 1 - i] = x;
    weights[i] = weight;
    weights[n - 1 - i] = weight;
  }
  const rule = { nodes, weights };
  cache.set(n, rule);
  return rule;
}
