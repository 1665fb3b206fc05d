import { h, replaceChildren } from './dom';
import { pageText } from './page-words';
import type { FileOutcome } from './pipeline';

/** A file the page holds: its text and the outcome of the last run, if any. */
export interface FileEntry {
  readonly id: string;
  readonly name: string;
  readonly text: string;
  readonly outcome: FileOutcome | null;
}

/** What the intake panel needs from the page. */
export interface IntakeContext {
  readonly addFiles: (files: readonly File[]) => void;
  readonly openSampleFleet: (() => void) | null;
  readonly removeFile: (id: string) => void;
  readonly clearFiles: () => void;
  /** Bring back the samples put aside when the user's first file came in. */
  readonly keepSetAside: () => void;
}

/**
 * Where surveys come in: a drop zone (the whole page accepts drops), a file picker, the
 * sample fleet, and the list of files with each one's state — the importer's message
 * appears next to the name of a file that could not be read.
 */
export function intakePanel(context: IntakeContext): { element: HTMLElement; showFiles: (files: readonly FileEntry[]) => void; offerSetAside: (names: readonly string[] | null) => void } {
  const input = h('input', { type: 'file', id: 'survey-files', multiple: true, accept: '.csv,.tsv,.txt,.json,text/csv,text/plain,application/json', class: 'visually-hidden' });
  input.addEventListener('change', () => {
    if (input.files && input.files.length > 0) context.addFiles([...input.files]);
    input.value = '';
  });
  const zone = h('div', { class: 'drop-zone', id: 'drop-zone' },
    h('p', {}, 'Drop gaussmeter survey CSV files here, or a report saved as JSON'),
    input, h('label', { for: 'survey-files', class: 'button primary' }, 'Choose survey files…'),
    context.openSampleFleet ? (() => {
      const sample = h('button', { type: 'button', id: 'open-sample-fleet' }, 'Open the sample fleet');
      sample.addEventListener('click', context.openSampleFleet);
      return sample;
    })() : null,
    h('p', { class: 'muted small' }, 'Files stay on this computer: reading and fitting run in this page.'));
  const list = h('ul', { class: 'file-list', id: 'file-list', 'aria-live': 'polite' });
  const clear = h('button', { type: 'button', class: 'link' }, 'Remove all files');
  clear.addEventListener('click', context.clearFiles);

  for (const type of ['dragenter', 'dragover'] as const) {
    document.addEventListener(type, (event) => { event.preventDefault(); zone.classList.add('dragging'); });
  }
  document.addEventListener('dragleave', (event) => { if (event.relatedTarget === null) zone.classList.remove('dragging'); });
  document.addEventListener('drop', (event) => {
    event.preventDefault();
    zone.classList.remove('dragging');
    const files = [...(event.dataTransfer?.files ?? [])];
    if (files.length > 0) context.addFiles(files);
  });

  const showFiles = (files: readonly FileEntry[]) => {
    clear.hidden = files.length === 0;
    replaceChildren(list, files.map((file) => {
      const outcome = file.outcome;
      const state = outcome === null ? h('span', { class: 'muted' }, 'waiting')
        : outcome.error ? h('span', { class: 'bad' }, 'not read')
        : h('span', { class: 'good' }, `${outcome.surveys.length} survey(s), ${outcome.surveys.reduce((s, x) => s + x.used, 0)} readings`);
      const remove = h('button', { type: 'button', class: 'link', 'aria-label': `Remove ${file.name}` }, 'remove');
      remove.addEventListener('click', () => context.removeFile(file.id));
      return h('li', { class: outcome?.error ? 'file file-error' : 'file', 'data-file': file.name },
        h('span', { class: 'file-name' }, file.name), ' ', state, ' ', remove,
        outcome?.error ? h('p', { class: 'file-message', role: 'alert', 'data-code': outcome.error.code }, pageText(outcome.error.message)) : null);
    }));
  };
  // the bundled sample steps aside for the user's own files; one button brings it back
  const setAsideNote = h('p', { class: 'set-aside muted small', id: 'set-aside', hidden: true });
  const offerSetAside = (names: readonly string[] | null) => {
    setAsideNote.hidden = names === null;
    if (names === null) { replaceChildren(setAsideNote, []); return; }
    const keep = h('button', { type: 'button', class: 'link', id: 'keep-sample' }, 'Keep the sample too');
    keep.addEventListener('click', context.keepSetAside);
    replaceChildren(setAsideNote, [`Your files replaced the bundled sample (${names.join(', ')}). `, keep]);
  };
  const element = h('section', { class: 'panel', 'aria-labelledby': 'intake-heading' },
    h('h2', { id: 'intake-heading' }, 'Surveys'), zone, setAsideNote, list, clear);
  showFiles([]);
  return { element, showFiles, offerSetAside };
}
