import { RingfallError } from '../errors';
import { printable } from '../text/printable';
import { parseQuantity, type QuantityKind } from '../units';
import type { FieldModel, ParameterSpec, ParameterUnit } from './field-model';

/**
 * The quantity kind a parameter's value is written in (for parseQuantity and
 * formatQuantity), or null for plain SI numbers (exponent, power-law amplitude).
 * @example parameterQuantityKind('m') // 'length'
 */
export function parameterQuantityKind(unit: ParameterUnit): QuantityKind | null {
  switch (unit) {
    case 'A': return 'current';
    case 'm': return 'length';
    case 'T': return 'field';
    case 'A·m²': return 'moment';
    default: return null;
  }
}

/** An example value for messages, in the parameter's unit. */
export function exampleValue(unit: ParameterUnit): string {
  switch (unit) {
    case 'A': return '120A';
    case 'm': return '50mm';
    case 'T': return '0T';
    case 'A·m²': return '0.5A·m²';
    case '1': return '2.5';
    default: return '2e-6';
  }
}

/**
 * Whether `value` is a usable value of `parameter`: finite, greater than 0 for geometry
 * (lengths bounded below by 0), otherwise within the parameter's bounds.
 * @example acceptsValue(getModel('loop').parameters[1]!, 0) // false: a radius must be > 0
 */
export function acceptsValue(parameter: ParameterSpec, value: number): boolean {
  if (!Number.isFinite(value)) return false;
  return isGeometry(parameter) ? value > 0 : value >= parameter.lower && value <= parameter.upper;
}

/** The range acceptsValue allows, for messages: "must be greater than 0" or "0 to Infinity 1". */
export function acceptedRange(parameter: ParameterSpec): string {
  return isGeometry(parameter) ? 'must be greater than 0' : `${parameter.lower} to ${parameter.upper} ${parameter.unit}`;
}

function isGeometry(parameter: ParameterSpec): boolean {
  return parameter.role === 'geometry' && parameter.lower === 0;
}

/**
 * Read one `NAME=QTY` assignment for a model parameter (`--set radius=45mm`,
 * `--fix background=0T`) into SI: the quantity is parsed with parseQuantity in the kind
 * the parameter's unit implies (current, length, field, moment); the exponent (unit 1) and
 * power-law amplitudes (T·m^n) are plain numbers in SI. Geometry (lengths bounded below by
 * 0) must be positive; every value must lie within the parameter's bounds.
 *
 * @param option the flag, for messages (`--set`)
 * @throws RingfallError `PARAMETER_SYNTAX` (no NAME=QTY), `PARAMETER_UNKNOWN` (not a
 *   parameter of this model), `PARAMETER_VALUE` (not a number, out of bounds), or the
 *   parseQuantity codes QUANTITY_SYNTAX / QUANTITY_UNIT / QUANTITY_KIND
 * @example parseParameterAssignment(getModel('loop'), 'radius=45mm', '--set') // { index: 1, name: 'radius', value: 0.045 }
 */
export function parseParameterAssignment(
  model: FieldModel, text: string, option: string,
): { index: number; name: string; value: number } {
  const names = model.parameters.map((p) => p.name).join(', ');
  // split at the first "=" and trim: linear, where `=\s*(.*?)\s*$` backtracked quadratically on spaces
  const equals = text.indexOf('=');
  const written = equals === -1 ? '' : text.slice(0, equals).trim();
  const match = equals !== -1 && /^[A-Za-z]+$/.test(written) ? [text, written, text.slice(equals + 1).trim()] as const : null;
  if (!match) {
    throw new RingfallError('PARAMETER_SYNTAX', `${option}: "${printable(text, 60)}" is not NAME=QTY (${model.id}). Write it like ${option} ${model.parameters[1]?.name ?? 'name'}=${exampleValue(model.parameters[1]?.unit ?? 'm')}.`, { value: text, where: option });
  }
  const name = match[1]!;
  const index = model.parameters.findIndex((p) => p.name === name);
  const parameter = model.parameters[index];
  if (parameter === undefined) {
    throw new RingfallError('PARAMETER_UNKNOWN', `${option}: "${name}" is not a parameter of ${model.id}. Use one of: ${names}.`, { value: text, where: option });
  }
  const what = `${option} ${name}`;
  const kind = parameterQuantityKind(parameter.unit);
  let value: number;
  if (kind === null) {
    value = match[2] === '' ? NaN : Number(match[2]);
    if (!Number.isFinite(value)) {
      throw new RingfallError('PARAMETER_VALUE', `${what}: "${printable(match[2], 60)}" is not a number. Give a plain number in ${parameter.unit}, e.g. ${name}=${exampleValue(parameter.unit)}.`, { value: text, where: option });
    }
  } else {
    value = parseQuantity(match[2]!, kind, what).value;
  }
  if (!acceptsValue(parameter, value)) {
    throw new RingfallError('PARAMETER_VALUE', `${what}: ${printable(match[2], 60)} is out of range (${acceptedRange(parameter)}). Give the ${parameter.description.split(':')[0]}.`, { value: text, where: option });
  }
  return { index, name, value };
}
