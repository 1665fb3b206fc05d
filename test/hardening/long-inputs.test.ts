import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { longInputCases } from './long-input-cases';

const root = join(import.meta.dirname, '..', '..');
/**
 * A hang watchdog, not a speed target (run under a generous watchdog that will
 * fail on a hang). Linear parsers run all cases in well under a second; the quadratic
 * regular expressions they replace needed minutes for a single 10⁵-character case.
 */
const watchdogMs = 90_000;

describe('parsers of user text are linear', () => {
  it('every parser finishes on 10⁵-character inputs under a watchdog, with a RingfallError or a result, never a crash', () => {
    const run = spawnSync(process.execPath, ['--import', 'tsx', join('test', 'hardening', 'long-input-runner.ts')], {
      cwd: root, encoding: 'utf8', timeout: watchdogMs, killSignal: 'SIGKILL',
    });
    const lines = run.stdout.trim().split('\n');
    const finished = lines.filter((line) => line.startsWith('ok ')).length;
    const stuck = run.signal === null ? null : lines.at(-1)?.replace(/^start /, '') ?? '(before the first case)';
    expect(stuck, `watchdog stopped the run in case: ${stuck}`).toBeNull();
    expect(lines.filter((line) => line.startsWith('fail '))).toEqual([]);
    expect(run.status, run.stderr).toBe(0);
    expect(finished).toBe(longInputCases.length);
  }, watchdogMs + 30_000);
});
