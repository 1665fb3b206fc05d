/**
 * Whole-process speed of the CLI on a folder of surveys, against a scipy baseline in the
 * same run (issue targets; printed as ratios, never asserted in tests):
 *
 * - `ringfall fit DIR --model loop --json` ≤ 0.25× the time of bench/scipy-loop-fit.py
 *   (scipy.optimize.least_squares, method 'lm', analytic Jacobian) on the same files;
 * - `ringfall fit DIR --json` (the default five models) ≤ 1.0× scipy's loop-only time;
 * - `ringfall batch DIR --json --workers 2` ≥ 1.7× faster than `--workers 1` (an idle
 *   machine; the load average is printed);
 * - peak RSS of `fit` on the folder < 200 MB.
 *
 * Times are wall seconds with the CPU seconds beside them (child and descendants). The
 * scipy ratios are skipped, saying so, where python3 with numpy and scipy is missing.
 *
 * Run alone: `npx tsx bench/whole-process.bench.ts [FILES]` (default 10,000 thirty-reading
 * surveys from bench/make-fleet.ts).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { makeFleet } from './make-fleet';
import { measureProcess, type Measured } from './measure-process';
import { outputFloor } from './output-floor';

const FILES = Number(process.argv[2] ?? 10_000);
const here = dirname(fileURLToPath(import.meta.url));
const cli = join(here, '..', 'bin', 'ringfall.mjs');
const targets = { loopVsScipy: 0.25, fiveVsScipy: 1.0, workerSpeedup: 1.7, fitRssMb: 200 };

const describe = (m: Measured): string =>
  `${m.seconds.toFixed(2)} s wall${m.cpuSeconds === null ? '' : `, ${m.cpuSeconds.toFixed(2)} s CPU`}${m.peakMb === null ? '' : `, peak RSS ${m.peakMb.toFixed(0)} MB`}${m.status === 0 || m.status === 1 || m.status === 3 ? '' : ` (exit ${m.status})`}`;
const verdict = (met: boolean): string => (met ? 'MET' : 'MISSED');

function scipyAvailable(): boolean {
  const probe = spawnSync('python3', ['-c', 'import numpy, scipy.optimize'], { stdio: 'ignore' });
  return probe.status === 0;
}

const scratch = mkdtempSync(join(tmpdir(), 'ringfall-whole-process-'));
let missed = false;
try {
  console.log(`${FILES.toLocaleString('en-US')} surveys of 30 on-axis readings; ${availableParallelism()} cores; load average ${loadavg().map((x) => x.toFixed(2)).join(' ')}`);
  // which build bin/ringfall.mjs runs (its --debug line): the package's dist/cli.js, or the sources through tsx (slower to start, and so are batch's workers)
  const which = spawnSync(process.execPath, [cli, '--debug', 'demo'], { encoding: 'utf8' }).stderr.split('\n').find((line) => line.startsWith('ringfall: running')) ?? 'ringfall: running (unknown)';
  console.log(`${which.replace('ringfall: ', '')} (npm run build:package first to measure what users install)`);
  const folder = join(scratch, 'fleet');
  makeFleet(folder, { files: FILES, readings: 30 });
  const row = (label: string, m: Measured) => console.log(`  ${label.padEnd(44)} ${describe(m)}`);

  const loop = await measureProcess(process.execPath, [cli, 'fit', folder, '--model', 'loop', '--json']);
  row('ringfall fit --model loop --json', loop);
  const five = await measureProcess(process.execPath, [cli, 'fit', folder, '--json']);
  row('ringfall fit --json (default five models)', five);
  const one = await measureProcess(process.execPath, [cli, 'batch', folder, '--json', '--workers', '1']);
  row('ringfall batch --json --workers 1', one);
  const two = await measureProcess(process.execPath, [cli, 'batch', folder, '--json', '--workers', '2']);
  row('ringfall batch --json --workers 2', two);

  let scipy: Measured | null = null;
  if (scipyAvailable()) {
    scipy = await measureProcess('python3', [join(here, 'scipy-loop-fit.py'), folder]);
    row('scipy least_squares lm, loop only', scipy);
  }

  console.log('targets:');
  if (scipy === null) {
    console.log('  fit vs scipy: skipped (python3 with numpy and scipy not found)');
  } else {
    const loopRatio = loop.seconds / scipy.seconds;
    const fiveRatio = five.seconds / scipy.seconds;
    console.log(`  fit --model loop / scipy: ${loopRatio.toFixed(2)}× (target ≤ ${targets.loopVsScipy}×) ${verdict(loopRatio <= targets.loopVsScipy)}`);
    console.log(`  fit default five / scipy loop-only: ${fiveRatio.toFixed(2)}× (target ≤ ${targets.fiveVsScipy}×) ${verdict(fiveRatio <= targets.fiveVsScipy)}`);
    missed ||= loopRatio > targets.loopVsScipy || fiveRatio > targets.fiveVsScipy;
    // what each run cannot avoid at any fitting speed (bench/output-floor.ts): if this alone is over the target, no analysis speed-up meets it here
    for (const [label, models] of [['loop run', ['--model', 'loop']], ['five-model run', []]] as const) {
      const reportFile = join(scratch, 'report.json');
      await measureProcess(process.execPath, [cli, 'fit', folder, ...models, '--json'], { stdoutFile: reportFile });
      const floor = await outputFloor(folder, reportFile);
      rmSync(reportFile);
      console.log(`    (floor of the ${label}, fits aside: Node's start ${floor.startSeconds.toFixed(2)} s + reading and hashing ${floor.readSeconds.toFixed(2)} s + the report's JSON text ${floor.textSeconds.toFixed(2)} s = ${floor.totalSeconds.toFixed(2)} s, ${(floor.totalSeconds / scipy.seconds).toFixed(2)}× scipy)`);
    }
  }
  const speedup = one.seconds / two.seconds;
  console.log(`  batch --workers 2 speed-up over 1: ${speedup.toFixed(2)}× (target ≥ ${targets.workerSpeedup}×, idle machine) ${verdict(speedup >= targets.workerSpeedup)}`);
  missed ||= speedup < targets.workerSpeedup;
  if (one.cpuSeconds !== null) {
    // --workers 1 runs the main thread and a worker at once (and V8's compiler and GC threads):
    // the cores it already keeps busy bound what a second worker can gain on this machine
    const busy = one.cpuSeconds / one.seconds;
    console.log(`    (--workers 1 already keeps ${busy.toFixed(2)} cores busy; on ${availableParallelism()} cores a second worker can gain at most ${(availableParallelism() / busy).toFixed(2)}×)`);
  }
  if (loop.peakMb === null) {
    console.log('  fit peak RSS: not measured (needs Linux /proc)');
  } else {
    console.log(`  fit --model loop peak RSS: ${loop.peakMb.toFixed(0)} MB (target < ${targets.fitRssMb} MB) ${verdict(loop.peakMb < targets.fitRssMb)}${FILES === 10_000 ? '' : ` (measured at ${FILES} files)`}`);
    if (five.peakMb !== null) console.log(`    (the default five models: ${five.peakMb.toFixed(0)} MB)`);
    missed ||= loop.peakMb >= targets.fitRssMb;
  }
} finally {
  rmSync(scratch, { recursive: true, force: true });
}
if (missed) process.exitCode = 1;
