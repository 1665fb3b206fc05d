import { displayUnit, formatNumber, type QuantityKind } from '../units';

/** Units in which an exact zero is shown ("0 mm", not "0 µm"). */
const zeroUnits: Record<QuantityKind, { symbol: string; factor: number }> = {
  length: { symbol: 'mm', factor: 1e-3 },
  field: { symbol: 'T', factor: 1 },
  current: { symbol: 'A', factor: 1 },
  moment: { symbol: 'A·m²', factor: 1 },
};

const friendly: Readonly<Record<string, string>> = {
  ampereTurns: 'ampere-turns',
  probeOffset: 'probe offset',
  centre: 'coil centre on the ruler',
  innerRadius: 'inner radius',
  outerRadius: 'outer radius',
  moment: 'moment',
  'ampereTurns at label geometry': 'ampere-turns at the label geometry',
};

/** A parameter name as people say it: ampereTurns → "ampere-turns". */
export function parameterWords(name: string): string {
  return friendly[name] ?? name;
}

/**
 * "96.0 A (92.0–100)" or "44.8 mm (43.9–45.7)": an SI value in a display unit chosen from
 * the largest of the value and its interval's ends, the interval in the same unit ("−2.2 to −0.8" when a bound is negative),
 * three significant digits.
 */
export function describeValue(value: number, kind: QuantityKind | null, interval?: readonly [number, number] | null, significant = 3): string {
  // the unit suits the largest number shown: 0.986 A (−20.6 to 22.5), not 986 mA (−20569 to 22541)
  const reference = interval ? Math.max(Math.abs(value), Math.abs(interval[0]), Math.abs(interval[1])) : value;
  const unit = !kind ? { symbol: '', factor: 1 } : reference === 0 ? zeroUnits[kind] : displayUnit(reference, kind);
  const show = (x: number) => formatNumber(x / unit.factor, significant);
  const symbol = unit.symbol ? ` ${unit.symbol}` : '';
  const dash = interval && (interval[0] < 0 || interval[1] < 0) ? ' to ' : '–';
  return `${show(value)}${symbol}` + (interval ? ` (${show(interval[0])}${dash}${show(interval[1])})` : '');
}

/** "120 A ± 10 %" / "45.0 mm ± 2.00 mm" / "1.70 mT ± (5 % + 20.0 µT)". */
export function describeTolerance(nominal: number, kind: QuantityKind | null, tolerance: { relative: number; absolute: number }): string {
  const parts: string[] = [];
  if (tolerance.relative > 0) parts.push(`${Number((100 * tolerance.relative).toPrecision(3))} %`);
  if (tolerance.absolute > 0) parts.push(describeValue(tolerance.absolute, kind));
  const spread = parts.length === 0 ? '0' : parts.length === 1 ? parts[0]! : `(${parts.join(' + ')})`;
  return `${describeValue(nominal, kind)} ± ${spread}`;
}
