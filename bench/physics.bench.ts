/**
 * Physics benchmark (issue 2): off-axis loop field evaluations per second, both
 * components, on one core; target ≥ 30 million/s. Also the speed of our AGM for K and E
 * together against @stdlib ellipk + ellipe. A standalone script: `npm run bench -- physics`.
 *
 * Figures are per second of this process's CPU time (so other load on the machine shows
 * as a lower wall-clock rate, not a lower figure) and the best of five one-second rounds.
 * The load average is printed because the cores may be shared.
 */
import { loadavg } from 'node:os';
import ellipk from '@stdlib/math-base-special-ellipk';
import ellipe from '@stdlib/math-base-special-ellipe';
import { ellipticKE } from '../src/core/physics/elliptic-ke';
import { loopField } from '../src/core/physics/loop-field';
import { loopFieldBatch } from '../src/core/physics/loop-field-batch';

const targetPerSecond = 30e6;
const radius = 0.05;
const count = 1 << 14;

// survey-like points around a 50 mm loop: z in [−3a, 3a], ρ in (0, 3a], seeded LCG (Park–Miller)
let seed = 20260314;
const uniform = (): number => (seed = (seed * 16807) % 2147483647) / 2147483647;
const z = new Float64Array(count);
const rho = new Float64Array(count);
const parameter = new Float64Array(count);
for (let i = 0; i < count; i++) {
  z[i] = (uniform() * 6 - 3) * radius;
  rho[i] = (0.001 + uniform() * 2.999) * radius;
  const sum = radius + rho[i]!;
  parameter[i] = (4 * radius * rho[i]!) / (sum * sum + z[i]! * z[i]!);
}
const axial = new Float64Array(count);
const radial = new Float64Array(count);

/** Best rate (items per CPU second) over `rounds` rounds of ≈ 1 s each. */
function measure(run: () => number, rounds = 5): number {
  let best = 0;
  let sink = 0;
  for (let round = 0; round < rounds; round++) {
    const wallStart = performance.now();
    const cpuStart = process.cpuUsage();
    let items = 0;
    while (performance.now() - wallStart < 1000) {
      sink += run();
      items += count;
    }
    const cpu = process.cpuUsage(cpuStart);
    best = Math.max(best, items / ((cpu.user + cpu.system) / 1e6));
  }
  if (Number.isNaN(sink)) process.stdout.write('(NaN in results)\n');
  return best;
}

const single = new Float64Array(2);
const pair = new Float64Array(3);
const batchRate = measure(() => {
  loopFieldBatch(400, radius, z, rho, axial, radial);
  return axial[count - 1]! + radial[0]!;
});
const scalarRate = measure(() => {
  let sum = 0;
  for (let i = 0; i < count; i++) {
    loopField(400, radius, z[i]!, rho[i]!, single);
    sum += single[0]! + single[1]!;
  }
  return sum;
});
const agmRate = measure(() => {
  let sum = 0;
  for (let i = 0; i < count; i++) {
    ellipticKE(parameter[i]!, pair);
    sum += pair[0]! + pair[1]!;
  }
  return sum;
});
const stdlibRate = measure(() => {
  let sum = 0;
  for (let i = 0; i < count; i++) sum += ellipk(parameter[i]!) + ellipe(parameter[i]!);
  return sum;
});

const million = (rate: number): string => `${(rate / 1e6).toFixed(1)} million/s`;
const [load1] = loadavg();
process.stdout.write(`load average (1 min): ${load1!.toFixed(2)}\n`);
process.stdout.write(
  `off-axis loop field, both components (loopFieldBatch): ${million(batchRate)}; ` +
    `target ${million(targetPerSecond)}; ratio ${(batchRate / targetPerSecond).toFixed(2)}\n`,
);
process.stdout.write(`  one point per call (loopField):                 ${million(scalarRate)}\n`);
process.stdout.write(
  `K and E together: our AGM ${million(agmRate)}, @stdlib ellipk + ellipe ${million(stdlibRate)}; ` +
    `AGM is ${(agmRate / stdlibRate).toFixed(2)}× @stdlib\n`,
);
