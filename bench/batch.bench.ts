/**
 * Batch benchmark (issue 6): whole-process time of `ringfall batch DIR` on 10,000
 * generated 30-reading survey files (bench/make-fleet.ts: 2,000 coils × 5 quarterly
 * surveys), the 5 default models per survey, text summary to a pipe. Target: under 10 s
 * wall on this 2-core machine. Prints wall and CPU seconds of the child process, the
 * fixed cost (the same command on one file: Node, the cached CLI bundle, bundling the
 * worker, worker start-up) and, to show what dominates, a single-thread breakdown on 200
 * of the files: read + import, and fitSurvey per model with the default multi-start and
 * with the data-driven start only.
 * CPU seconds are less sensitive than wall time to other work on a shared machine; the
 * load average is printed. Exits 1 when the target is missed.
 *
 * Run alone: `npx tsx bench/batch.bench.ts [FILES]`.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { defaultModels } from '../src/core/fit/fit-survey-options';
import { fitSurvey } from '../src/core/fit/strategy/fit-survey';
import { importSurveys } from '../src/io';
import { makeFleet } from './make-fleet';

const TARGET_SECONDS = 10;
const FILES = Number(process.argv[2] ?? 10_000);
const SAMPLE = 200;
const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const cli = join(root, 'bin', 'ringfall.mjs');

/** CPU seconds of this process's waited-for children (Linux /proc: cutime + cstime), or null elsewhere. */
function childCpuSeconds(): number | null {
  try {
    const fields = readFileSync('/proc/self/stat', 'utf8').replace(/^.*\) /s, '').split(' ');
    // Fields after "(comm) ": state is index 0, so cutime (field 16) is index 13, cstime index 14; ticks of 1/100 s.
    return (Number(fields[13]) + Number(fields[14])) / 100;
  } catch {
    return null;
  }
}

function runBatch(args: readonly string[]): { wall: number; cpu: number | null; status: number | null; stdout: string; stderr: string } {
  const cpuBefore = childCpuSeconds();
  const started = performance.now();
  const result = spawnSync(process.execPath, [cli, 'batch', ...args], { encoding: 'utf8', maxBuffer: 1 << 30 });
  const wall = (performance.now() - started) / 1000;
  const cpuAfter = childCpuSeconds();
  return { wall, cpu: cpuBefore === null || cpuAfter === null ? null : cpuAfter - cpuBefore, status: result.status, stdout: result.stdout, stderr: result.stderr };
}

function msPer(count: number, body: () => void): number {
  const started = performance.now();
  body();
  return (performance.now() - started) / count;
}

const folder = mkdtempSync(join(tmpdir(), 'ringfall-batch-bench-'));
try {
  const generated = performance.now();
  const files = makeFleet(folder, { files: FILES, readings: 30 });
  console.log(`generated ${files.length} survey files (30 readings each) in ${((performance.now() - generated) / 1000).toFixed(1)} s`);
  console.log(`machine: ${availableParallelism()} cores, load average ${loadavg().map((x) => x.toFixed(1)).join(' ')}`);

  const single = runBatch([files[0]!]);
  const whole = runBatch([folder]);
  if (whole.status !== 0 && whole.status !== 1) {
    console.error(`ringfall batch failed with status ${whole.status}:\n${whole.stderr}`);
    process.exit(1);
  }
  const coils = /Fleet summary: (\d+) coils, (\d+) surveys/.exec(whole.stdout);

  // Single-thread breakdown on a sample: what one worker spends per file.
  const sample = files.slice(0, SAMPLE);
  const texts = sample.map((path) => readFileSync(path, 'utf8'));
  const surveys = texts.map((text, i) => importSurveys(text, { source: sample[i]! }).surveys[0]!);
  for (const survey of surveys.slice(0, 20)) fitSurvey(survey); // warm-up for the JIT
  const importMs = msPer(sample.length, () => sample.forEach((path) => importSurveys(readFileSync(path, 'utf8'), { source: path })));
  const perModel = defaultModels.map((model) => ({
    model,
    multi: msPer(surveys.length, () => surveys.forEach((s) => fitSurvey(s, { models: [model] }))),
    single: msPer(surveys.length, () => surveys.forEach((s) => fitSurvey(s, { models: [model], starts: 0 }))),
  }));
  const fitMs = msPer(surveys.length, () => surveys.forEach((s) => fitSurvey(s)));

  const row = (label: string, value: string) => console.log(`  ${label.padEnd(46)} ${value}`);
  console.log(`\nringfall batch on ${files.length} files (${coils ? `${coils[1]} coils, ${coils[2]} surveys` : 'summary not found'}), exit status ${whole.status}`);
  row('wall time', `${whole.wall.toFixed(2)} s   (target ${TARGET_SECONDS} s, ratio ${(whole.wall / TARGET_SECONDS).toFixed(2)})`);
  row('CPU time of the process (all threads)', whole.cpu === null ? 'n/a' : `${whole.cpu.toFixed(2)} s   (${((1000 * whole.cpu) / files.length).toFixed(2)} ms per file)`);
  row('files per wall second', `${Math.round(files.length / whole.wall)}`);
  row('fixed cost: same command on 1 file (wall)', `${single.wall.toFixed(2)} s   (CPU ${single.cpu === null ? 'n/a' : `${single.cpu.toFixed(2)} s`})`);
  console.log(`\nsingle thread, per survey file (${SAMPLE}-file sample):`);
  row('read + import', `${importMs.toFixed(3)} ms`);
  for (const { model, multi, single: one } of perModel) {
    row(`fitSurvey ${model}`, `${multi.toFixed(3)} ms with adaptive starts (at most 8 extra), ${one.toFixed(3)} ms data-driven start only`);
  }
  row('fitSurvey, 5 default models', `${fitMs.toFixed(3)} ms`);
  const budget = (TARGET_SECONDS * availableParallelism() * 1000) / files.length;
  row('CPU budget per file to meet the target', `${budget.toFixed(3)} ms (all cores busy, no fixed cost)`);
  row('share of the fit in a file\'s work', `${((100 * fitMs) / (fitMs + importMs)).toFixed(1)} %`);
  if (whole.wall > TARGET_SECONDS) {
    console.log(`\nMISSED: ${whole.wall.toFixed(1)} s > ${TARGET_SECONDS} s (ratio ${(whole.wall / TARGET_SECONDS).toFixed(2)}).`);
    process.exitCode = 1;
  }
} finally {
  rmSync(folder, { recursive: true, force: true });
}
