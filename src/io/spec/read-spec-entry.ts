import type { ModelId, ParameterSpec, ParameterUnit } from '../../core/models/field-model';
import { defaultClaimDatum, type ClaimDatum, type Spec, type SpecClaim, type SpecParameter } from '../../core/analysis/spec/spec';
import { parseQuantity, parseRelativePlusAbsolute, type QuantityKind, type RelativePlusAbsolute } from '../../core/units';
import type { ReadingType } from '../../core/survey/survey';
import { specError, type SpecPlace } from './spec-error';
import { parseReadingType } from '../import/parse-reading-type';

/** Parameters of a catalog model, or undefined for an unknown id. */
export type ParameterCatalog = (id: string) => readonly ParameterSpec[] | undefined;

/** Everything needed to name a place in the file. */
export interface EntryContext {
  readonly source: string;
  /** Spec name for messages and Spec.source: "spec 2" in an array, "" for a single spec. */
  readonly name: string;
  /** JSON path prefix of this entry ("" or "1"). */
  readonly prefix: string;
  readonly lines: ReadonlyMap<string, number>;
  readonly catalog: ParameterCatalog;
  readonly modelIds: readonly string[];
}

const topKeys = ['coil', 'model', 'params', 'tolerance', 'tolerances', 'claims', 'readingType', 'waveform', 'crestFactor', 'note'];
const claimKeys = ['distance', 'datum', 'radial', 'field', 'tolerance', 'note'];
const datums: readonly ClaimDatum[] = ['surface', 'winding'];
/** Crest factors (peak/rms) of the waveforms a spec may name; a Map, so "constructor" is no waveform. */
const waveforms: ReadonlyMap<string, number> = new Map([['sine', Math.SQRT2], ['square', 1]]);

/**
 * Turn one parsed spec object into a Spec in SI, checking every key, model, parameter,
 * quantity and tolerance and naming the line and field of the first problem.
 *
 * @throws RingfallError with a SPEC_* code (spec-error.ts)
 */
export function readSpecEntry(entry: unknown, context: EntryContext): Spec {
  const at = (path: string, label = path): SpecPlace => {
    const full = [context.prefix, path].filter((p) => p !== '').join('.');
    return { source: context.source, line: context.lines.get(full) ?? null, field: [context.name, label].filter((p) => p !== '').join(' ') };
  };
  const object = asObject(entry, at(''), 'a spec');
  checkKeys(object, topKeys, at(''), 'spec');
  const model = readModel(object['model'], at('model'), context);
  const parameters = context.catalog(model)!;
  const defaultTolerance = object['tolerance'];
  const tolerances = object['tolerances'] === undefined ? {} : asObject(object['tolerances'], at('tolerances'), 'a map from parameter name to tolerance');
  const params: SpecParameter[] = [];
  for (const [name, written] of Object.entries(object['params'] === undefined ? {} : asObject(object['params'], at('params'), 'a map from parameter name to quantity'))) {
    const parameter = parameters.find((p) => p.name === name);
    if (!parameter) {
      throw specError('SPEC_PARAM', 'Spec parameter', `"${name}" is not a parameter of model "${model}"`, at(`params.${name}`),
        `Use one of: ${parameters.map((p) => p.name).join(', ')}.`, name);
    }
    const kind = kindOf(parameter.unit, at(`params.${name}`));
    const value = readQuantity(written, kind, at(`params.${name}`));
    if (value.value < parameter.lower || value.value > parameter.upper) {
      const range = parameter.upper === Infinity ? `at least ${parameter.lower}` : `between ${parameter.lower} and ${parameter.upper}`;
      throw specError('SPEC_QUANTITY', 'Spec parameter', `${name} ${value.text} is outside what the model allows (${range} ${parameter.unit})`, at(`params.${name}`),
        `Give ${name} as the label states it${parameter.lower === 0 ? ' (a size is never negative)' : ''}.`, written);
    }
    const own = Object.hasOwn(tolerances, name) ? tolerances[name] : undefined;
    const toleranceText = own ?? defaultTolerance;
    const tolerancePath = own !== undefined ? `tolerances.${name}` : 'tolerance';
    params.push({ name, value: value.value, text: value.text, tolerance: readTolerance(toleranceText, kind, at(tolerancePath), name) });
  }
  for (const name of Object.keys(tolerances)) {
    if (!params.some((p) => p.name === name)) {
      throw specError('SPEC_TOLERANCE', 'Spec tolerance', `"${name}" has a tolerance but no value in "params"`, at(`tolerances.${name}`), `Add "${name}" to "params" or remove its tolerance.`, name);
    }
  }
  const claims = readClaims(object['claims'], defaultTolerance, at);
  if (params.length === 0 && claims.length === 0) {
    throw specError('SPEC_EMPTY', 'Spec', 'it has neither "params" nor "claims", so there is nothing to check', at(''), 'Add label parameters, e.g. "params": {"ampereTurns": "120 A"}, or field claims.');
  }
  return {
    source: context.name === '' ? context.source : `${context.source}, ${context.name}`,
    coils: readCoils(object['coil'], at('coil')),
    model: model as ModelId,
    params,
    claims,
    readingType: readReadingType(object['readingType'], at('readingType')),
    crestFactor: readCrestFactor(object['waveform'], object['crestFactor'], at),
  };
}

function readClaims(value: unknown, defaultTolerance: unknown, at: (path: string, label?: string) => SpecPlace): SpecClaim[] {
  if (value === undefined) return [];
  if (!Array.isArray(value)) throw specError('SPEC_SHAPE', 'Spec claims', `found ${describe(value)} where a list of claims belongs`, at('claims'), 'Write "claims": [{"distance": "0 mm", "field": "1.7 mT"}].');
  return value.map((item, index) => {
    const place = (key: string) => at(`claims.${index}${key === '' ? '' : '.' + key}`, `claims[${index}]${key === '' ? '' : '.' + key}`);
    const claim = asObject(item, place(''), 'a claim {"distance", "field"}');
    checkKeys(claim, claimKeys, place(''), 'claim');
    if (claim['distance'] === undefined || claim['field'] === undefined) {
      throw specError('SPEC_SHAPE', 'Spec claim', `it lacks "${claim['distance'] === undefined ? 'distance' : 'field'}"`, place(''), 'Every claim needs a distance and a field, e.g. {"distance": "20 mm", "field": "1.2 mT"}.');
    }
    const distance = readQuantity(claim['distance'], 'length', place('distance'));
    const radial = claim['radial'] === undefined ? null : readQuantity(claim['radial'], 'length', place('radial'));
    const field = readQuantity(claim['field'], 'field', place('field'));
    if (distance.value < 0 || (radial?.value ?? 0) < 0 || !(field.value > 0)) {
      throw specError('SPEC_QUANTITY', 'Spec claim', `distance ${distance.text}, field ${field.text}: distances must be ≥ 0 and the field > 0`, place(''), 'Give the claimed field magnitude at a distance from the datum.');
    }
    const datum = readDatum(claim['datum'], place('datum'));
    const tolerancePlace = claim['tolerance'] !== undefined ? place('tolerance') : defaultTolerance !== undefined ? at('tolerance') : place('');
    return {
      distance: distance.value,
      datum,
      radial: radial?.value ?? 0,
      field: field.value,
      tolerance: readTolerance(claim['tolerance'] ?? defaultTolerance, 'field', tolerancePlace, `claim ${index + 1}`),
      text: `${field.text} at ${distance.text} from the ${datum}${radial ? `, ${radial.text} off axis` : ''}`,
    };
  });
}

/** A claim's datum: "surface" (default, as labels mean it) or "winding". */
function readDatum(value: unknown, place: SpecPlace): ClaimDatum {
  if (value === undefined || value === null) return defaultClaimDatum;
  const datum = typeof value === 'string' ? datums.find((d) => d === value.trim().toLowerCase()) : undefined;
  if (datum === undefined) {
    throw specError('SPEC_DATUM', 'Spec claim datum', `found ${describe(value)}`, place,
      'Use "surface" (distance from the outside of the device, where the probe touches it; the default) or "winding" (from the winding plane, or the near face of a coil with length).', value);
  }
  return datum;
}

function readModel(value: unknown, place: SpecPlace, context: EntryContext): string {
  if (typeof value !== 'string' || context.catalog(value) === undefined) {
    throw specError('SPEC_MODEL', 'Spec model', value === undefined ? 'no "model" given' : `${describe(value)} is not a model id`, place, `Use one of: ${context.modelIds.join(', ')}.`, value);
  }
  return value;
}

function readCoils(value: unknown, place: SpecPlace): string[] | null {
  if (value === undefined || value === null) return null;
  const list = Array.isArray(value) ? value : [value];
  if (list.length === 0 || !list.every((c) => typeof c === 'string' && c.trim() !== '')) {
    throw specError('SPEC_SHAPE', 'Spec coil', `found ${describe(value)}`, place, 'Give a coil id like "HX-2", a list of ids, or leave "coil" out to apply the spec to every coil.', value);
  }
  return list.map((c: string) => c.trim());
}

function readReadingType(value: unknown, place: SpecPlace): ReadingType | null {
  if (value === undefined || value === null) return null;
  const type = typeof value === 'string' ? parseReadingType(value) : null;
  if (!type) throw specError('SPEC_READING_TYPE', 'Spec readingType', `found ${describe(value)}`, place, 'Use "dc", "rms" or "peak" (a bare "ac" does not say which).', value);
  return type;
}

function readCrestFactor(waveform: unknown, crestFactor: unknown, at: (path: string) => SpecPlace): number | null {
  let fromWaveform: number | null = null;
  if (waveform !== undefined && waveform !== null) {
    fromWaveform = typeof waveform === 'string' ? waveforms.get(waveform.trim().toLowerCase()) ?? null : null;
    if (fromWaveform === null) {
      throw specError('SPEC_WAVEFORM', 'Spec waveform', `found ${describe(waveform)}`, at('waveform'), `Use ${[...waveforms.keys()].map((w) => `"${w}"`).join(' or ')}, or state "crestFactor" (peak/rms) for other waveforms.`, waveform);
    }
  }
  if (crestFactor === undefined || crestFactor === null) return fromWaveform;
  if (typeof crestFactor !== 'number' || !(crestFactor >= 1) || !Number.isFinite(crestFactor)) {
    throw specError('SPEC_WAVEFORM', 'Spec crestFactor', `found ${describe(crestFactor)}`, at('crestFactor'), 'Give the peak/rms ratio as a number ≥ 1 (sine: 1.414).', crestFactor);
  }
  if (fromWaveform !== null && Math.abs(fromWaveform - crestFactor) > 1e-3 * fromWaveform) {
    throw specError('SPEC_WAVEFORM', 'Spec crestFactor', `${crestFactor} contradicts waveform "${String(waveform)}" (${fromWaveform.toFixed(4)})`, at('crestFactor'), 'Give one of the two, or make them agree.', crestFactor);
  }
  return crestFactor;
}

function readQuantity(value: unknown, kind: QuantityKind | 'number', place: SpecPlace): { value: number; text: string } {
  if (kind === 'number') {
    const number = typeof value === 'number' ? value : typeof value === 'string' && value.trim() !== '' ? Number(value) : Number.NaN;
    if (!Number.isFinite(number)) throw specError('SPEC_QUANTITY', 'Spec value', `found ${describe(value)}`, place, 'Give a plain number, e.g. "2.5".', value);
    return { value: number, text: String(value) };
  }
  if (typeof value !== 'string') {
    throw specError('SPEC_QUANTITY', 'Spec value', `found ${describe(value)} where a ${kind} with its unit belongs`, place, `Write it as a string with a unit, e.g. ${examples[kind]}.`, value);
  }
  try {
    return { value: parseQuantity(value, kind, place.field).value, text: value.trim() };
  } catch (cause) {
    const code = (cause as { code?: string }).code;
    const found = code === 'QUANTITY_KIND' ? `"${value}" is not a ${kind}` : code === 'QUANTITY_UNIT' ? `"${value}" has no unit or an unknown one` : `"${value}" is not a number with a unit`;
    throw specError('SPEC_QUANTITY', 'Spec value', found, place, `Write a ${kind} with its unit, e.g. ${examples[kind]}.`, value, cause);
  }
}

const examples: Record<QuantityKind, string> = { length: '"45 mm"', field: '"1.7 mT"', current: '"120 A"', moment: '"0.76 A·m²"' };

function readTolerance(value: unknown, kind: QuantityKind | 'number', place: SpecPlace, what: string): RelativePlusAbsolute {
  if (value === undefined) {
    throw specError('SPEC_TOLERANCE', 'Spec tolerance', `no tolerance for ${what}`, place, 'Add "tolerance": "10%" to the spec (or a per-parameter "tolerances" entry, or a "tolerance" on the claim).');
  }
  if (typeof value !== 'string') throw specError('SPEC_TOLERANCE', 'Spec tolerance', `found ${describe(value)}`, place, 'Write it as a string: "10%", "2 mm" or "5%+0.1mT".', value);
  if (kind === 'number') {
    const percent = /^\s*(\d+(?:\.\d*)?)\s*%\s*$/.exec(value);
    const plain = Number(value);
    if (percent) return { relative: Number(percent[1]) / 100, absolute: 0 };
    if (value.trim() !== '' && plain >= 0) return { relative: 0, absolute: plain };
    throw specError('SPEC_TOLERANCE', 'Spec tolerance', `"${value}" for ${what}`, place, 'Give a percentage ("10%") or a plain number for a dimensionless parameter.', value);
  }
  try {
    return parseRelativePlusAbsolute(value, kind, what);
  } catch (cause) {
    throw specError('SPEC_TOLERANCE', 'Spec tolerance', `"${value}" does not fit ${what}, a ${kind}`, place,
      `Write a percentage, a ${kind} with its unit, or both ("5%+${examples[kind].slice(1, -1).replace(' ', '')}"); give per-parameter tolerances in "tolerances": {"${what}": "…"}.`, value, cause);
  }
}

function kindOf(unit: ParameterUnit, place: SpecPlace): QuantityKind | 'number' {
  switch (unit) {
    case 'A': return 'current';
    case 'm': return 'length';
    case 'T': return 'field';
    case 'A·m²': return 'moment';
    case '1': return 'number';
    default:
      throw specError('SPEC_PARAM', 'Spec parameter', `a power-law amplitude (unit ${unit}) depends on the exponent and cannot be labeled`, place, 'State the field at a distance as a claim instead.');
  }
}

function checkKeys(object: Record<string, unknown>, known: readonly string[], place: SpecPlace, what: string): void {
  for (const key of Object.keys(object)) {
    if (!known.includes(key)) {
      throw specError('SPEC_KEY', `Spec ${what}`, `unknown key "${key}"`, { ...place, field: place.field === '' ? key : `${place.field}.${key}` }, `Use only: ${known.join(', ')} (check the spelling).`, key);
    }
  }
}

function asObject(value: unknown, place: SpecPlace, what: string): Record<string, unknown> {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw specError('SPEC_SHAPE', 'Spec', `found ${describe(value)} where ${what} belongs`, place, 'See the spec file format in CONTRACT.md.', value);
  }
  return value as Record<string, unknown>;
}

function describe(value: unknown): string {
  if (value === undefined) return 'nothing';
  if (Array.isArray(value)) return 'a list';
  if (value === null) return 'null';
  return typeof value === 'object' ? 'an object' : JSON.stringify(value);
}
