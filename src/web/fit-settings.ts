import { isRingfallError, RingfallError } from '../core/errors';
import { parseThresholdLevel, type ThresholdLevel } from '../core/analysis/thresholds/threshold-level';
import type { Spec } from '../core/analysis/spec/spec';
import { modelIds, parameterQuantityKind, type ModelId, type ParameterUnit } from '../core/models';
import { parseQuantity, parseRelativePlusAbsolute, type RelativePlusAbsolute } from '../core/units';
import { parseSpecs } from '../io/spec/parse-specs';

/**
 * The page's fit settings as the user typed them (strings, so they survive a trip to
 * the worker and back unchanged), and their parsed SI form. Parsing is shared by the
 * page (to show a mistake next to its input at once) and the worker.
 */
export interface FitSettings {
  readonly models: readonly ModelId[];
  /** Parameters held fixed: name and a quantity with unit, e.g. { name: 'radius', value: '45 mm' }. */
  readonly fixes: readonly { readonly name: string; readonly value: string }[];
  /** Standard uncertainty of one reading, "1.5%+2µT"; empty for none. */
  readonly uncertainty: string;
  /** Standard uncertainty of each distance, "0.5 mm"; empty for none. */
  readonly positionUncertainty: string;
  /** Spec JSON text (CONTRACT.md "Spec file"); empty for none. */
  readonly spec: string;
  /** Where the spec text came from, for the run record: a file's or sample's name, else typed in the page. */
  readonly specName?: string;
  /** Threshold levels: a field ("0.5 mT"), a preset id or "icnirp-public@50Hz". */
  readonly thresholds: readonly string[];
}

/** The catalog ids in the order the page lists them (DESIGN.md). */
export const catalogIds: readonly ModelId[] = modelIds;

/** CONTRACT.md default model set of `fit`. */
export const defaultModels: readonly ModelId[] = ['loop', 'dipole', 'power-law', 'inverse-square', 'inverse-cube'];

/** Settings a new page starts with. */
export const defaultSettings: FitSettings = {
  models: defaultModels, fixes: [], uncertainty: '', positionUncertainty: '', spec: '', thresholds: ['implant-static'],
};

/** A mistake in one setting, for display next to its input. */
export interface SettingError {
  /** Which input: 'models', 'uncertainty', 'positionUncertainty', 'spec', `fix:N`, `threshold:N`. */
  readonly field: string;
  readonly message: string;
}

/** The settings in SI, ready for the fit (fitSurvey options, threshold levels, specs). */
export interface ParsedSettings {
  readonly models: readonly ModelId[];
  /** Fixed parameters in SI. */
  readonly fixed: Readonly<Record<string, number>>;
  readonly uncertainty: RelativePlusAbsolute | null;
  /** m, or null. */
  readonly positionUncertainty: number | null;
  readonly thresholds: readonly ThresholdLevel[];
  /** Specs parsed from the spec text (empty when none). */
  readonly specs: readonly Spec[];
}

/**
 * Parse the typed settings into SI. `unitOf` gives a parameter's SI unit (from the
 * model catalog) or undefined for a name no chosen model has. Every mistake is
 * collected (none thrown), so the page can show them all at once.
 */
export function parseFitSettings(
  settings: FitSettings,
  unitOf: (name: string) => ParameterUnit | undefined,
): { parsed: ParsedSettings; errors: SettingError[] } {
  const errors: SettingError[] = [];
  const attempt = <T>(field: string, read: () => T): T | null => {
    try {
      return read();
    } catch (error) {
      if (!isRingfallError(error)) throw error;
      errors.push({ field, message: error.message });
      return null;
    }
  };
  if (settings.models.length === 0) errors.push({ field: 'models', message: 'Models: none chosen. Tick at least one model to fit.' });
  const fixed: Record<string, number> = Object.create(null) as Record<string, number>;
  settings.fixes.forEach((fix, i) => {
    const unit = unitOf(fix.name);
    if (unit === undefined) {
      errors.push({ field: `fix:${i}`, message: `Fixed parameter: "${fix.name}" is not a parameter of the chosen models. Pick one from the list.` });
      return;
    }
    const kind = parameterQuantityKind(unit);
    const value = attempt(`fix:${i}`, () => {
      if (kind !== null) return parseQuantity(fix.value, kind, `fixed ${fix.name}`).value;
      const number = Number(fix.value.trim());
      if (fix.value.trim() === '' || !Number.isFinite(number)) {
        throw new RingfallError('SETTING_NUMBER', `Fixed ${fix.name}: "${fix.value}" is not a number. Give a plain number (unit ${unit}).`, { value: fix.value });
      }
      return number;
    });
    if (value !== null) fixed[fix.name] = value;
  });
  const uncertainty = settings.uncertainty.trim() === '' ? null
    : attempt('uncertainty', () => parseRelativePlusAbsolute(settings.uncertainty, 'field', 'Instrument uncertainty'));
  const positionUncertainty = settings.positionUncertainty.trim() === '' ? null
    : attempt('positionUncertainty', () => parseQuantity(settings.positionUncertainty, 'length', 'Position uncertainty').value);
  const thresholds: ThresholdLevel[] = [];
  settings.thresholds.forEach((text, i) => {
    const level = attempt(`threshold:${i}`, () => parseThresholdLevel(text, 'Threshold level'));
    if (level) thresholds.push(level);
  });
  const specs = settings.spec.trim() === '' ? [] : attempt('spec', () => parseSpecs(settings.spec, 'the spec')) ?? [];
  return { parsed: { models: settings.models, fixed, uncertainty, positionUncertainty, thresholds, specs }, errors };
}
