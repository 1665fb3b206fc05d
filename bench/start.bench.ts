/**
 * Cold-start benchmark: wall time of `ringfall fit FILE --json` on one sample survey, run
 * from the packed package installed in an empty project (dist/, what users get) and from
 * this checkout (bin/ringfall.mjs: dist/ when it is current, else the sources via tsx).
 * Target: the installed package starts no slower than the checkout. Prints the median of
 * several runs of each and their ratio; exits 1 when the target is missed.
 *
 * Run alone: `npx tsx bench/start.bench.ts [RUNS]` (packs and installs once, ~10 s).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { packAndInstall } from '../test/support/packed-install';

const RUNS = Number(process.argv[2] ?? 7);
const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const survey = join(root, 'sample-data', 'qa-107-2025-03-11-healthy.csv');

function medianSeconds(bin: string, cwd: string): number {
  const times: number[] = [];
  for (let run = 0; run < RUNS; run += 1) {
    const started = performance.now();
    const result = spawnSync(process.execPath, [bin, 'fit', survey, '--json'], { cwd, encoding: 'utf8', maxBuffer: 1 << 26 });
    times.push((performance.now() - started) / 1000);
    if (result.status !== 0) throw new Error(`${bin} fit exited ${result.status}: ${result.stderr}`);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)]!;
}

const scratch = mkdtempSync(join(tmpdir(), 'ringfall-start-bench-'));
try {
  const { project } = packAndInstall(root, scratch);
  const installed = medianSeconds(join(project, 'node_modules', 'ringfall', 'bin', 'ringfall.mjs'), project);
  const checkout = medianSeconds(join(root, 'bin', 'ringfall.mjs'), root);
  const ratio = installed / checkout;
  process.stdout.write(`load average ${loadavg()[0]!.toFixed(2)}; median of ${RUNS} runs of fit FILE --json\n`);
  process.stdout.write(`installed package  ${installed.toFixed(3)} s\n`);
  process.stdout.write(`checkout           ${checkout.toFixed(3)} s\n`);
  process.stdout.write(`ratio installed/checkout ${ratio.toFixed(2)} (target <= 1.00): ${ratio <= 1 ? 'met' : 'MISSED'}\n`);
  if (ratio > 1) process.exitCode = 1;
} finally {
  rmSync(scratch, { recursive: true, force: true });
}
