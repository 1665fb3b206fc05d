import { formatNumber, surveyUnits, type QuantityKind, type SurveyUnitChoice } from '../units';

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

/** How values are written in sentences: describeValue and describeTolerance in one survey's units. */
export interface ValueWords {
  value(value: number, kind: QuantityKind | null, interval?: readonly [number, number] | null, significant?: number): string;
  tolerance(nominal: number, kind: QuantityKind | null, tolerance: { relative: number; absolute: number }): string;
}

/**
 * describeValue and describeTolerance in a survey's units (surveyUnits: fields and
 * lengths as its file was written, e.g. "15.4 G (15.0–15.9)", "1.77 in"); other kinds,
 * and every kind when `units` is not given, in a unit chosen from the value.
 * @example valueWords(surveyUnits({ units: { field: 'G', distance: 'in' } })).value(0.0254, 'length') // "1.00 in"
 */
export function valueWords(units: SurveyUnitChoice = surveyUnits(null)): ValueWords {
  const value: ValueWords['value'] = (x, kind, interval, significant = 3) => {
    // the unit suits the largest number shown: 0.986 A (−20.6 to 22.5), not 986 mA (−20569 to 22541)
    const reference = interval ? Math.max(Math.abs(x), Math.abs(interval[0]), Math.abs(interval[1])) : x;
    const unit = !kind ? { symbol: '', factor: 1 } : units.unit(kind, reference, reference === 0 ? zeroUnits[kind] : undefined);
    const show = (y: number) => formatNumber(y / unit.factor, significant);
    const symbol = unit.symbol ? ` ${unit.symbol}` : '';
    const dash = interval && (interval[0] < 0 || interval[1] < 0) ? ' to ' : '–';
    return `${show(x)}${symbol}` + (interval ? ` (${show(interval[0])}${dash}${show(interval[1])})` : '');
  };
  const tolerance: ValueWords['tolerance'] = (nominal, kind, spread) => {
    const parts: string[] = [];
    if (spread.relative > 0) parts.push(`${Number((100 * spread.relative).toPrecision(3))} %`);
    if (spread.absolute > 0) parts.push(value(spread.absolute, kind));
    const written = parts.length === 0 ? '0' : parts.length === 1 ? parts[0]! : `(${parts.join(' + ')})`;
    return `${value(nominal, kind)} ± ${written}`;
  };
  return { value, tolerance };
}

/** Values in a unit chosen from the value, for sentences that belong to no one survey. */
const plainWords = valueWords();

/**
 * "96.0 A (92.0–100)" or "44.8 mm (43.9–45.7)": an SI value in a display unit chosen from
 * the largest of the value and its interval's ends, the interval in the same unit ("−2.2 to −0.8" when a bound is negative),
 * three significant digits. In a survey's own units: valueWords(surveyUnits(survey)).value.
 */
export function describeValue(value: number, kind: QuantityKind | null, interval?: readonly [number, number] | null, significant = 3): string {
  return plainWords.value(value, kind, interval, significant);
}

/** "120 A ± 10 %" / "45.0 mm ± 2.00 mm" / "1.70 mT ± (5 % + 20.0 µT)". */
export function describeTolerance(nominal: number, kind: QuantityKind | null, tolerance: { relative: number; absolute: number }): string {
  return plainWords.tolerance(nominal, kind, tolerance);
}
