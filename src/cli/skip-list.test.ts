import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { findSurveyFiles, skippedLines, type UnusablePath } from './find-survey-files';
import type { SkippedFiles } from './skip-list';

const root = mkdtempSync(join(tmpdir(), 'ringfall-skip-test-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

function tree(files: Record<string, string>): string {
  const folder = mkdtempSync(join(root, 'case-'));
  for (const [path, text] of Object.entries(files)) {
    mkdirSync(join(folder, path, '..'), { recursive: true });
    writeFileSync(join(folder, path), text);
  }
  return folder;
}

// pattern rules as gitignore(5) states them (git documentation), simplified: a trailing "/"
// matches folders only, a pattern without "/" matches a name at any depth, "*" stays within one name
describe('.ringfall-skip lists in folder searches', () => {
  it('leaves out what a folder\'s list names, says so once per list, and keeps everything else', () => {
    const folder = tree({
      '.ringfall-skip': '# broken on purpose\nflawed/\n\n*.bak.csv\nold/2019.csv\n',
      'a.csv': '', 'b.bak.csv': '', 'flawed/x.csv': '', 'flawed/deep/y.csv': '',
      'old/2019.csv': '', 'old/2020.csv': '', 'sub/c.bak.csv': '', 'sub/flawed': '',
    });
    const skipped: SkippedFiles[] = [];
    const files = findSurveyFiles([folder], { skipped });
    expect(files.map((f) => f.slice(folder.length + 1))).toEqual(['a.csv', 'old/2020.csv']);
    expect(skipped).toHaveLength(1);
    expect(skipped[0]!.list).toBe(join(folder, '.ringfall-skip'));
    expect(skipped[0]!.patterns).toEqual(['flawed/', '*.bak.csv', 'old/2019.csv']);
    expect(skipped[0]!.files.map((f) => f.slice(folder.length + 1))).toEqual(['b.bak.csv', 'flawed/deep/y.csv', 'flawed/x.csv', 'old/2019.csv', 'sub/c.bak.csv']);
    expect(skippedLines(skipped)).toEqual([`left out 5 files that ${join(folder, '.ringfall-skip')} lists as not surveys (flawed/, *.bak.csv, old/2019.csv); --no-skip fits them too`]);
  });

  it('fits everything with skip lists off, and never leaves out a file named directly', () => {
    const folder = tree({ '.ringfall-skip': 'flawed/\n', 'a.csv': '', 'flawed/x.csv': '' });
    expect(findSurveyFiles([folder], { skipLists: false })).toHaveLength(2);
    const skipped: SkippedFiles[] = [];
    const named = join(folder, 'flawed', 'x.csv');
    expect(findSurveyFiles([folder, named], { skipped }).sort()).toEqual([join(folder, 'a.csv'), named].sort());
    expect(skipped).toEqual([]);
  });

  it('honours a list in a subfolder for that subfolder only, and names the skipped files when nothing is left', () => {
    const folder = tree({ 'a/.ringfall-skip': '*.csv\n', 'a/x.csv': '', 'b/x.csv': '' });
    expect(findSurveyFiles([folder]).map((f) => f.slice(folder.length + 1))).toEqual(['b/x.csv']);
    const only = tree({ '.ringfall-skip': '*.csv\n', 'x.csv': '' });
    expect(() => findSurveyFiles([only])).toThrow(/holds no \.csv, \.tsv or \.txt file \(1 left out by .*\.ringfall-skip; --no-skip fits them\)/);
  });

  it('names a skip list that is there but cannot be read, and leaves nothing out by it', () => {
    const folder = tree({ 'a.csv': '', 'flawed/x.csv': '' });
    // a folder where the list should be: reading it fails with EISDIR (POSIX read(2)), even for root
    mkdirSync(join(folder, '.ringfall-skip'));
    const unusable: UnusablePath[] = [];
    expect(findSurveyFiles([folder], { unusable })).toHaveLength(2);
    expect(unusable).toEqual([{ source: join(folder, '.ringfall-skip'), code: 'INPUT_SKIP_LIST_UNREADABLE', reason: expect.stringContaining('Cannot read this skip list (EISDIR)') }]);
  });
});
