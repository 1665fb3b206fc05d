import { describe, expect, it } from 'vitest';
import ellipk from '@stdlib/math-base-special-ellipk';
import ellipe from '@stdlib/math-base-special-ellipe';
import { ellipticKE } from './elliptic-ke';
import { bulirschCel } from './bulirsch-cel';
import { expectClose } from '../../../test/support/expect-close';

const out = new Float64Array(3);
const ke = (m: number, complement?: number): [number, number] => {
  ellipticKE(m, out, complement ?? 1 - m);
  return [out[0]!, out[1]!];
};

describe('ellipticKE()', () => {
  it('ellipticKE() matches the reference table of K(m), E(m) in the parameter convention', () => {
    // DOMAIN.md §2.2 (mpmath), agreeing with A&S Table 17.1 (tabulated against the parameter m); §9 rows 38–39
    const table: [m: number, k: number, e: number][] = [
      [0, 1.5707963268, 1.5707963268],
      [0.1, 1.6124413487, 1.5307576369],
      [0.2, 1.6596235986, 1.4890350581],
      [0.25, 1.6857503548, 1.4674622093],
      [0.5, 1.8540746773, 1.3506438810],
      [0.8, 2.2572053268, 1.1784899243],
      [0.9, 2.5780921134, 1.1047747327],
      [0.99, 3.6956373630, 1.0159935450],
      [0.999999, 8.2940514636, 1.0000038970],
    ];
    for (const [m, k, e] of table) {
      const [actualK, actualE] = ke(m);
      expectClose(actualK, k, { abs: 6e-11 }, `K(${m})`);
      expectClose(actualE, e, { abs: 6e-11 }, `E(${m})`);
    }
  });

  it('ellipticKE() agrees with mpmath to 1e-15 relative at m = 0.1, 0.5, 0.9, 0.99', () => {
    // computed with mpmath 1.3.0 at 30 digits: mp.ellipk(m), mp.ellipe(m)
    const reference: [number, number, number][] = [
      [0.1, 1.61244134872021939823, 1.53075763689776320247],
      [0.5, 1.85407467730137191843, 1.35064388104767550252],
      [0.9, 2.57809211334817318820, 1.10477473270407332609],
      [0.99, 3.69563736298987467781, 1.01599354502522393564],
    ];
    for (const [m, k, e] of reference) {
      const [actualK, actualE] = ke(m);
      expectClose(actualK, k, { rel: 1e-15 }, `K(${m})`);
      expectClose(actualE, e, { rel: 1.5e-15 }, `E(${m})`);
    }
  });

  it('ellipticKE() agrees with @stdlib ellipk/ellipe (which take the parameter m) across [0, 1)', () => {
    // @stdlib/math-base-special-ellipk 0.2.4 and -ellipe 0.3.1: "ellipk(0.5) ~1.854", parameter m
    for (let i = 0; i <= 200; i++) {
      const m = i < 200 ? i / 200 : 0.9999;
      const [k, e] = ke(m);
      // @stdlib itself errs by up to 5e-15 (K(0.85), see the next test)
      expectClose(k, ellipk(m), { rel: 6e-15 }, `K(${m})`);
      expectClose(e, ellipe(m), { rel: 3e-15 }, `E(${m})`);
    }
  });

  it('ellipticKE() is closer to mpmath than @stdlib at m = 0.85', () => {
    // computed with mpmath 1.3.0 at 30 digits: ellipk(0.85) = 2.38901648632557999326, ellipe(0.85) = 1.14339579188316585913;
    // @stdlib ellipk(0.85) = 2.3890164863255676 (5e-15 low)
    const [k, e] = ke(0.85);
    expectClose(k, 2.38901648632557999326, { rel: 4.5e-16 });
    expectClose(e, 1.14339579188316585913, { rel: 6e-16 });
  });

  it('ellipticKE() is not the modulus convention: "K(0.5)" is 1.8540746773, not 1.6857503548', () => {
    // DOMAIN.md §2.1 and §9 row 40: K(k = 0.5) = K(m = 0.25) = 1.6857503548 is the trap value
    expectClose(ke(0.5)[0], 1.8540746773, { abs: 1e-10 });
    expect(Math.abs(ke(0.5)[0] - 1.6857503548)).toBeGreaterThan(0.1);
    expectClose(ke(0.25)[0], 1.6857503548, { abs: 1e-10 });
  });

  it('ellipticKE() satisfies Legendre\'s relation E K\' + E\' K − K K\' = π/2', () => {
    // A&S 17.3.13; DOMAIN.md §2.2 and §9 row 41 (checked at m = 0.3)
    for (const m of [0.3, 0.01, 0.5, 0.77, 0.999]) {
      const [k, e] = ke(m);
      const [kc, ec] = ke(1 - m, m);
      expectClose(e * kc + ec * k - k * kc, Math.PI / 2, { rel: 4e-15 }, `m = ${m}`);
    }
  });

  it('ellipticKE() gives K increasing and E decreasing on [0, 1), K(0) = E(0) = π/2, E(1) = 1, K(1) = ∞', () => {
    // DOMAIN.md §2.2 property tests (A&S 17.3.11–12 for the end values)
    let previous = ke(0);
    expect(previous).toEqual([Math.PI / 2, Math.PI / 2]);
    for (let i = 1; i < 1000; i++) {
      const current = ke(i / 1000);
      expect(current[0]).toBeGreaterThan(previous[0]);
      expect(current[1]).toBeLessThan(previous[1]);
      previous = current;
    }
    expect(ke(1)).toEqual([Infinity, 1]);
    expect(ke(1.5).every(Number.isNaN)).toBe(true);
    expect(ke(NaN).every(Number.isNaN)).toBe(true);
  });

  it('ellipticKE() keeps every digit near m = 1 when given the complementary parameter', () => {
    // computed with mpmath 1.3.0 at 50 digits with m = 1 − m₁: K, E; K → ½ ln(16/m₁) (A&S 17.3.26)
    const reference: [m1: number, k: number, e: number][] = [
      [1e-6, 8.29405146361544000794, 1.00000389702617206115],
      [1e-12, 15.2018049190877151842, 1.00000000000735090246],
      [1e-30, 35.9250707560305758374, 1.0],
    ];
    for (const [m1, k, e] of reference) {
      const [actualK, actualE] = ke(1 - m1, m1);
      expectClose(actualK, k, { rel: 1e-15 }, `K(1 − ${m1})`);
      // E = K(1 − m/2 − T) cancels by a factor ≈ K near m = 1: error ≤ 4e-16·K (documented)
      expectClose(actualE, e, { rel: 4e-16 * k }, `E(1 − ${m1})`);
    }
    // without the complement, 1 − m in double has lost all but 4 digits of m₁ = 1e-12
    expect(Math.abs(ke(1 - 1e-12)[0] - 15.2018049190877151842)).toBeGreaterThan(1e-6);
  });

  it('ellipticKE() converges in at most the 5 AGM steps DOMAIN counts at m = 0.5', () => {
    // DOMAIN.md §9 row 65 gives 5 iterations with the stop |c| < 1e-16; our stop on the next
    // c_{n+1} ≤ 2⁻²⁶ a_n is two steps earlier because the error after it is O(c²) (A&S §17.6)
    expect(ellipticKE(0.5, out)).toBeLessThanOrEqual(5);
    // regression pin, not truth
    expect(ellipticKE(0.5, out)).toBe(3);
    expect(ellipticKE(0.99, out)).toBeLessThanOrEqual(5);
  });

  it('ellipticKE() returns T with K − E = K(m/2 + T) exactly where K − E is tiny', () => {
    // K − E = (π/2)(m/2 + 3m²/16 + …) from the series K = (π/2)(1 + m/4 + 9m²/64 + …), E = (π/2)(1 − m/4 − 3m²/64 − …) (A&S 17.3.11–12)
    const m = 1e-9;
    ellipticKE(m, out);
    expectClose(out[0]! * (m / 2 + out[2]!), (Math.PI / 2) * (m / 2 + (3 * m * m) / 16), { rel: 1e-15 });
  });
});

describe('bulirschCel()', () => {
  it('bulirschCel() reduces to K(m) and E(m) with k_c = √(1 − m)', () => {
    // K = cel(k_c, 1, 1, 1), E = cel(k_c, 1, 1, k_c²) (Bulirsch 1969); values DOMAIN.md §2.2
    expectClose(bulirschCel(Math.SQRT1_2, 1, 1, 1), 1.8540746773, { abs: 1e-10 });
    expectClose(bulirschCel(Math.SQRT1_2, 1, 1, 0.5), 1.3506438810, { abs: 1e-10 });
    expectClose(bulirschCel(Math.sqrt(0.1), 1, 1, 0.1), 1.1047747327, { abs: 1e-10 });
  });

  it('bulirschCel() gives Π(n, m) = cel(k_c, 1 − n, 1, 1), including the principal value for n > 1', () => {
    // computed with mpmath 1.3.0: ellippi(0.3, 0.5) = 2.25037682194394666536; Re ellippi(1.3, 0.5) = −0.55935690300284917966
    expectClose(bulirschCel(Math.SQRT1_2, 0.7, 1, 1), 2.25037682194394666536, { rel: 1e-15 });
    expectClose(bulirschCel(Math.SQRT1_2, -0.3, 1, 1), -0.55935690300284917966, { rel: 1e-14 });
    // computed with mpmath 1.3.0 quad of the defining integral: cel(0.3, 0.09, 1, 0.3) = 4.83284491542956512586
    expectClose(bulirschCel(0.3, 0.09, 1, 0.3), 4.83284491542956512586, { rel: 1e-15 });
  });

  it('bulirschCel() diverges at k_c = 0', () => {
    // K(m) → ∞ as m → 1 (A&S 17.3.26)
    expect(bulirschCel(0, 1, 1, 1)).toBe(Infinity);
  });
});
