import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

// --files-from LIST (fit and batch): the survey paths in a file or on standard input, one
// per line, for runs whose file names would not fit on a command line (CONTRACT.md).
const root = join(import.meta.dirname, '..', '..');
const scratch = mkdtempSync(join(tmpdir(), 'ringfall-files-from-'));
const files = ['sample-data/qa-107-2025-03-11-healthy.csv', 'sample-data/qm-03-2026-01-20-mat.csv', 'sample-data/qt-9-2026-02-03-thick.csv'];

// a fixed time of the run (SOURCE_DATE_EPOCH), so two runs' reports can be compared byte for byte
function ringfall(args: string[], input?: string) {
  const result = spawnSync(process.execPath, ['bin/ringfall.mjs', ...args], { cwd: root, encoding: 'utf8', timeout: 120_000, env: { ...process.env, SOURCE_DATE_EPOCH: '1773480600' }, ...(input === undefined ? {} : { input }) });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

function list(name: string, text: string): string {
  const path = join(scratch, name);
  writeFileSync(path, text);
  return path;
}

afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('--files-from', () => {
  it('fit --files-from LIST (CRLF, blank lines) plus a path on the command line reports the same surveys as all the paths on the command line', () => {
    const direct = ringfall(['fit', ...files, '--model', 'loop', '--json']);
    const listed = ringfall(['fit', '--files-from', list('crlf.txt', `\r\n${files[0]}\r\n\r\n${files[1]}\r\n  \r\n`), files[2]!, '--model', 'loop', '--json']);
    expect(listed.stderr).toBe('');
    expect(listed.status).toBe(direct.status);
    expect(listed.stdout).toBe(direct.stdout);
    expect(JSON.parse(listed.stdout).surveys).toHaveLength(3);
  });

  it('fit --files-from - reads the list from standard input', () => {
    const run = ringfall(['fit', '--files-from', '-', '--model', 'loop', '--json'], `${files.join('\n')}\n`);
    expect(run.stderr).toBe('');
    expect(JSON.parse(run.stdout).surveys.map((s: { source: string }) => s.source)).toEqual([...files].sort());
  });

  it('batch --files-from LIST fits the listed files on workers', () => {
    const run = ringfall(['batch', '--files-from', list('batch.txt', files.join('\n')), '--workers', '1', '--json']);
    expect([0, 1]).toContain(run.status);
    expect(JSON.parse(run.stdout).surveys).toHaveLength(3);
  });

  it('a listed path that does not exist: exit 2, one line naming the list, the line number and the path, nothing fitted', () => {
    const path = list('missing.txt', `${files[0]}\n\nsample-data/nope.csv\n`);
    for (const command of ['fit', 'batch']) {
      const run = ringfall([command, '--files-from', path, '--json']);
      expect(run.status).toBe(2);
      expect(run.stdout).toBe('');
      expect(run.stderr).toContain(`ringfall: --files-from "${path}": 1 of 2 paths do not exist: line 3 "sample-data/nope.csv".`);
      expect(run.stderr.trim().split('\n')).toHaveLength(1);
    }
  });

  it('an empty list, a list that cannot be read, and no input at all are usage errors (exit 2, one line)', () => {
    const empty = ringfall(['fit', '--files-from', list('empty.txt', '\n \n')]);
    expect(empty.status).toBe(2);
    expect(empty.stderr).toContain('names no file (blank lines are skipped)');
    const unreadable = ringfall(['batch', '--files-from', join(scratch, 'no-such-list.txt')]);
    expect(unreadable.status).toBe(2);
    expect(unreadable.stderr).toContain('ENOENT');
    const none = ringfall(['batch']);
    expect(none.status).toBe(2);
    expect(none.stderr).toContain('--files-from FILE');
  });
});
