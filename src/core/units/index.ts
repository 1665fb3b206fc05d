export { parseQuantity, type Quantity } from './parse-quantity';
export { parseRelativePlusAbsolute, type RelativePlusAbsolute } from './tolerance';
export { formatQuantity, formatNumber, displayUnit } from './format-quantity';
export { ambiguousUnit, displaySymbol, lookupUnit, unitsOfKind, type QuantityKind, type UnitDefinition } from './unit-table';
export { surveyUnits, type DisplayUnit, type SurveyUnitChoice } from './survey-units';
