/**
 * Fleet size benchmark: `ringfall batch --json` on 50,000 generated survey files (target:
 * peak RSS under 500 MB, the whole process with its workers) and `batch --out` on 20,000
 * (target: under 300 MB written). Peak RSS is the kernel's high-water mark (VmHWM in
 * /proc/PID/status, polled every 50 ms while the run lasts; Linux only, skipped
 * elsewhere). Also prints the RSS per 1,000 files between a tenth of the fleet and the
 * whole, to show whether memory grows with the number of files.
 *
 * Run alone: `npx tsx bench/fleet-memory.bench.ts [JSON_FILES] [OUT_FILES]`.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, rmSync, statSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { makeFleet } from './make-fleet';

const JSON_FILES = Number(process.argv[2] ?? 50_000);
const OUT_FILES = Number(process.argv[3] ?? 20_000);
const RSS_TARGET_MB = 500;
const OUT_TARGET_MB = 300;
const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const cli = join(root, 'bin', 'ringfall.mjs');

/**
 * Run the CLI, read and discard its output, and return the peak RSS (MB, or null off Linux)
 * and wall seconds. stdout is read by this Node process, as a program calling ringfall reads
 * it: a socket pair, which takes writes asynchronously (a pipe into `cat` blocks the writer
 * instead, and used to show a far lower peak), so the writer's backpressure is measured too.
 */
function measured(args: readonly string[]): Promise<{ peakMb: number | null; seconds: number; status: number | null }> {
  const started = performance.now();
  const child = spawn(process.execPath, [cli, ...args], { stdio: ['ignore', 'pipe', 'ignore'] });
  child.stdout.resume();
  let peakKb: number | null = null;
  const poll = setInterval(() => {
    try {
      const match = /VmHWM:\s+(\d+) kB/.exec(readFileSync(`/proc/${child.pid}/status`, 'utf8'));
      if (match) peakKb = Math.max(peakKb ?? 0, Number(match[1]));
    } catch {
      // the process has ended, or this is not Linux
    }
  }, 50);
  return new Promise((done) => child.on('exit', (status) => {
    clearInterval(poll);
    done({ peakMb: peakKb === null ? null : peakKb / 1024, seconds: (performance.now() - started) / 1000, status });
  }));
}

function folderMb(folder: string): number {
  return readdirSync(folder).reduce((sum, name) => sum + statSync(join(folder, name)).size, 0) / 2 ** 20;
}

const scratch = mkdtempSync(join(tmpdir(), 'ringfall-fleet-memory-'));
try {
  console.log(`load average ${loadavg().map((x) => x.toFixed(2)).join(' ')}; stdout read by a Node parent (socket pair)`);
  const tenth = Math.max(100, Math.round(JSON_FILES / 10));
  makeFleet(join(scratch, 'small'), { files: tenth, readings: 30 });
  makeFleet(join(scratch, 'large'), { files: JSON_FILES, readings: 30 });
  const small = await measured(['batch', join(scratch, 'small'), '--json']);
  const large = await measured(['batch', join(scratch, 'large'), '--json']);
  if (large.peakMb === null || small.peakMb === null) {
    console.log('peak RSS: not measured (needs Linux /proc)');
  } else {
    const perThousand = ((large.peakMb - small.peakMb) / (JSON_FILES - tenth)) * 1000;
    console.log(`batch --json, ${tenth} files: peak RSS ${small.peakMb.toFixed(0)} MB, ${small.seconds.toFixed(1)} s`);
    console.log(`batch --json, ${JSON_FILES} files: peak RSS ${large.peakMb.toFixed(0)} MB, ${large.seconds.toFixed(1)} s (exit ${large.status})`);
    console.log(`  growth ${perThousand.toFixed(1)} MB per 1,000 files; target < ${RSS_TARGET_MB} MB at 50,000: ratio ${(large.peakMb / RSS_TARGET_MB).toFixed(2)} ${large.peakMb < RSS_TARGET_MB ? 'MET' : 'MISSED'}${JSON_FILES === 50_000 ? '' : ` (measured at ${JSON_FILES} files)`}`);
  }
  makeFleet(join(scratch, 'pages'), { files: OUT_FILES, readings: 30 });
  const out = join(scratch, 'out');
  const pages = await measured(['batch', join(scratch, 'pages'), '--out', out]);
  const written = folderMb(out);
  console.log(`batch --out, ${OUT_FILES} files: ${written.toFixed(0)} MB written in ${pages.seconds.toFixed(1)} s, peak RSS ${pages.peakMb?.toFixed(0) ?? '?'} MB (exit ${pages.status})`);
  console.log(`  target < ${OUT_TARGET_MB} MB at 20,000 files: ratio ${(written / OUT_TARGET_MB).toFixed(2)} ${written < OUT_TARGET_MB ? 'MET' : 'MISSED'}${OUT_FILES === 20_000 ? '' : ` (measured at ${OUT_FILES} files)`}`);
} finally {
  rmSync(scratch, { recursive: true, force: true });
}
