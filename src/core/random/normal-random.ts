/**
 * Standard normal deviates from a uniform generator by the Box–Muller transform
 * (G. E. P. Box & M. E. Muller, "A note on the generation of random normal deviates",
 * Ann. Math. Statist. 29 (1958) 610–611): z₁ = √(−2 ln u₁)·cos(2πu₂),
 * z₂ = √(−2 ln u₁)·sin(2πu₂); both are used, in turn.
 *
 * @param uniform a generator of numbers in [0, 1), e.g. mulberry32(seed).
 * @returns a function giving N(0, 1) deviates (dimensionless).
 * @example
 * const gaussian = normalRandom(mulberry32(7));
 * gaussian(); // a reproducible N(0, 1) number
 */
export function normalRandom(uniform: () => number): () => number {
  let spare: number | null = null;
  return () => {
    if (spare !== null) {
      const z = spare;
      spare = null;
      return z;
    }
    // 1 − u lies in (0, 1], so the logarithm is finite.
    const radius = Math.sqrt(-2 * Math.log(1 - uniform()));
    const angle = 2 * Math.PI * uniform();
    spare = radius * Math.sin(angle);
    return radius * Math.cos(angle);
  };
}
