import type { QuantityKind } from './unit-table';

/** Unit ladders for display, largest first; a value is shown in the first unit where |x| ≥ threshold. */
const ladders: Record<QuantityKind, ReadonlyArray<readonly [symbol: string, factor: number]>> = {
  field: [['T', 1], ['mT', 1e-3], ['\u00b5T', 1e-6], ['nT', 1e-9]],
  length: [['m', 1], ['mm', 1e-3], ['\u00b5m', 1e-6]],
  current: [['kA', 1e3], ['A', 1], ['mA', 1e-3]],
  moment: [['A·m²', 1]],
};

/** Choose a display unit for an SI value: the largest unit in which |value| ≥ 1. */
export function displayUnit(value: number, kind: QuantityKind): { symbol: string; factor: number } {
  const ladder = ladders[kind];
  const magnitude = Math.abs(value);
  for (const [symbol, factor] of ladder) {
    if (magnitude >= factor) return { symbol, factor };
  }
  const last = ladder[ladder.length - 1]!;
  return { symbol: last[0], factor: last[1] };
}

/**
 * Format an SI value in a sensible unit with `significant` significant digits:
 * formatQuantity(0.0012345, 'field') → "1.235 mT"; formatQuantity(0.045, 'length') → "45.00 mm".
 * A fixed unit can be forced with `unit`.
 */
export function formatQuantity(
  value: number,
  kind: QuantityKind,
  options: { significant?: number; unit?: { symbol: string; factor: number } } = {},
): string {
  if (!Number.isFinite(value)) return `${value}`;
  const unit = options.unit ?? displayUnit(value, kind);
  return `${formatNumber(value / unit.factor, options.significant ?? 4)} ${unit.symbol}`;
}

/** Significant-digit formatting without exponent notation for ordinary magnitudes. */
export function formatNumber(value: number, significant = 4): string {
  if (value === 0) return '0';
  if (!Number.isFinite(value)) return `${value}`;
  const magnitude = Math.abs(value);
  if (magnitude >= 1e6 || magnitude < 1e-4) return value.toExponential(Math.max(0, significant - 1));
  const decimals = Math.max(0, significant - 1 - Math.floor(Math.log10(magnitude)));
  return value.toFixed(Math.min(decimals, 12));
}
