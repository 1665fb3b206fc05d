/**
 * Folders as people's disks hold them: named pipes, broken links, loops of links, a link
 * back to a parent folder, two paths to one file, a folder that cannot be listed. The run
 * never blocks, never aborts, reads each file once, and names every path it did not read.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { chmodSync, copyFileSync, mkdirSync, mkdtempSync, rmSync, symlinkSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

const root = resolve(__dirname, '../..');
const folder = mkdtempSync(join(tmpdir(), 'ringfall-odd-paths-'));
afterAll(() => {
  chmodSync(join(folder, 'locked'), 0o755);
  rmSync(folder, { recursive: true, force: true });
});

copyFileSync(join(root, 'sample-data', 'qa-107-2025-03-11-healthy.csv'), join(folder, 'a.csv'));
// mkfifo(1) from coreutils makes the named pipe; reading it would block until a writer comes
execFileSync('mkfifo', [join(folder, 'pipe.csv')]);
symlinkSync(join(folder, 'nothing.csv'), join(folder, 'broken.csv'));
symlinkSync(join(folder, 'loop-2.csv'), join(folder, 'loop-1.csv'));
symlinkSync(join(folder, 'loop-1.csv'), join(folder, 'loop-2.csv'));
symlinkSync(join(folder, 'a.csv'), join(folder, 'b-same-as-a.csv'));
mkdirSync(join(folder, 'sub'));
symlinkSync(folder, join(folder, 'sub', 'back-up'));
mkdirSync(join(folder, 'locked'));
copyFileSync(join(root, 'sample-data', 'qa-107-2025-03-11-healthy.csv'), join(folder, 'locked', 'c.csv'));
chmodSync(join(folder, 'locked'), 0o000);
// root reads any folder whatever its mode (capabilities(7), CAP_DAC_READ_SEARCH): the locked folder is then simply read
const asRoot = process.getuid?.() === 0;

function ringfall(...args: string[]) {
  return spawnSync(process.execPath, ['bin/ringfall.mjs', ...args], { cwd: root, encoding: 'utf8', timeout: 60_000, env: { ...process.env, SOURCE_DATE_EPOCH: '1773480600' } });
}

describe('odd paths in a searched folder', () => {
  it('fit reads each regular file once and names each path it did not read, exit 2', () => {
    const run = ringfall('fit', folder, '--model', 'loop', '--json');
    expect(run.status).toBe(2);
    const report = JSON.parse(run.stdout) as { surveys: { source: string }[] };
    // a.csv and the link to it are one file, read once; the link back up is not followed again
    expect(report.surveys.map((s) => s.source)).toEqual([join(folder, 'a.csv'), ...(asRoot ? [join(folder, 'locked', 'c.csv')] : [])]);
    const lines = run.stderr.trim().split('\n');
    expect(lines).toEqual(expect.arrayContaining([
      `ringfall: "${join(folder, 'broken.csv')}": Not read: it is a symbolic link to a file that does not exist. Fix or remove the link.`,
      `ringfall: "${join(folder, 'loop-1.csv')}": Not read: it is a symbolic link that leads into a loop of links (ELOOP). Fix or remove the link.`,
      expect.stringMatching(/^ringfall: ".*pipe\.csv": Not read: it is a named pipe \(FIFO\), not a regular file/),
    ]));
    if (!asRoot) expect(run.stderr).toContain(`"${join(folder, 'locked')}": Cannot list the folder (EACCES)`);
  });

  it('batch lists the same paths as files that could not be used, fits the rest, exit 2', () => {
    const run = ringfall('batch', folder, '--model', 'loop', '--json', '--workers', '1');
    expect(run.status).toBe(2);
    const report = JSON.parse(run.stdout) as { surveys: unknown[]; fleet: { unreadable: { source: string; code: string }[] } };
    expect(report.surveys).toHaveLength(asRoot ? 2 : 1);
    const codes = Object.fromEntries(report.fleet.unreadable.map((u) => [u.source.slice(folder.length + 1), u.code]));
    expect(codes).toMatchObject({ 'broken.csv': 'INPUT_LINK_BROKEN', 'loop-1.csv': 'INPUT_SYMLINK_LOOP', 'loop-2.csv': 'INPUT_SYMLINK_LOOP', 'pipe.csv': 'INPUT_NOT_REGULAR' });
    if (!asRoot) expect(codes['locked']).toBe('INPUT_FOLDER_UNREADABLE');
  });

  it('a named pipe given by name is refused at once, not waited on', () => {
    const run = ringfall('fit', join(folder, 'pipe.csv'));
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/it is a named pipe \(FIFO\), not a regular file/);
    expect(run.stderr.trim().split('\n')).toHaveLength(1);
  });
});
