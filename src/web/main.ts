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
import { reportStyles } from './report-view';
import { firstSample, fleetSpec, sampleSpecs, sampleSurveys } from './sample-files';
import { settingsPanel } from './settings-panel';
import { thresholdsPanel } from './thresholds-panel';
import { PipelineWorker } from './worker-client';
import './styles.css';

interface PageFile extends FileEntry {
  readonly mapping: readonly ColumnMapping[] | null;
  /** Set when the browser could not read the file: it stays listed with the reason, never fitted. */
  readonly unreadable?: boolean;
}

let files: PageFile[] = [];
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
  clearFiles: () => { files = []; refit(); },
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
  const read = await Promise.allSettled(list.map((file) => file.text()));
  files = [...files, ...list.map((file, i): PageFile => {
    const id = `f${nextId++}`;
    const result = read[i]!;
    if (result.status === 'fulfilled') return { id, name: file.name, text: result.value, outcome: null, mapping: null };
    const message = `The browser could not read this file (${String(result.reason)}). Check that it is a file, not a folder, and that it can be opened, then choose it again.`;
    return {
      id, name: file.name, text: '', mapping: null, unreadable: true,
      outcome: { id, name: file.name, error: { code: 'FILE_UNREADABLE', message }, detection: null, counts: null, surveys: [], skipped: [], rowsNotUsed: [], rowsNotUsedTotal: 0 },
    };
  })];
  refit();
}

/** Load bundled samples in place of the current files; with no spec typed yet, the samples' spec comes too. */
function openSamples(samples: readonly { name: string; text: string }[]): void {
  files = samples.map((s) => ({ id: `f${nextId++}`, name: s.name, text: s.text, outcome: null, mapping: null }));
  const spec = fleetSpec();
  if (spec && settings.spec.trim() === '') settingsUi.setSpec(spec.text);
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
  worker.run(request, settings, report.showProgress).then(({ outcome, elapsedMs }) => {
    performance.mark('ringfall:result');
    files = files.map((f) => ({ ...f, outcome: outcome.files.find((o) => o.id === f.id) ?? f.outcome }));
    intake.showFiles(files);
    showColumns();
    const settingErrors = outcome.settingErrors.map((e) => ({ ...e, message: pageText(e.message) }));
    settingsUi.showErrors(settingErrors);
    levels.showErrors(settingErrors);
    performance.mark('ringfall:panels');
    try {
      report.showReport(pageReport(outcome.report), elapsedMs);
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
