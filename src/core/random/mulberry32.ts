/**
 * A seeded pseudo-random generator: mulberry32 (Tommy Ettinger, 2017, public domain;
 * a 32-bit state advanced by the Weyl constant 0x6D2B79F5 and mixed by two
 * multiply–xorshift rounds). Returns uniform numbers in [0, 1) with 32-bit resolution.
 * Not for cryptography; ringfall uses it so that multi-starts, bootstraps and demo
 * noise are reproducible byte for byte (DESIGN.md).
 *
 * @param seed any number; its low 32 bits are the state.
 * @example
 * const random = mulberry32(42);
 * random(); // 0.6011037519201636 (the same on every run)
 */
export function mulberry32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
