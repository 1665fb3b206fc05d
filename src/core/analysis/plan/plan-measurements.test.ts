import { describe, it, expect } from 'vitest';
import { getModel, scanModel } from '../../models';
import { studentTQuantile } from '../../stats';
import { fitLeastSquares } from '../../fit/engine/least-squares';
import { parameterUncertainty } from '../../fit/engine/parameter-uncertainty';
import { mulberry32, normalRandom } from '../../random';
import { RingfallError } from '../../errors';
import { expectedIntervals } from './expected-intervals';
import { planMeasurements } from './plan-measurements';
import { readingUncertainty, type DesignPoint, type DesignProblem } from './design-problem';
import { modelPoint } from '../model-point';
import { expectClose } from '../../../../test/support/expect-close';

const loop = getModel('loop');
const index = (name: string) => loop.parameters.findIndex((p) => p.name === name);
const values = (ampereTurns: number, radius: number, probeOffset = 0, background = 0) => {
  const v = new Float64Array(loop.parameters.length);
  v[index('ampereTurns')] = ampereTurns;
  v[index('radius')] = radius;
  v[index('probeOffset')] = probeOffset;
  v[index('background')] = background;
  return v;
};
const evenly = (from: number, to: number, count: number): DesignPoint[] =>
  Array.from({ length: count }, (_, i) => ({ distance: from + ((to - from) * i) / (count - 1), radial: 0 }));

describe('expectedIntervals()', () => {
  // DOMAIN.md §9 row 63 and §7.6 [C]: NI = 400 A, R = 50 mm, σ_i = 1 % of B_i, NI and R free
  const problem: DesignProblem = {
    model: loop,
    values: values(400, 0.05),
    free: [index('ampereTurns'), index('radius')],
    noise: { relative: 0.01, absolute: 0, position: 0 },
  };

  it('expectedIntervals() reproduces the far-field identifiability figures of DOMAIN.md §9 row 63', () => {
    const far = expectedIntervals(problem, evenly(0.25, 0.5, 12));
    // half-width = t_{0.975,10}·σ with t = 2.228139 (A&S Table 26.10)
    const t = 2.228138851986;
    // DOMAIN.md §9 row 63: σ(NI)/NI 21.4 %, σ(R)/R 11.0 %, ρ = −0.99991, σ(m)/m 0.72 %
    expectClose(far.parameters[0]!.relative! / t, 0.214, { rel: 0.005 });
    expectClose(far.parameters[1]!.relative! / t, 0.110, { rel: 0.005 });
    expectClose(far.correlation!, -0.99991, { abs: 1e-5 });
    expectClose(far.moment!.relative! / t, 0.0072, { rel: 0.01 });
    expect(far.warnings.join(' ')).toContain('far field');
  });

  it('expectedIntervals() reproduces the near-field figures of DOMAIN.md §7.6 and gives no warning', () => {
    const near = expectedIntervals(problem, evenly(0, 0.25, 12));
    const t = 2.228138851986;
    // DOMAIN.md §7.6 [C]: 0 to 5R → 0.45 %, 0.31 %, correlation −0.76
    expectClose(near.parameters[0]!.relative! / t, 0.0045, { rel: 0.01 });
    expectClose(near.parameters[1]!.relative! / t, 0.0031, { rel: 0.02 });
    expectClose(near.correlation!, -0.76, { abs: 0.005 });
    expect(near.warnings).toEqual([]);
  });

  it('expectedIntervals() says a design with no more points than parameters determines nothing', () => {
    const result = expectedIntervals(problem, evenly(0.01, 0.05, 2));
    expect(result.determined).toBe(false);
    expect(result.parameters[0]!.halfWidth).toBeNull();
    expect(result.warnings[0]).toContain('cannot determine');
  });
});

// A 120 A-turn, 45 mm applicator with a 2 mm probe recess, read with 2 % + 1 µT and ±0.5 mm (truth stated here).
const applicator: DesignProblem = {
  model: loop,
  values: values(120, 0.045, 0.002, 0),
  free: loop.parameters.map((_, j) => j),
  noise: { relative: 0.02, absolute: 1e-6, position: 0.0005 },
};
const options = { count: 12, reach: [0.005, 0.2] as const, probeSize: 0.005 };

describe('planMeasurements()', () => {
  it('planMeasurements() keeps positions within reach and a probe size apart', () => {
    const plan = planMeasurements(applicator, options);
    const distances = plan.recommended.points.map((p) => p.distance);
    expect(distances).toHaveLength(12);
    expect(Math.min(...distances)).toBeGreaterThanOrEqual(0.005);
    expect(Math.max(...distances)).toBeLessThanOrEqual(0.2);
    for (let i = 1; i < distances.length; i += 1) expect(distances[i]! - distances[i - 1]!).toBeGreaterThanOrEqual(0.005 * (1 - 1e-9));
    expect(plan.interest).toEqual(['ampereTurns', 'radius']);
  });

  it('planMeasurements() expects narrower ampere-turn and radius intervals than an evenly spaced plan of the same size', () => {
    const plan = planMeasurements(applicator, options);
    const [turns, radius] = plan.recommended.parameters;
    expect(turns!.halfWidth!).toBeLessThan(plan.evenlySpaced.parameters[0]!.halfWidth!);
    expect(radius!.halfWidth!).toBeLessThan(plan.evenlySpaced.parameters[1]!.halfWidth!);
  });

  it('planMeasurements() warns that a far-field plan determines only the moment', () => {
    const plan = planMeasurements({ ...applicator, free: [index('ampereTurns'), index('radius')] }, { ...options, compare: evenly(0.1, 0.2, 8) });
    expect(plan.compared!.warnings.join(' ')).toMatch(/far field.*only the moment/);
    expect(plan.recommended.warnings).toEqual([]);
  });

  it('planMeasurements() rejects an impossible reach, too few points and unknown parameters', () => {
    const code = (action: () => unknown) => {
      try { action(); } catch (error) { expect(error).toBeInstanceOf(RingfallError); return (error as RingfallError).code; }
      return 'no error';
    };
    expect(code(() => planMeasurements(applicator, { ...options, reach: [0.1, 0.05] }))).toBe('PLAN_REACH');
    expect(code(() => planMeasurements(applicator, { ...options, probeSize: 0.05 }))).toBe('PLAN_REACH');
    expect(code(() => planMeasurements(applicator, { ...options, count: 4 }))).toBe('PLAN_COUNT');
    expect(code(() => planMeasurements(applicator, { ...options, interest: ['turns'] }))).toBe('PLAN_INTEREST');
    expect(() => planMeasurements(applicator, { ...options, reach: [0.1, 0.05] })).toThrow(/is not a range\. Give the nearest and farthest probe distance/);
    expect(() => planMeasurements(applicator, { ...options, probeSize: 0.05 })).toThrow(/12 positions 50\.00 mm apart do not fit/);
    expect(() => planMeasurements(applicator, { ...options, count: 4 })).toThrow(/4 positions for 4 free parameters .* Plan at least 5/);
    expect(() => planMeasurements(applicator, { ...options, interest: ['turns'] })).toThrow(/"turns" is not a free parameter of loop/);
  });

  it('planMeasurements() recommendation beats evenly spaced positions on seeded simulated surveys', () => {
    // Simulation: readings at the true positions d + e (e ~ N(0, 0.5 mm)) with 2 % + 1 µT noise,
    // fitted with the LM engine and stated effective-variance σ; 300 surveys per plan.
    const plan = planMeasurements(applicator, options);
    const truth = applicator.values;
    const point = modelPoint(loop);
    const realised = (points: readonly DesignPoint[], seed: number) => {
      const gaussian = normalRandom(mulberry32(seed));
      const n = points.length;
      const distance = Float64Array.from(points, (p) => p.distance);
      const sigma = Float64Array.from(points, (p) => readingUncertainty(applicator.noise, point.field(truth, p.distance, 0), point.slope(truth, p.distance, 0)));
      const survey = { n, distance, radial: new Float64Array(n), field: new Float64Array(n), kind: 'magnitude' as const };
      const widths = { turns: [] as number[], radius: [] as number[], turnsError: 0, radiusError: 0 };
      for (let s = 0; s < 300; s += 1) {
        const observed = Float64Array.from(points, (p) => {
          const b = point.field(truth, p.distance + 0.0005 * gaussian(), 0);
          return b + Math.hypot(0.02 * b, 1e-6) * gaussian();
        });
        const solution = fitLeastSquares(
          { observed, parameterCount: truth.length, predict: (params, out) => loop.evaluate(params, survey, out), jacobian: (params, out) => loop.jacobian!(params, survey, out) },
          { initial: truth, standardUncertainty: sigma, lower: loop.parameters.map((p) => p.lower), upper: loop.parameters.map((p) => p.upper) },
        );
        const intervals = parameterUncertainty(solution, 'stated').intervals!;
        widths.turns.push(intervals[index('ampereTurns')]![1] - intervals[index('ampereTurns')]![0]);
        widths.radius.push(intervals[index('radius')]![1] - intervals[index('radius')]![0]);
        widths.turnsError += (solution.params[index('ampereTurns')]! - truth[index('ampereTurns')]!) ** 2;
        widths.radiusError += (solution.params[index('radius')]! - truth[index('radius')]!) ** 2;
      }
      const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
      return { turns: median(widths.turns), radius: median(widths.radius), turnsRms: Math.sqrt(widths.turnsError / 300), radiusRms: Math.sqrt(widths.radiusError / 300) };
    };
    const recommended = realised(plan.recommended.points, 7);
    const even = realised(plan.evenlySpaced.points, 7);
    expect(recommended.turns).toBeLessThan(even.turns);
    expect(recommended.radius).toBeLessThan(even.radius);
    // and the estimates themselves land closer to the truth
    expect(recommended.radiusRms).toBeLessThan(even.radiusRms);
    expect(recommended.turnsRms).toBeLessThan(even.turnsRms);
  });

  it('planMeasurements() for a scan through a coil pair: the expected half-widths match the scatter of seeded scan fits', () => {
    // Independent check of the linearised covariance by Monte Carlo (JCGM 101:2008 §7):
    // 400 scans simulated at the recommended positions with the stated noise, each fitted.
    const pair = scanModel(getModel('coil-pair'));
    const at = (name: string) => pair.parameters.findIndex((p) => p.name === name);
    const truth = new Float64Array(pair.parameters.length);
    truth[at('ampereTurns')] = 100;
    truth[at('radius')] = 0.035;
    truth[at('separation')] = 0.035;
    truth[at('centre')] = 0.012;
    const problem: DesignProblem = { model: pair, values: truth, free: [...pair.parameters.keys()], noise: { relative: 0.01, absolute: 1e-6, position: 0 } };
    const plan = planMeasurements(problem, { count: 14, reach: [-0.12, 0.15], probeSize: 0.005, signed: true });
    const points = plan.recommended.points;
    expect(points.some((p) => p.distance < 0.012) && points.some((p) => p.distance > 0.012)).toBe(true);
    const n = points.length;
    const survey = { n, distance: Float64Array.from(points, (p) => p.distance), radial: new Float64Array(n), field: new Float64Array(n), kind: 'magnitude' as const };
    const exact = new Float64Array(n);
    pair.evaluate(truth, survey, exact);
    const sigma = Float64Array.from(exact, (b) => Math.hypot(0.01 * b, 1e-6));
    const gaussian = normalRandom(mulberry32(11));
    const estimates = { ampereTurns: [] as number[], centre: [] as number[] };
    for (let s = 0; s < 400; s += 1) {
      const observed = Float64Array.from(exact, (b, i) => b + sigma[i]! * gaussian());
      const solution = fitLeastSquares(
        { observed, parameterCount: truth.length, predict: (params, out) => pair.evaluate(params, survey, out), jacobian: (params, out) => pair.jacobian!(params, survey, out) },
        { initial: truth, standardUncertainty: sigma, lower: pair.parameters.map((p) => p.lower), upper: pair.parameters.map((p) => p.upper) },
      );
      estimates.ampereTurns.push(solution.params[at('ampereTurns')]!);
      estimates.centre.push(solution.params[at('centre')]!);
    }
    const sd = (xs: number[]) => {
      const mean = xs.reduce((a, b) => a + b, 0) / xs.length;
      return Math.sqrt(xs.reduce((a, b) => a + (b - mean) ** 2, 0) / (xs.length - 1));
    };
    const t = studentTQuantile(0.975, n - truth.length);
    for (const name of ['ampereTurns', 'centre'] as const) {
      const expected = plan.recommended.parameters.find((p) => p.name === name)!.halfWidth!;
      // 400 draws estimate a standard deviation to about 3.5 % (1/√(2·399)); allow 15 %
      expectClose(sd(estimates[name]), expected / t, { rel: 0.15 }, name);
    }
    // one side of the pair (probe offset in place of the centre) determines ampere-turns far worse
    const oneSided = plan.oneSided!.parameters.find((p) => p.name === 'ampereTurns')!.halfWidth!;
    expect(oneSided).toBeGreaterThan(3 * plan.recommended.parameters.find((p) => p.name === 'ampereTurns')!.halfWidth!);
  });
});
