/**
 * The units ringfall reads and writes, with exact SI factors.
 *
 * Factors: SI Brochure, 9th ed. (BIPM 2019) for SI prefixes; NIST SP 811 (2008),
 * Appendix B.8/B.9 for the non-SI units: 1 G = 1e-4 T exactly, 1 in = 0.0254 m exactly.
 */
export type QuantityKind = 'field' | 'length' | 'current' | 'moment';

export interface UnitDefinition {
  /** Canonical symbol, ASCII (uT, um); human output writes micro as µ (displaySymbol). */
  readonly symbol: string;
  readonly kind: QuantityKind;
  /** Multiply a value in this unit by `factor` to get SI (T, m, A, A·m²). */
  readonly factor: number;
}

const definitions: readonly UnitDefinition[] = [
  { symbol: 'T', kind: 'field', factor: 1 },
  { symbol: 'mT', kind: 'field', factor: 1e-3 },
  { symbol: 'uT', kind: 'field', factor: 1e-6 },
  { symbol: 'nT', kind: 'field', factor: 1e-9 },
  { symbol: 'kG', kind: 'field', factor: 1e-1 },
  { symbol: 'G', kind: 'field', factor: 1e-4 },
  { symbol: 'mG', kind: 'field', factor: 1e-7 },
  { symbol: 'm', kind: 'length', factor: 1 },
  { symbol: 'cm', kind: 'length', factor: 1e-2 },
  { symbol: 'mm', kind: 'length', factor: 1e-3 },
  { symbol: 'um', kind: 'length', factor: 1e-6 },
  { symbol: 'in', kind: 'length', factor: 0.0254 },
  { symbol: 'A', kind: 'current', factor: 1 },
  { symbol: 'mA', kind: 'current', factor: 1e-3 },
  { symbol: 'kA', kind: 'current', factor: 1e3 },
  { symbol: 'A·m²', kind: 'moment', factor: 1 },
];

/** Spellings people write, mapped to the canonical symbol. Matched case-sensitively first. */
const aliases: ReadonlyMap<string, string> = new Map([
  ['µT', 'uT'], ['μT', 'uT'], ['microtesla', 'uT'],
  ['tesla', 'T'], ['millitesla', 'mT'], ['nanotesla', 'nT'],
  ['Gs', 'G'], ['gauss', 'G'], ['Gauss', 'G'], ['kGs', 'kG'], ['kilogauss', 'kG'], ['mGs', 'mG'], ['milligauss', 'mG'],
  ['µm', 'um'], ['μm', 'um'],
  ['inch', 'in'], ['inches', 'in'], ['"', 'in'],
  ['A m2', 'A·m²'], ['A*m^2', 'A·m²'], ['Am2', 'A·m²'], ['A m^2', 'A·m²'], ['A.m2', 'A·m²'], ['A·m2', 'A·m²'], ['A m²', 'A·m²'],
  ['At', 'A'], ['A-t', 'A'], ['AT', 'A'], ['ampere-turns', 'A'], ['amperes', 'A'], ['ampere', 'A'],
]);

/**
 * Lower-cased spellings read whatever their case (MM, CM, IN, UT, NT, GAUSS), except the
 * ones {@link ambiguousUnit} refuses. 'mg' could be milligram; in a field column it can
 * only mean milligauss.
 */
const caseless: ReadonlyMap<string, string> = new Map([
  ['t', 'T'], ['mt', 'mT'], ['ut', 'uT'], ['µt', 'uT'], ['μt', 'uT'], ['nt', 'nT'], ['g', 'G'], ['gs', 'G'], ['kg', 'kG'], ['mg', 'mG'],
  ['gauss', 'G'], ['tesla', 'T'], ['m', 'm'], ['cm', 'cm'], ['mm', 'mm'], ['in', 'in'], ['inch', 'in'], ['inches', 'in'], ['a', 'A'],
]);

/**
 * Spellings that differ from a unit ringfall reads only in the case of a prefix letter,
 * where the SI Brochure (9th ed., Table 7) reads the capital as another prefix: M is mega,
 * m is milli. "B (MT)" is megatesla in SI though a gaussmeter log means millitesla; a
 * guess would be a factor of 10⁹, so these are refused with what to write instead.
 */
const ambiguous: ReadonlyMap<string, string> = new Map([
  ['MT', '"MT" is megatesla in SI (M = mega); write "mT" for millitesla'],
  ['Mt', '"Mt" reads as mega- in SI (M = mega); write "mT" for millitesla'],
  ['MG', '"MG" is megagauss (M = mega); write "mG" for milligauss'],
  ['Mg', '"Mg" is megagram in SI (M = mega); write "mG" for milligauss'],
  ['Mm', '"Mm" is megametre in SI (M = mega); write "mm" for millimetre'],
  ['MGs', '"MGs" is megagauss (M = mega); write "mG" for milligauss'],
]);

const bySymbol = new Map<string, UnitDefinition>(definitions.map((d) => [d.symbol, d]));

/**
 * Look a unit spelling up. Case-sensitive first (mT vs MT matter), then a case-insensitive
 * pass for the unambiguous spellings (MM, CM, IN, UT, NT, GAUSS); the spellings
 * {@link ambiguousUnit} names (MT, MG, Mm, …) are not read.
 * Returns undefined for an unknown or ambiguous unit.
 */
export function lookupUnit(spelling: string): UnitDefinition | undefined {
  const text = spelling.trim();
  const direct = bySymbol.get(text) ?? bySymbol.get(aliases.get(text) ?? '');
  if (direct) return direct;
  if (ambiguous.has(text)) return undefined;
  const symbol = caseless.get(text.toLowerCase());
  return symbol === undefined ? undefined : bySymbol.get(symbol);
}

/**
 * Why a unit spelling is refused as ambiguous ("MT" is megatesla in SI …), or null when
 * it is not one of those spellings.
 * @example ambiguousUnit('MT') // '"MT" is megatesla in SI (M = mega); write "mT" for millitesla'
 */
export function ambiguousUnit(spelling: string): string | null {
  return ambiguous.get(spelling.trim()) ?? null;
}

/** All symbols of one kind as people read them (µ for micro), for messages and menus ("use one of: T, mT, µT, …"). */
export function unitsOfKind(kind: QuantityKind): string[] {
  return definitions.filter((d) => d.kind === kind).map((d) => displaySymbol(d.symbol));
}

/**
 * A unit symbol as human output writes it: micro as µ (U+00B5 MICRO SIGN, the one
 * spelling in every report and message), every other symbol as it is. lookupUnit reads
 * µT, μT and uT alike, so a displayed symbol can be typed back.
 * @example displaySymbol('uT') // 'µT'
 */
export function displaySymbol(symbol: string): string {
  return symbol.replace(/^u(?=[Tm]$)/, '\u00b5');
}
