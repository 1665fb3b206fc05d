import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyseSurvey, importSurveys } from '../../src/index';
import { defaultSettings } from '../../src/web/fit-settings';
import { runPipeline } from '../../src/web/pipeline';

// A file-level note (here: a column ringfall does not know) belongs to every survey of the
// file; the report must show it once, whichever view builds the report.
const text = 'distance (mm),B (mT),operator\n10,1.2,ann\n20,0.8,ann\n30,0.5,ann\n40,0.3,ann\n';
const ignored = (notes: readonly string[]) => notes.filter((note) => note.includes('"operator" is not used'));

describe('file-level import notes', () => {
  it('appear once in the report analyseSurvey builds (CLI fit and batch use it)', () => {
    const { surveys } = importSurveys(text, { source: 'extra.csv' });
    expect(ignored(surveys[0]!.notes)).toHaveLength(1);
    const report = analyseSurvey(surveys[0]!, { fit: { models: ['inverse-square'] }, specs: [], thresholds: [] });
    expect(ignored(report.notes)).toHaveLength(1);
  });

  it('appear once in the page\'s report', () => {
    const outcome = runPipeline([{ id: 'a', name: 'extra.csv', text }], { ...defaultSettings, models: ['inverse-square'], spec: '', thresholds: [] });
    expect(ignored(outcome.report.surveys[0]!.notes)).toHaveLength(1);
  });

  it('appear once in `ringfall fit` and `ringfall batch` reports', () => {
    const folder = mkdtempSync(join(tmpdir(), 'ringfall-notes-'));
    try {
      const file = join(folder, 'extra.csv');
      writeFileSync(file, text);
      const root = join(import.meta.dirname, '..', '..');
      for (const command of ['fit', 'batch']) {
        const run = spawnSync(process.execPath, ['bin/ringfall.mjs', command, file, '--model', 'inverse-square', '--json'], { cwd: root, encoding: 'utf8', timeout: 120_000 });
        const report = JSON.parse(run.stdout) as { surveys: { notes: string[] }[] };
        expect(ignored(report.surveys[0]!.notes), command).toHaveLength(1);
      }
    } finally {
      rmSync(folder, { recursive: true, force: true });
    }
  }, 120_000);
});
