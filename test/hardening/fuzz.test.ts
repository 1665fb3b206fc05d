import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { fuzzProperties } from './fuzz-properties';

const root = join(import.meta.dirname, '..', '..');
/** A hang watchdog for the whole suite, not a speed target. */
const watchdogMs = 240_000;

let results = new Map<string, { ok: boolean; message: string }>();
let stuck: string | null = null;
let stderr = '';

beforeAll(() => {
  const run = spawnSync(process.execPath, ['--import', 'tsx', join('test', 'hardening', 'fuzz-runner.ts')], {
    cwd: root, encoding: 'utf8', timeout: watchdogMs, killSignal: 'SIGKILL', maxBuffer: 1 << 24,
  });
  const lines = run.stdout.split('\n').filter((line) => line !== '');
  results = new Map(lines.filter((line) => line.startsWith('{')).map((line) => {
    const result = JSON.parse(line) as { name: string; ok: boolean; message: string };
    return [result.name, result];
  }));
  stuck = run.signal === null ? null : lines.at(-1)?.replace(/^start /, '') ?? '(before the first property)';
  stderr = run.stderr;
}, watchdogMs + 30_000);

describe('fuzz suite (fast-check, seeded, in a child process under a hang watchdog)', () => {
  it('the runner finished every property before the watchdog', () => {
    expect(stuck, `watchdog stopped the run in: ${stuck}`).toBeNull();
    expect(results.size, stderr).toBe(fuzzProperties.length);
  });
  for (const { name } of fuzzProperties) {
    it(`property: ${name}`, () => {
      const result = results.get(name);
      expect(result, `no result (stuck in ${stuck}); ${stderr.slice(0, 2000)}`).toBeDefined();
      expect(result?.message).toBe('');
      expect(result?.ok).toBe(true);
    });
  }
});
