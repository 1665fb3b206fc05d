import type { ModelId } from '../core/models/field-model';
import { h, replaceChildren, uniqueId } from './dom';
import { catalogIds, type FitSettings, type SettingError } from './fit-settings';
import type { SampleFile } from './sample-files';

/** What the settings panel needs from the page. */
export interface SettingsPanelContext {
  readonly settings: () => FitSettings;
  readonly update: (change: Partial<FitSettings>) => void;
  /** Label of a model id for people. */
  readonly modelLabel: (id: ModelId) => string;
  /** Parameter names of the chosen models, for the fix list. */
  readonly parameterNames: (models: readonly ModelId[]) => string[];
  readonly sampleSpecs: readonly SampleFile[];
}

/**
 * Fit settings form: models to fit, parameters held fixed (value with unit), the
 * instrument and position uncertainties, and a spec typed or loaded from a file.
 * Mistakes appear under their input (`showErrors`).
 */
export function settingsPanel(context: SettingsPanelContext): { element: HTMLElement; showErrors: (errors: readonly SettingError[]) => void; setSpec: (text: string, name: string) => void } {
  const errorSlots = new Map<string, HTMLElement>();
  const slot = (field: string) => {
    const element = h('p', { class: 'field-error', id: uniqueId('err'), role: 'alert' });
    errorSlots.set(field, element);
    return element;
  };
  const settings = context.settings();

  const modelsError = slot('models');
  const models = h('fieldset', { class: 'models', 'aria-describedby': modelsError.id },
    h('legend', {}, 'Models to fit'),
    catalogIds.map((id) => {
      const box = h('input', { type: 'checkbox', name: 'model', value: id, id: `model-${id}`, checked: settings.models.includes(id) });
      box.addEventListener('change', () => {
        const chosen = [...models.querySelectorAll<HTMLInputElement>('input[name=model]:checked')].map((b) => b.value as ModelId);
        context.update({ models: chosen });
        renderFixes();
      });
      return h('div', { class: 'check' }, box, h('label', { for: `model-${id}` }, h('code', {}, id), ' ', h('span', { class: 'muted' }, context.modelLabel(id))));
    }),
    modelsError);

  const fixList = h('div', { class: 'fix-list' });
  const fixes = h('fieldset', {}, h('legend', {}, 'Parameters held fixed'), fixList, slot('fixes'));
  function renderFixes(): void {
    const current = context.settings();
    const names = context.parameterNames(current.models);
    replaceChildren(fixList,
      current.fixes.map((fix, i) => {
        const nameId = uniqueId('fix-name');
        const valueId = uniqueId('fix-value');
        const error = slot(`fix:${i}`);
        const name = h('select', { id: nameId }, [...new Set([...names, fix.name])].map((n) => h('option', { value: n, selected: n === fix.name }, n)));
        const value = h('input', { id: valueId, type: 'text', value: fix.value, placeholder: 'e.g. 45 mm', 'aria-describedby': error.id, autocomplete: 'off' });
        const commit = () => context.update({ fixes: context.settings().fixes.map((f, j) => (j === i ? { name: name.value, value: value.value } : f)) });
        name.addEventListener('change', commit);
        value.addEventListener('change', commit);
        const remove = h('button', { type: 'button', 'aria-label': `Stop holding ${fix.name} fixed` }, 'Remove');
        remove.addEventListener('click', () => { context.update({ fixes: context.settings().fixes.filter((_, j) => j !== i) }); renderFixes(); });
        return h('div', { class: 'fix-row' },
          h('label', { for: nameId, class: 'visually-hidden' }, 'Parameter'), name,
          h('label', { for: valueId, class: 'visually-hidden' }, `Value of ${fix.name} with unit`), value, remove, error);
      }),
      (() => {
        const add = h('button', { type: 'button' }, 'Hold a parameter fixed');
        add.addEventListener('click', () => {
          const first = names.find((n) => !context.settings().fixes.some((f) => f.name === n)) ?? names[0] ?? 'radius';
          context.update({ fixes: [...context.settings().fixes, { name: first, value: '' }] });
          renderFixes();
          fixList.querySelector<HTMLInputElement>('.fix-row:last-of-type input')?.focus();
        });
        return add;
      })());
  }
  renderFixes();

  const text = (field: 'uncertainty' | 'positionUncertainty', label: string, placeholder: string, help: string) => {
    const id = uniqueId(field);
    const error = slot(field);
    const helpId = uniqueId('help');
    const input = h('input', { id, type: 'text', value: settings[field], placeholder, 'aria-describedby': `${helpId} ${error.id}`, autocomplete: 'off' });
    input.addEventListener('change', () => context.update({ [field]: input.value }));
    return h('div', { class: 'field' }, h('label', { for: id }, label), input, h('p', { class: 'muted', id: helpId }, help), error);
  };

  const specId = uniqueId('spec');
  const specError = slot('spec');
  const specText = h('textarea', { id: specId, rows: 5, spellcheck: 'false', placeholder: '{ "model": "loop", "params": { "ampereTurns": "120 A", "radius": "45 mm" }, "tolerance": "10%" }', 'aria-describedby': specError.id }, settings.spec);
  specText.addEventListener('change', () => context.update({ spec: specText.value, specName: 'typed in the page' }));
  const specFileId = uniqueId('spec-file');
  const specFile = h('input', { id: specFileId, type: 'file', accept: '.json,application/json', class: 'visually-hidden' });
  specFile.addEventListener('change', async () => {
    const file = specFile.files?.[0];
    if (!file) return;
    specText.value = await file.text();
    context.update({ spec: specText.value, specName: file.name });
    specFile.value = '';
  });
  const sampleSpec = context.sampleSpecs.length === 0 ? null : (() => {
    const id = uniqueId('sample-spec');
    const select = h('select', { id }, h('option', { value: '' }, 'a bundled sample spec…'), context.sampleSpecs.map((s, i) => h('option', { value: String(i) }, s.name)));
    select.addEventListener('change', () => {
      const chosen = context.sampleSpecs[Number(select.value)];
      if (chosen) { specText.value = chosen.text; context.update({ spec: chosen.text, specName: `sample-data/${chosen.name}` }); }
    });
    return h('span', {}, h('label', { for: id, class: 'visually-hidden' }, 'Load a bundled sample spec'), select);
  })();
  const spec = h('div', { class: 'field' },
    h('label', { for: specId }, 'Spec to check against (JSON)'), specText,
    h('div', { class: 'row' }, specFile, h('label', { for: specFileId, class: 'button' }, 'Load spec file…'), sampleSpec), specError);

  const element = h('section', { class: 'panel', 'aria-labelledby': 'settings-heading' },
    h('h2', { id: 'settings-heading' }, 'How to fit'),
    models, fixes,
    text('uncertainty', 'Instrument uncertainty of one reading', 'e.g. 1.5%+2µT', 'Standard uncertainty as % of reading plus a floor. Empty: estimated from the scatter.'),
    text('positionUncertainty', 'Position uncertainty of each distance', 'e.g. 0.5 mm', 'Standard uncertainty of the probe position; weighs near-coil readings (effective variance).'),
    spec);

  const showErrors = (errors: readonly SettingError[]) => {
    for (const [field, element] of errorSlots) {
      const found = errors.filter((e) => e.field === field);
      element.textContent = found.map((e) => e.message).join(' ');
      element.hidden = found.length === 0;
    }
  };
  showErrors([]);
  const setSpec = (text: string, name: string) => { specText.value = text; context.update({ spec: text, specName: name }); };
  return { element, showErrors, setSpec };
}
