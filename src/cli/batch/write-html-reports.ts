import { accessSync, constants, mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { RingfallError } from '../../core/errors';
import type { Report } from '../../core/report/report';
import { chartLibrarySource } from '../../web/report-view/chart-library-node';
import { renderReportDocument } from '../../web/report-view/index';
import { renderFleetIndexPage } from './fleet-index-page';
import { fleetRows } from './fleet-rows';
import type { BatchCoverage } from './render-fleet-summary';

/**
 * `batch --out DIR`: one self-contained HTML report per coil (its surveys, its history in
 * the fleet section; the web page's report view, renderReportDocument), one per survey
 * without a coil id, and index.html linking them. File names come from coil ids made
 * safe (pageNames); the text inside is escaped by the report view.
 *
 * @returns the paths written, index.html first
 * @throws RingfallError `OUTPUT_UNWRITABLE` when the folder or a file cannot be written
 */
export function writeHtmlReports(folder: string, report: Report, coverage: BatchCoverage): string[] {
  const rows = fleetRows(report);
  const names = pageNames(rows.map((row) => row.coil ?? row.latest.source.replace(/^.*[\\/]/, '').replace(/\.[^.]*$/, '')));
  const chartLibrary = chartLibrarySource();
  const written: string[] = [];
  const write = (name: string, text: string) => {
    const path = join(folder, name);
    try {
      writeFileSync(path, text);
    } catch (cause) {
      throw unwritable(path, cause);
    }
    written.push(path);
  };
  prepareOutFolder(folder);
  write('index.html', renderFleetIndexPage(report, names, coverage));
  rows.forEach((row, i) => {
    const surveys = row.coil === null ? [row.latest] : report.surveys.filter((survey) => survey.coil === row.coil);
    const fleet = { coils: row.history ? [row.history] : [], unreadable: [] };
    const title = row.coil === null ? `ringfall report: ${row.latest.source}` : `ringfall report: coil ${row.coil}`;
    const subtitle = `${surveys.length} survey${surveys.length === 1 ? '' : 's'}${coverage.interrupted ? ' (partial batch)' : ''}; fleet summary in index.html`;
    write(names[i]!, renderReportDocument({ surveys, fleet, ...(report.run ? { run: report.run } : {}) }, { chartLibrary, title, subtitle }));
  });
  return written;
}

/**
 * Make the `--out` folder (and its parents) and check it can be written: `batch` calls
 * this before fitting, so a bad folder is refused at once rather than after the whole run.
 * @throws RingfallError `OUTPUT_UNWRITABLE`
 */
export function prepareOutFolder(folder: string): void {
  try {
    mkdirSync(folder, { recursive: true });
    accessSync(folder, constants.W_OK);
  } catch (cause) {
    throw unwritable(folder, cause);
  }
}

/**
 * File names for pages from coil ids: letters, digits, '.', '_' and '-' kept (lower case),
 * every other run of characters becomes '-', at most 60 characters; a name already taken
 * (or "index") gets "-2", "-3", … in order, so names are unique and the same every run.
 * @example pageNames(['QA-107', 'qa 107', '<img>']) // ['qa-107.html', 'qa-107-2.html', 'img.html']
 */
export function pageNames(ids: readonly string[]): string[] {
  const taken = new Set(['index']);
  return ids.map((id) => {
    const base = id.normalize('NFKD').toLowerCase().replace(/[^a-z0-9._-]+/g, '-').replace(/^[-.]+|[-.]+$/g, '').slice(0, 60) || 'coil';
    let name = base;
    for (let n = 2; taken.has(name); n++) name = `${base}-${n}`;
    taken.add(name);
    return `${name}.html`;
  });
}

function unwritable(path: string, cause: unknown): RingfallError {
  const code = (cause as NodeJS.ErrnoException | null)?.code ?? (cause as Error).message;
  return new RingfallError('OUTPUT_UNWRITABLE', `--out: cannot write "${path}" (${code}). Choose a folder you can write to.`, { value: path, where: '--out', cause });
}
