import { describe, it, expect } from 'vitest';
import { thresholdDistances } from './threshold-distances';
import { parseThresholdLevel } from './threshold-level';
import { thresholdCautions } from './threshold-cautions';
import { syntheticFit } from '../testing/synthetic-fit';
import { expectClose } from '../../../../test/support/expect-close';

// CODATA 2018 (DOMAIN.md §9 pins μ0); the loop model may use another μ0 at the 1e-9 level
const mu0 = 1.25663706212e-6;
/** DOMAIN.md §1.10 [C]: z = R·√((μ0NI/2RB)^(2/3) − 1) */
const closedForm = (ampereTurns: number, radius: number, level: number) => radius * Math.sqrt(((mu0 * ampereTurns) / (2 * radius * level)) ** (2 / 3) - 1);

const surveyed = Array.from({ length: 15 }, (_, i) => 0.01 * i); // 0–140 mm readings
// loop NI = 400 A, R = 50 mm (DOMAIN.md §9 rows 36–37), probe offset 3 mm and 20 µT background
const loopFit = (radiusStderr = 0.0005, ampereTurnsStderr = 2, covariance?: number[]) => syntheticFit('loop', [
  { name: 'ampereTurns', unit: 'A', value: 400, stderr: ampereTurnsStderr },
  { name: 'radius', unit: 'm', value: 0.05, stderr: radiusStderr },
  { name: 'probeOffset', unit: 'm', value: 0.003, stderr: 0.0002 },
  { name: 'background', unit: 'T', value: 2e-5, stderr: 1e-7 },
], { distances: surveyed, aicc: -100, ...(covariance ? { covariance } : {}) });
const levels = ['0.5mT', '0.1mT', '50uT'].map((text) => parseThresholdLevel(text));

describe('thresholdDistances()', () => {
  it('thresholdDistances() on a loop fit equals the closed-form inversion (DOMAIN.md §9 row 36)', () => {
    const results = thresholdDistances([loopFit()], levels, { readingType: 'dc' });
    // DOMAIN.md §9 row 36 [C]: 95.630, 177.624, 227.049 mm (offset and background are not the coil's field)
    expectClose(results[0]!.distance!.value, 95.630e-3, { rel: 1e-5 });
    expectClose(results[1]!.distance!.value, 177.624e-3, { rel: 1e-5 });
    expectClose(results[2]!.distance!.value, 227.049e-3, { rel: 1e-5 });
    expect(results.every((r) => r.model === 'loop' && r.distance!.unit === 'm')).toBe(true);
  });

  it('thresholdDistances() gives the delta-method interval of the closed form\'s own derivatives', () => {
    // correlated NI and R (ρ = 0.6): independent check by central differences of the closed form
    const sNI = 2;
    const sR = 0.0005;
    const rho = 0.6;
    const covariance = [sNI * sNI, rho * sNI * sR, 0, 0, rho * sNI * sR, sR * sR, 0, 0, 0, 0, 4e-8, 0, 0, 0, 0, 1e-14];
    const result = thresholdDistances([loopFit(sR, sNI, covariance)], [levels[0]!], { readingType: 'dc' })[0]!;
    const h = 1e-6;
    const dNI = (closedForm(400 * (1 + h), 0.05, 5e-4) - closedForm(400 * (1 - h), 0.05, 5e-4)) / (2 * 400 * h);
    const dR = (closedForm(400, 0.05 * (1 + h), 5e-4) - closedForm(400, 0.05 * (1 - h), 5e-4)) / (2 * 0.05 * h);
    const sd = Math.sqrt(dNI * dNI * sNI * sNI + 2 * rho * dNI * dR * sNI * sR + dR * dR * sR * sR);
    expect(result.intervalMethod).toBe('delta');
    const [low, high] = result.distance!.ci95!;
    expectClose((high - low) / 2, 1.959963984540054 * sd, { rel: 1e-5 });
    expectClose((high + low) / 2, result.distance!.value, { rel: 1e-12 });
  });

  it('thresholdDistances() switches to seeded Monte Carlo when the curve is strongly nonlinear in the parameters', () => {
    // radius known to ±40 %: z(R) bends strongly over the interval
    const fit = loopFit(0.02, 2);
    const first = thresholdDistances([fit], [levels[0]!], { readingType: 'dc' })[0]!;
    expect(first.intervalMethod).toBe('monte-carlo');
    const [low, high] = first.distance!.ci95!;
    expect(low).toBeLessThan(first.distance!.value);
    expect(high).toBeGreaterThan(first.distance!.value);
    // asymmetric, as a nonlinear z(θ) makes it
    expect(Math.abs(high - first.distance!.value - (first.distance!.value - low))).toBeGreaterThan(1e-4);
    // same seed, same interval, byte for byte (DESIGN.md)
    expect(thresholdDistances([fit], [levels[0]!], { readingType: 'dc' })[0]!.distance!.ci95).toEqual(first.distance!.ci95);
    expect(first.notes.join(' ')).toContain('JCGM 101:2008');
  });

  it('thresholdDistances() puts the fitted inverse-square and power-law distances beside it, on the same datum', () => {
    // naive curves are solved on the survey's ruler and moved by the loop's 3 mm probe offset
    const inverseSquare = syntheticFit('inverse-square', [
      { name: 'amplitude', unit: 'T·m^n', value: 5e-6, stderr: 1e-8 },
      { name: 'probeOffset', unit: 'm', value: 0.03, stderr: 0.001 },
      { name: 'background', unit: 'T', value: 1e-6, stderr: 1e-7 },
    ], { aicc: 10 });
    const powerLaw = syntheticFit('power-law', [
      { name: 'amplitude', unit: 'T·m^n', value: 2e-7, stderr: 1e-9 },
      { name: 'exponent', unit: '1', value: 2.5, stderr: 0.05 },
      { name: 'probeOffset', unit: 'm', value: 0.02, stderr: 0.001 },
      { name: 'background', unit: 'T', value: 0, stderr: 1e-7 },
    ], { aicc: 5 });
    const result = thresholdDistances([loopFit(), inverseSquare, powerLaw], [levels[1]!], { readingType: 'dc' })[0]!;
    // A/(d + δ)² = B → d = √(A/B) − δ; plus the loop's 3 mm offset (hand algebra)
    const naive = Math.sqrt(5e-6 / 1e-4) - 0.03 + 0.003;
    expectClose(result.naive!.distance!.value, naive, { rel: 1e-10 });
    expectClose(result.naive!.ratio!, naive / result.distance!.value, { rel: 1e-12 });
    const power = (2e-7 / 1e-4) ** (1 / 2.5) - 0.02 + 0.003;
    expectClose(result.powerLaw!.distance!.value, power, { rel: 1e-10 });
    expect(result.powerLaw!.exponent).toBe(2.5);
  });

  it('thresholdDistances() marks a distance beyond the surveyed range as extrapolated', () => {
    const [near, , far] = thresholdDistances([loopFit()], levels, { readingType: 'dc' });
    // survey reaches 140 mm + 3 mm offset: 95.6 mm inside, 227 mm beyond
    expect(near!.extrapolated).toBe(false);
    expect(far!.extrapolated).toBe(true);
    expect(far!.notes.join(' ')).toContain('Extrapolated');
    expectClose(far!.surveyedRange![1], 0.143, { rel: 1e-12 });
  });

  it('thresholdDistances() reports no distance when the level is above the coil\'s peak field', () => {
    // centre field μ0NI/(2R) = 5.03 mT (DOMAIN.md §1.10)
    const result = thresholdDistances([loopFit()], [parseThresholdLevel('6mT')], { readingType: 'dc' })[0]!;
    expect(result.distance).toBeNull();
    expect(result.notes[0]).toContain('stays below 6.000 mT');
  });

  it('thresholdDistances() carries the DOMAIN.md §4.5 cautions, the preset\'s source and reading-type notes', () => {
    // DOMAIN.md §9 rows 36 and 58: the 0.5 mT implant line falls at 95.63 mm for this loop
    const implant = thresholdDistances([loopFit()], [parseThresholdLevel('implant-static')], { readingType: 'dc' })[0]!;
    expectClose(implant.distance!.value, 95.630e-3, { rel: 1e-5 });
    expect(implant.cautions).toBe(thresholdCautions);
    expect(implant.level.label).toContain('ICNIRP 2009');
    expect(implant.notes.join(' ')).toContain('0.9 mT');
    const rms = thresholdDistances([loopFit()], [parseThresholdLevel('icnirp-public@50Hz')], { readingType: 'peak' })[0]!;
    expect(rms.notes.join(' ')).toContain('peak/√2');
  });

  it('thresholdDistances() says so when no model converged', () => {
    const failed = { ...loopFit(), converged: false };
    const result = thresholdDistances([failed], [levels[0]!], { readingType: null })[0]!;
    expect(result.distance).toBeNull();
    expect(result.notes[0]).toContain('No model converged');
  });
});
