/**
 * Fit benchmark (issue 4): Levenberg–Marquardt fits per second of 30-point, 4-parameter
 * loop surveys (ampereTurns, radius, probeOffset, background) on one core with an
 * analytic Jacobian, next to ml-levenberg-marquardt 5.1.0 on the same data and starts.
 * Targets: ≥ 150,000 fits per CPU-second, ≥ 100,000 with covariance and intervals. Rates are per CPU-second of this process (one core; shared
 * machines inflate wall time) and per wall second, the fastest of 8 slices of each run (SLICES). A minimal hand-written LM on the same
 * data calibrates the machine. Prints figures and ratios; exits 1 if the target is missed.
 *
 * The model is written inline (on-axis loop, DOMAIN.md §1.1, distance d + probeOffset,
 * plus a constant background) so the bench does not depend on the model catalog; like the
 * catalog's loop model it supplies the fused normal equations (normalEquations), and one
 * line times the same fits from its row-major jacobian alone.
 */
import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { cpus, loadavg } from 'node:os';
import { fitLeastSquares } from '../src/core/fit/engine/least-squares';
import type { LeastSquaresProblem } from '../src/core/fit/engine/least-squares-types';
import { createLeastSquaresWorkspace } from '../src/core/fit/engine/least-squares-workspace';
import { parameterUncertainty } from '../src/core/fit/engine/parameter-uncertainty';
import { mulberry32 } from '../src/core/random/mulberry32';
import { normalRandom } from '../src/core/random/normal-random';

const MU0 = 1.25663706212e-6; // CODATA 2018, DOMAIN.md §6
const TARGET = 150_000;
const TARGET_WITH_COVARIANCE = 100_000;
const POINTS = 30;
const SURVEYS = 256;
const truth = [400, 0.05, 0.004, 2e-5]; // A, m, m, T

function field(p: ArrayLike<number>, d: number): number {
  const z = d + p[2]!;
  const s = p[1]! * p[1]! + z * z;
  // s·√s rather than s ** 1.5: V8's general pow is many times slower than sqrt.
  return (MU0 * p[0]! * p[1]! * p[1]!) / (2 * s * Math.sqrt(s)) + p[3]!;
}

/** ∂B/∂(NI, R, δ, b) at distance d (hand-derived from DOMAIN.md §1.1). */
function gradient(p: ArrayLike<number>, d: number, out: Float64Array, at: number): void {
  const [ni, r] = [p[0]!, p[1]!];
  const z = d + p[2]!;
  const s = r * r + z * z;
  const s15 = s * Math.sqrt(s);
  const s25 = s15 * s;
  out[at] = (MU0 * r * r) / (2 * s15);
  out[at + 1] = (MU0 * ni * r * (2 * z * z - r * r)) / (2 * s25);
  out[at + 2] = (-3 * MU0 * ni * r * r * z) / (2 * s25);
  out[at + 3] = 1;
}

// Seeded surveys: 30 log-spaced distances 5–250 mm, noise 1 % of reading + 0.5 µT.
const random = mulberry32(4);
const gaussian = normalRandom(random);
const distance = Float64Array.from({ length: POINTS }, (_, i) => 0.005 * 50 ** (i / (POINTS - 1)));
const surveys = Array.from({ length: SURVEYS }, () => {
  const sigma = Float64Array.from(distance, (d) => 0.01 * field(truth, d) + 5e-7);
  const observed = Float64Array.from(distance, (d, i) => field(truth, d) + sigma[i]! * gaussian());
  // Starts as a data-driven guess would give them: NI and R within ±20 %, offset and background 0.
  const start = [truth[0]! * (0.8 + 0.4 * random()), truth[1]! * (0.8 + 0.4 * random()), 0, 0];
  return { observed, sigma, start };
});

const problems: LeastSquaresProblem[] = surveys.map(({ observed }) => ({
  observed,
  parameterCount: 4,
  predict(p, out) {
    for (let i = 0; i < POINTS; i++) out[i] = field(p, distance[i]!);
  },
  jacobian(p, out) {
    for (let i = 0; i < POINTS; i++) gradient(p, distance[i]!, out, 4 * i);
  },
  // The fused pass (LeastSquaresProblem.normalEquations): gradient's products, summed in registers.
  normalEquations(p, weight, columnScale, residuals, gram, g) {
    const [ni, r, offset] = [p[0]!, p[1]!, p[2]!];
    const [s0, s1, s2, s3] = [columnScale[0]!, columnScale[1]!, columnScale[2]!, columnScale[3]!];
    let g00 = 0, g10 = 0, g11 = 0, g20 = 0, g21 = 0, g22 = 0, g30 = 0, g31 = 0, g32 = 0, g33 = 0;
    let b0 = 0, b1 = 0, b2 = 0, b3 = 0;
    for (let i = 0; i < POINTS; i++) {
      const z = distance[i]! + offset;
      const s = r * r + z * z;
      const s15 = s * Math.sqrt(s);
      const s25 = s15 * s;
      const w = weight[i]!;
      const ri = residuals[i]!;
      const j0 = ((MU0 * r * r) / (2 * s15)) * w * s0;
      const j1 = ((MU0 * ni * r * (2 * z * z - r * r)) / (2 * s25)) * w * s1;
      const j2 = ((-3 * MU0 * ni * r * r * z) / (2 * s25)) * w * s2;
      const j3 = 1 * w * s3;
      b0 += j0 * ri; b1 += j1 * ri; b2 += j2 * ri; b3 += j3 * ri;
      g00 += j0 * j0; g10 += j1 * j0; g11 += j1 * j1; g20 += j2 * j0; g21 += j2 * j1;
      g22 += j2 * j2; g30 += j3 * j0; g31 += j3 * j1; g32 += j3 * j2; g33 += j3 * j3;
    }
    gram[0] = g00; gram[4] = g10; gram[5] = g11; gram[8] = g20; gram[9] = g21;
    gram[10] = g22; gram[12] = g30; gram[13] = g31; gram[14] = g32; gram[15] = g33;
    g[0] = b0; g[1] = b1; g[2] = b2; g[3] = b3;
  },
}));
// The same problems without the fused pass: the engine accumulates the rows of `jacobian`.
const unfused: LeastSquaresProblem[] = problems.map(({ observed, parameterCount, predict, jacobian }) => ({ observed, parameterCount, predict, jacobian: jacobian! }));

/**
 * Slices each rate is measured in. The cores of a shared virtual machine change speed over
 * seconds (measured here: the calibration below ran 73–76k fits/CPU-s in some processes and
 * 125–128k in others minutes apart, and a process could switch state between two lines;
 * every function slowed alike, whichever core it was pinned to), so one long run measures
 * the neighbours as much as the code. Noise only ever slows a slice down: the fastest slice
 * is the figure (as Python's timeit takes the minimum of its repeats), the median beside it.
 */
const SLICES = 8;

/** Fits per second over ~`seconds` in SLICES slices, by CPU time of this process (one core) and by wall time: the fastest slice's CPU rate (see SLICES). */
function rate(label: string, seconds: number, body: (index: number) => void): number {
  for (let i = 0; i < 2000; i++) body(i % SURVEYS); // warm-up for the JIT
  let count = 0;
  const perCpu: number[] = [];
  const perWall: number[] = [];
  for (let slice = 0; slice < SLICES; slice++) {
    const first = count;
    const cpuStart = process.cpuUsage();
    const started = performance.now();
    let elapsed = 0;
    while (elapsed < (seconds * 1000) / SLICES) {
      for (let i = 0; i < 20; i++) body((count + i) % SURVEYS);
      count += 20;
      elapsed = performance.now() - started;
    }
    const cpu = process.cpuUsage(cpuStart);
    perCpu.push(((count - first) / (cpu.user + cpu.system)) * 1e6);
    perWall.push(((count - first) / elapsed) * 1000);
  }
  const ordered = [...perCpu].sort((a, b) => a - b);
  const best = ordered[SLICES - 1]!;
  const median = (ordered[SLICES / 2 - 1]! + ordered[SLICES / 2]!) / 2;
  const format = (v: number): string => Math.round(v).toLocaleString('en-US').padStart(9);
  console.log(`${label.padEnd(56)} ${format(best)} fits/CPU-s ${format(Math.max(...perWall))} fits/s wall (fastest of ${SLICES} slices; median ${format(median).trim()} fits/CPU-s)`);
  return best;
}

/**
 * Calibration: a minimal Levenberg–Marquardt (normal equations, Cholesky, λ·diag damping,
 * ×10 / ÷10 updates, stop when χ² falls by < 1e-10 relative) — no scaling, bounds,
 * fixed parameters, covariance or safeguards. The issue measured such a fit at about
 * 250,000/s on an idle machine; its rate here says how fast this machine is right now.
 */
function minimalFit(s: number): void {
  const { observed, sigma, start } = surveys[s]!;
  const p = minimal.p;
  p.set(start);
  let lambda = 1e-3;
  let cost = minimalCost(p, observed, sigma);
  for (let iteration = 0; iteration < 100; iteration++) {
    const { a, g, l, j, step, trial } = minimal;
    for (let i = 0; i < POINTS; i++) gradient(p, distance[i]!, j, 4 * i);
    a.fill(0);
    g.fill(0);
    for (let i = 0; i < POINTS; i++) {
      const w = 1 / (sigma[i]! * sigma[i]!);
      const r = (observed[i]! - field(p, distance[i]!)) * w;
      for (let u = 0; u < 4; u++) {
        g[u]! += j[4 * i + u]! * r;
        for (let v = 0; v <= u; v++) a[4 * u + v]! += j[4 * i + u]! * j[4 * i + v]! * w;
      }
    }
    for (;;) {
      for (let u = 0; u < 4; u++) {
        for (let v = 0; v <= u; v++) {
          let sum = a[4 * u + v]! * (u === v ? 1 + lambda : 1);
          for (let q = 0; q < v; q++) sum -= l[4 * u + q]! * l[4 * v + q]!;
          l[4 * u + v] = u === v ? Math.sqrt(sum) : sum / l[4 * v + v]!;
        }
      }
      for (let u = 0; u < 4; u++) {
        let sum = g[u]!;
        for (let q = 0; q < u; q++) sum -= l[4 * u + q]! * step[q]!;
        step[u] = sum / l[4 * u + u]!;
      }
      for (let u = 3; u >= 0; u--) {
        let sum = step[u]!;
        for (let q = u + 1; q < 4; q++) sum -= l[4 * q + u]! * step[q]!;
        step[u] = sum / l[4 * u + u]!;
      }
      for (let u = 0; u < 4; u++) trial[u] = p[u]! + step[u]!;
      const next = minimalCost(trial, observed, sigma);
      if (next < cost) {
        const done = cost - next <= 1e-10 * cost;
        p.set(trial);
        cost = next;
        lambda /= 10;
        if (done) return;
        break;
      }
      lambda *= 10;
      if (lambda > 1e10) return;
    }
  }
}
const minimal = {
  p: new Float64Array(4), a: new Float64Array(16), g: new Float64Array(4), l: new Float64Array(16),
  j: new Float64Array(4 * POINTS), step: new Float64Array(4), trial: new Float64Array(4),
};
function minimalCost(p: Float64Array, observed: Float64Array, sigma: Float64Array): number {
  let sum = 0;
  for (let i = 0; i < POINTS; i++) sum += ((observed[i]! - field(p, distance[i]!)) / sigma[i]!) ** 2;
  return sum;
}

const workspace = createLeastSquaresWorkspace(POINTS, 4);
const ours = surveys.map(({ sigma, start }, s) => fitLeastSquares(problems[s]!, { initial: start, standardUncertainty: sigma }, workspace));
const converged = ours.filter((f) => f.converged).length;
const meanIterations = ours.reduce((t, f) => t + f.iterations, 0) / SURVEYS;
const meanEvaluations = ours.reduce((t, f) => t + f.evaluations, 0) / SURVEYS;

const calibration = rate('minimal hand-written LM (calibration, see minimalFit)', 2, minimalFit);
const fitOnly = rate('ringfall fitLeastSquares, analytic Jacobian', 2, (s) => {
  const { sigma, start } = surveys[s]!;
  fitLeastSquares(problems[s]!, { initial: start, standardUncertainty: sigma }, workspace);
});
const withoutFusedPass = rate('ringfall fitLeastSquares, jacobian only (no normalEquations)', 2, (s) => {
  const { sigma, start } = surveys[s]!;
  fitLeastSquares(unfused[s]!, { initial: start, standardUncertainty: sigma }, workspace);
});
const withCovariance = rate('ringfall fit + covariance, intervals, identifiability', 2, (s) => {
  const { sigma, start } = surveys[s]!;
  parameterUncertainty(fitLeastSquares(problems[s]!, { initial: start, standardUncertainty: sigma }, workspace), 'stated');
});

// Baseline on the same data, starts and weights (1/σ²), with its analytic Jacobian option.
const baselineOptions = (s: number) => ({
  initialValues: surveys[s]!.start,
  weights: Array.from(surveys[s]!.sigma, (v) => 1 / (v * v)),
  maxIterations: 100,
  jacobianFunction: (p: number[]) => (d: number) => {
    const g = new Float64Array(4);
    gradient(p, d, g, 0);
    return Array.from(g);
  },
});
const data = (s: number) => ({ x: Array.from(distance), y: Array.from(surveys[s]!.observed) });
const baselineResults = surveys.map((_, s) => levenbergMarquardt(data(s), (p: number[]) => (d: number) => field(p, d), baselineOptions(s)));
// Which baseline fits reach our χ² within 1e-6 relative (ours are converged minima)?
const baselineAgree = baselineResults.filter((r, s) => {
  let chi = 0;
  for (let i = 0; i < POINTS; i++) chi += ((surveys[s]!.observed[i]! - field(r.parameterValues, distance[i]!)) / surveys[s]!.sigma[i]!) ** 2;
  return Math.abs(chi - ours[s]!.chiSquare) <= 1e-6 * ours[s]!.chiSquare;
}).length;
const baseline = rate('ml-levenberg-marquardt 5.1.0, analytic Jacobian', 2, (s) => {
  levenbergMarquardt(data(s), (p: number[]) => (d: number) => field(p, d), baselineOptions(s));
});

console.log(
  `\nringfall: ${converged}/${SURVEYS} converged, ${meanIterations.toFixed(1)} iterations and ` +
    `${meanEvaluations.toFixed(1)} evaluations per fit on average`,
);
console.log(`ml-levenberg-marquardt: ${baselineAgree}/${SURVEYS} fits reach ringfall's χ² within 1e-6`);
console.log(`speed ratio ringfall / ml-levenberg-marquardt: ${(fitOnly / baseline).toFixed(1)}×`);
console.log(
  `cost ratio ringfall / minimal LM: ${(calibration / fitOnly).toFixed(2)}× (the issue's figures, 250,000/s minimal ` +
    `and 100,000/s target, allow 2.5×); at the issue's minimal-LM speed ringfall would run ` +
    `${Math.round((250_000 * fitOnly) / calibration).toLocaleString('en-US')} fits/s`,
);
console.log(`load average now ${loadavg().map((v) => v.toFixed(1)).join(', ')} on ${cpus().length} cores`);
console.log(`target ${TARGET.toLocaleString('en-US')} fits per CPU-second: ${(fitOnly / TARGET).toFixed(2)}× of target (${fitOnly >= TARGET ? 'met' : 'MISSED'})`);
console.log(`target ${TARGET_WITH_COVARIANCE.toLocaleString('en-US')} fits per CPU-second with covariance and intervals: ${(withCovariance / TARGET_WITH_COVARIANCE).toFixed(2)}× of target (${withCovariance >= TARGET_WITH_COVARIANCE ? 'met' : 'MISSED'})`);
console.log(`the fused pass (normalEquations) gains ${((fitOnly / withoutFusedPass - 1) * 100).toFixed(0)} % over accumulating the jacobian's rows`);
console.log(`covariance and intervals cost ${((fitOnly / withCovariance - 1) * 100).toFixed(0)} % on top of the fit`);
if (fitOnly < TARGET || withCovariance < TARGET_WITH_COVARIANCE) process.exitCode = 1;
