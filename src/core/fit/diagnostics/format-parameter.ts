import type { ParameterUnit } from '../../models/field-model';
import { parameterQuantityKind } from '../../models/parse-parameter-assignment';
import { formatNumber, formatQuantity } from '../../units/format-quantity';

/**
 * A parameter value for a sentence, in a sensible display unit: "45.02 mm", "360.1 A",
 * "25.3 uT", "3.142 A·m²"; dimensionless and T·m^n values as plain numbers.
 *
 * @example formatParameter(0.04502, 'm') // "45.02 mm"
 */
export function formatParameter(value: number, unit: ParameterUnit, significant = 4): string {
  const kind = parameterQuantityKind(unit);
  if (kind !== null) return formatQuantity(value, kind, { significant });
  return unit === '1' ? formatNumber(value, significant) : `${formatNumber(value, significant)} ${unit}`;
}
