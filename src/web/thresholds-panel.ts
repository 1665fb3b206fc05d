import { isRingfallError } from '../core/errors';
import { thresholdCautions } from '../core/analysis/thresholds/threshold-cautions';
import { parseThresholdLevel, thresholdPresets } from '../core/analysis/thresholds/threshold-level';
import { formatQuantity } from '../core/units';
import { h, replaceChildren, uniqueId } from './dom';
import type { FitSettings, SettingError } from './fit-settings';

/**
 * Threshold levels: pick a preset (static implant lines, ICNIRP 2010 reference levels by
 * frequency and group) or type a field; each level is listed with its source flag and
 * notes, and the cautions of DOMAIN.md §4.5 stay in view below the list.
 */
export function thresholdsPanel(settings: () => FitSettings, update: (change: Partial<FitSettings>) => void): { element: HTMLElement; showErrors: (errors: readonly SettingError[]) => void } {
  const list = h('ul', { class: 'threshold-list' });
  const addError = h('p', { class: 'field-error', role: 'alert', id: uniqueId('err'), hidden: true });
  const setLevels = (levels: readonly string[]) => { update({ thresholds: levels }); render(); };
  const tryAdd = (text: string): boolean => {
    try {
      parseThresholdLevel(text, 'Threshold level');
    } catch (error) {
      if (!isRingfallError(error)) throw error;
      addError.textContent = error.message;
      addError.hidden = false;
      return false;
    }
    addError.hidden = true;
    if (!settings().thresholds.includes(text)) setLevels([...settings().thresholds, text]);
    return true;
  };

  function render(errors: readonly SettingError[] = []): void {
    replaceChildren(list, settings().thresholds.map((text, i) => {
      const error = errors.find((e) => e.field === `threshold:${i}`);
      let described: HTMLElement;
      try {
        const level = parseThresholdLevel(text, 'Threshold level');
        described = h('div', {},
          h('strong', {}, formatQuantity(level.value, 'field', { significant: 3 })),
          level.label ? ` — ${level.label}` : ' — level typed by hand',
          level.readingType ? h('span', { class: 'muted' }, ` (compare with ${level.readingType} readings)`) : null,
          level.flag ? h('p', { class: 'muted small' }, `Source: ${level.flag}`) : null,
          level.notes.map((note) => h('p', { class: 'muted small' }, note)));
      } catch {
        described = h('div', {}, h('code', {}, text));
      }
      const remove = h('button', { type: 'button', 'aria-label': `Remove threshold ${text}` }, 'Remove');
      remove.addEventListener('click', () => setLevels(settings().thresholds.filter((_, j) => j !== i)));
      return h('li', {}, described, remove, error ? h('p', { class: 'field-error', role: 'alert' }, error.message) : null);
    }));
  }
  render();

  const presetId = uniqueId('preset');
  const preset = h('select', { id: presetId },
    Object.entries(thresholdPresets).map(([id, level]) => h('option', { value: id }, `${formatQuantity(level.value, 'field', { significant: 3 })} — ${level.label ?? id}`)));
  const addPreset = h('button', { type: 'button', 'aria-label': 'Add the preset level' }, 'Add');
  addPreset.addEventListener('click', () => tryAdd(preset.value));

  const groupId = uniqueId('group');
  const group = h('select', { id: groupId }, h('option', { value: 'public' }, 'general public'), h('option', { value: 'occupational' }, 'occupational'));
  const frequencyId = uniqueId('frequency');
  const frequency = h('input', { id: frequencyId, type: 'text', value: '50 Hz', size: 8, autocomplete: 'off' });
  const addIcnirp = h('button', { type: 'button', 'aria-label': 'Add the ICNIRP 2010 reference level' }, 'Add');
  addIcnirp.addEventListener('click', () => tryAdd(`icnirp-${group.value}@${frequency.value.replace(/\s+/g, '')}`));

  const customId = uniqueId('custom-level');
  const custom = h('input', { id: customId, type: 'text', placeholder: 'e.g. 0.2 mT', size: 10, autocomplete: 'off', 'aria-describedby': addError.id });
  const addCustom = h('button', { type: 'button', 'aria-label': 'Add your level' }, 'Add');
  addCustom.addEventListener('click', () => { if (tryAdd(custom.value.trim())) custom.value = ''; });
  custom.addEventListener('keydown', (event) => { if (event.key === 'Enter') { event.preventDefault(); addCustom.click(); } });

  const element = h('section', { class: 'panel', 'aria-labelledby': 'levels-heading' },
    h('h2', { id: 'levels-heading' }, 'Levels to find on the axis'),
    list,
    h('div', { class: 'field' }, h('label', { for: presetId }, 'Preset level'), h('div', { class: 'row' }, preset, addPreset)),
    h('div', { class: 'field' }, h('span', { class: 'label' }, 'ICNIRP 2010 reference level (rms) for'),
      h('div', { class: 'row' }, h('label', { for: groupId, class: 'visually-hidden' }, 'Exposure group'), group,
        h('label', { for: frequencyId }, 'at'), frequency, addIcnirp)),
    h('div', { class: 'field' }, h('label', { for: customId }, 'A level of your own'), h('div', { class: 'row' }, custom, addCustom)),
    addError,
    h('details', { class: 'cautions', open: true }, h('summary', {}, 'Read before using a distance'),
      h('ul', {}, thresholdCautions.map((caution) => h('li', {}, caution)))));
  return { element, showErrors: (errors) => render(errors) };
}
