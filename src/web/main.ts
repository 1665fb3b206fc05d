/**
 * The ringfall web page: drop survey files, see what the importer read, choose how to
 * fit, read the report. Parsing and fitting run in a Web Worker; files never leave the
 * machine. Starts with the bundled sample survey loaded.
 */
import { columnsPanel } from './columns-panel';
import { h, replaceChildren } from './dom';
import { modelLookup, parameterNames, parameterUnit } from './fit-stage';
import { defaultSettings, parseFitSettings, type FitSettings } from './fit-settings';
import { intakePanel, type FileEntry } from './intake-panel';
import type { ColumnMapping } from '../io';
import { pageReport, pageText } from './page-words';
import { reportPanel } from './report-panel';
import { reportStyles } from '../render';
import { firstSample, fleetSpec, sampleSpecs, sampleSurveys } from './sample-files';
import { settingsPanel } from './settings-panel';
import { thresholdsPanel } from './thresholds-panel';
import { PipelineWorker } from './worker-client';
import { describePageBytes, describePageText, pageRunRecord, pageTime } from './page-run-record';
import type { RunInput } from '../core/report/run-record';
import type { Report } from '../core/report/report';
import { fromJsonReport } from '../core/report/from-json-report';
import './styles.css';

interface PageFile extends FileEntry {
  readonly mapping: readonly ColumnMapping[] | null;
  /** Set when the browser could not read the file: it stays listed with the reason, never fitted. */
  readonly unreadable?: boolean;
  /** A bundled sample, put aside when the user adds a file of their own. */
  readonly sample?: boolean;
  /** The file as the run record lists it (name, size, SHA-256), once hashed. */
  readonly input: Promise<RunInput>;
}

let files: PageFile[] = [];
/** Samples put aside for the user's first own file, offered back until then changed. */
let setAside: PageFile[] = [];
let settings: FitSettings = defaultSettings;
let nextId = 1;
const worker = new PipelineWorker();

const style = document.createElement('style');
style.textContent = reportStyles;
document.head.appendChild(style);

const report = reportPanel(modelLookup);
const intake = intakePanel({
  addFiles: (list) => { void addFiles(list); },
  openSampleFleet: sampleSurveys.length > 0 ? () => openSamples(sampleSurveys) : null,
  removeFile: (id) => { files = files.filter((f) => f.id !== id); refit(); },
  clearFiles: () => { files = []; setAside = []; intake.offerSetAside(null); refit(); },
  keepSetAside,
});
const columnsHost = h('section', { class: 'panel', 'aria-labelledby': 'columns-heading' },
  h('h2', { id: 'columns-heading' }, 'What the files said'), h('p', { class: 'muted' }, 'Columns, units and rows not used appear here once a file is read.'));
const updateSettings = (change: Partial<FitSettings>) => { settings = { ...settings, ...change }; scheduleRefit(); };
const settingsUi = settingsPanel({
  settings: () => settings, update: updateSettings, modelLabel: (id) => modelLookup(id)?.label ?? '',
  parameterNames, sampleSpecs,
});
const levels = thresholdsPanel(() => settings, updateSettings);

const app = document.getElementById('app') ?? document.body;
replaceChildren(app,
  h('a', { class: 'skip-link', href: '#report' }, 'Skip to the report'),
  h('header', { class: 'page-head' }, h('h1', {}, 'ringfall'), h('p', {}, 'Gaussmeter readings in, coil out: fitted ampere-turns, radius and probe offset with honest intervals.')),
  h('div', { class: 'layout' },
    h('div', { class: 'controls' }, intake.element, columnsHost, settingsUi.element, levels.element),
    report.element));

async function addFiles(list: readonly File[]): Promise<void> {
  performance.mark('ringfall:files');
  // one file the browser cannot read (moved, a folder, no permission) must not hide the others or vanish itself
  const read = await Promise.allSettled(list.map(async (file) => new Uint8Array(await file.arrayBuffer())));
  const added: PageFile[] = [];
  for (const [i, file] of list.entries()) {
    const id = `f${nextId++}`;
    const result = read[i]!;
    if (result.status === 'fulfilled') {
      const text = new TextDecoder().decode(result.value);
      // a report saved from ringfall (JSON) is shown as it was saved, not added as a survey
      if (savedReportText(file.name, text)) {
        showSavedReport(file.name, text);
        continue;
      }
      added.push({ id, name: file.name, text, outcome: null, mapping: null, input: describePageBytes(file.name, result.value) });
      continue;
    }
    const message = `The browser could not read this file (${String(result.reason)}). Check that it is a file, not a folder, and that it can be opened, then choose it again.`;
    added.push({
      id, name: file.name, text: '', mapping: null, unreadable: true, input: Promise.resolve({ name: file.name, sha256: null, bytes: null, note: 'the browser could not read it' }),
      outcome: { id, name: file.name, error: { code: 'FILE_UNREADABLE', message }, detection: null, counts: null, surveys: [], skipped: [], rowsNotUsed: [], rowsNotUsedTotal: 0 },
    });
  }
  if (added.length === 0) return;
  // the user's own files replace the bundled sample (offered back), newest first
  if (files.length > 0 && files.every((f) => f.sample === true)) {
    setAside = files;
    files = [];
  }
  files = [...added.reverse(), ...files];
  intake.offerSetAside(setAside.length > 0 ? setAside.map((f) => f.name) : null);
  refit();
}

/** Bring the put-aside samples back, after the user's files. */
function keepSetAside(): void {
  files = [...files, ...setAside];
  setAside = [];
  intake.offerSetAside(null);
  refit();
}

/** Whether a file is a JSON report ringfall saved (its schema tag), rather than a survey. */
function savedReportText(name: string, text: string): boolean {
  return /\.json$/i.test(name) || /^\s*\{[\s\S]*"schema"\s*:\s*"ringfall-report\//.test(text.slice(0, 4096));
}

/** Show a saved JSON report as it was saved: its own run record says how it was made. */
function showSavedReport(name: string, text: string): void {
  let saved: Report;
  try {
    saved = fromJsonReport(JSON.parse(text) as unknown, name);
  } catch (error) {
    const reason = error instanceof SyntaxError ? `it is not valid JSON (${error.message})` : pageText((error as Error).message);
    report.showMessage(`${name} could not be opened as a saved report: ${reason}. Open a JSON report saved by ringfall, or survey CSV files.`, 'failed');
    return;
  }
  clearTimeout(refitTimer);
  report.showReport(saved, 0, savedReportLine(name, saved));
}

function savedReportLine(name: string, saved: Report): string {
  const run = saved.run;
  const made = run ? `made by ${run.tool} ${run.version} (${run.command === 'web page' ? 'this page' : run.command}) at ${run.time}` : 'with no record of how it was made';
  return `Showing the saved report ${name}, ${made}; it is shown as saved, not fitted again. Add survey files to fit anew.`;
}

/** Load bundled samples in place of the current files; with no spec typed yet, the samples' spec comes too. */
function openSamples(samples: readonly { name: string; text: string }[]): void {
  files = samples.map((s) => ({ id: `f${nextId++}`, name: s.name, text: s.text, outcome: null, mapping: null, sample: true, input: describePageText(`sample-data/${s.name}`, s.text) }));
  setAside = [];
  intake.offerSetAside(null);
  const spec = fleetSpec();
  if (spec && settings.spec.trim() === '') settingsUi.setSpec(spec.text, `sample-data/${spec.name}`);
  refit();
}

let refitTimer: ReturnType<typeof setTimeout> | undefined;
function scheduleRefit(): void {
  clearTimeout(refitTimer);
  refitTimer = setTimeout(refit, 250);
}

function refit(): void {
  clearTimeout(refitTimer);
  const { errors } = parseFitSettings(settings, (name) => parameterUnit(name, settings.models));
  settingsUi.showErrors(errors);
  levels.showErrors(errors);
  intake.showFiles(files);
  if (files.length === 0) {
    report.showReport({ surveys: [] }, 0);
    report.showMessage('No survey yet: drop or choose CSV files, or open the sample fleet.', 'idle');
    showColumns();
    return;
  }
  if (errors.length > 0) {
    report.showMessage('Fix the settings marked on the left to fit again.', 'failed');
    return;
  }
  const request = files.filter((f) => !f.unreadable).map((f) => ({ id: f.id, name: f.name, text: f.text, ...(f.mapping ? { mapping: f.mapping } : {}) }));
  // User Timing marks, for profiling in the browser's performance panel and the benchmark
  performance.mark('ringfall:run');
  const { parsed } = parseFitSettings(settings, (name) => parameterUnit(name, settings.models));
  const time = pageTime();
  const specInput = settings.spec.trim() === '' ? Promise.resolve(null) : describePageText(settings.specName ?? 'typed in the page', settings.spec);
  const handSet = files.filter((f) => f.mapping !== null).map((f) => f.name);
  const run = Promise.all([Promise.all(files.filter((f) => !f.unreadable).map((f) => f.input)), specInput])
    .then(([inputs, spec]) => pageRunRecord(time, inputs, parsed, spec, handSet));
  worker.run(request, settings, report.showProgress).then(async ({ outcome, elapsedMs }) => {
    const record = await run;
    performance.mark('ringfall:result');
    files = files.map((f) => ({ ...f, outcome: outcome.files.find((o) => o.id === f.id) ?? f.outcome }));
    intake.showFiles(files);
    showColumns();
    const settingErrors = outcome.settingErrors.map((e) => ({ ...e, message: pageText(e.message) }));
    settingsUi.showErrors(settingErrors);
    levels.showErrors(settingErrors);
    performance.mark('ringfall:panels');
    try {
      report.showReport({ ...pageReport(outcome.report), run: record }, elapsedMs);
    } catch (error) {
      // a defect in drawing, not in the user's data: say so rather than leave the page waiting
      report.showMessage(`The report could not be drawn (${String(error)}). The JSON and CSV exports still hold the results; please report this with the file.`, 'failed');
    }
    performance.mark('ringfall:report');
  }, (error: Error) => {
    if (error.message !== 'superseded') report.showMessage(`Something went wrong while fitting: ${error.message}. Please report this with the file.`, 'failed');
  });
}

function showColumns(): void {
  const panels = files.filter((f) => f.outcome !== null).map((f) => columnsPanel(f.outcome!, f.mapping, (mapping) => {
    files = files.map((g) => (g.id === f.id ? { ...g, mapping } : g));
    refit();
  }));
  replaceChildren(columnsHost, h('h2', { id: 'columns-heading' }, 'What the files said'),
    panels.length > 0 ? panels : h('p', { class: 'muted' }, 'Columns, units and rows not used appear here once a file is read.'));
}

const first = firstSample();
if (first) openSamples([first]);
else refit();
