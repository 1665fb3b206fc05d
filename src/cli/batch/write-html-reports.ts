import { join } from 'node:path';
import type { Report, SurveyReport } from '../../core/report/report';
import { chartLibrarySource } from '../chart-library';
import { renderReportDocument } from '../../render/index';
import { renderFleetIndexPage } from './fleet-index-page';
import { fleetRows, type FleetRow } from './fleet-rows';
import type { BatchCoverage } from './render-fleet-summary';
import { unwritable } from './out-folder-lock';
import { yieldToEvents, type StopSignals } from '../stop-signals';
import { writeFileAtomic } from '../write-file-atomic';

/** The one copy of Chart.js in an `--out` folder, loaded by every page by this relative path (so still offline). */
export const chartLibraryFile = 'ringfall-charts.js';

/**
 * `batch --out DIR`: one HTML report per coil (its latest survey in full, the others in the
 * survey table, its history in
 * the fleet section; the web page's report view, renderReportDocument), one per survey
 * without a coil id, and index.html linking them; the pages load the folder's one copy of
 * Chart.js (ringfall-charts.js, written first), still offline. The pages come first, the index last, each
 * file under a temporary name renamed into place when whole (writeFileAtomic): a run that
 * fails part-way (a full disk) leaves no truncated file and no link to a page that is not
 * there. A stop request (SIGINT, SIGTERM) between pages ends the pages early; the index
 * then lists every coil, links the pages written and says it is partial. File names come
 * from coil ids made safe (pageNames); the text inside is escaped by the report view.
 * `surveysOf` gives a row's surveys (batch reads them back from its spool; by default
 * they are taken from `report`).
 *
 * @returns the paths written, index.html first
 * @throws RingfallError `OUTPUT_UNWRITABLE` when a file cannot be written (the pages
 *   already in place stay; the index is not written)
 */
export async function writeHtmlReports(
  folder: string, report: Report, coverage: BatchCoverage, stop: Pick<StopSignals, 'signal'> | null = null,
  surveysOf: (row: FleetRow) => readonly SurveyReport[] = (row) => (row.coil === null ? [row.latest] : report.surveys.filter((survey) => survey.coil === row.coil)),
): Promise<string[]> {
  const rows = fleetRows(report);
  const names = pageNames(rows.map((row) => row.coil ?? row.latest.source.replace(/^.*[\\/]/, '').replace(/\.[^.]*$/, '')));
  const written: string[] = [];
  const write = (name: string, text: string) => {
    const path = join(folder, name);
    try {
      writeFileAtomic(path, text);
    } catch (cause) {
      throw unwritable(path, cause);
    }
    written.push(path);
  };
  // one copy of Chart.js for every page (a fleet's pages would otherwise each carry it)
  write(chartLibraryFile, chartLibrarySource());
  const chartLibrary = { file: chartLibraryFile };
  const pages: (string | null)[] = rows.map(() => null);
  for (const [i, row] of rows.entries()) {
    await yieldToEvents();
    if (stop?.signal) break;
    const surveys = surveysOf(row);
    const fleet = { coils: row.history ? [row.history] : [], unreadable: [] };
    const title = row.coil === null ? `ringfall report: ${row.latest.source}` : `ringfall report: coil ${row.coil}`;
    const subtitle = `${surveys.length} survey${surveys.length === 1 ? '' : 's'}${coverage.interrupted ? ' (partial batch)' : ''}; fleet summary in index.html`;
    // a page's run record names the files its surveys came from (the index names them all)
    const sources = new Set(surveys.map((survey) => survey.source.replace(/ \(.*\)$/, '')));
    const run = report.run === undefined ? undefined : { ...report.run, inputs: report.run.inputs.filter((input) => sources.has(input.name)) };
    write(names[i]!, renderReportDocument({ surveys, fleet, ...(run ? { run } : {}) }, { chartLibrary, title, subtitle, detail: 'latest' }));
    pages[i] = names[i]!;
  }
  const pagesStopped = pages.some((page) => page === null);
  write('index.html', renderFleetIndexPage(report, pages, { ...coverage, pagesStopped }));
  return [written.pop()!, ...written];
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
