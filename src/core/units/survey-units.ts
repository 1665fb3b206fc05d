import type { SurveyUnits } from '../survey/survey';
import { displayUnit, formatNumber } from './format-quantity';
import { displaySymbol, lookupUnit, type QuantityKind } from './unit-table';

/** A unit to show values in: its symbol as people write it and its factor to SI. */
export interface DisplayUnit {
  readonly symbol: string;
  readonly factor: number;
}

/** How one survey's values are shown: in the units its file was written in, where known. */
export interface SurveyUnitChoice {
  /** The survey's units, or null when they are not known (a synthetic survey, an old JSON report). */
  readonly units: SurveyUnits | null;
  /**
   * The unit a value of this kind is shown in: the survey's field unit for fields, its
   * distance unit for lengths, unless `reference` would need an exponent there (below
   * 1e-4 or from 1e6 of the unit); otherwise (other kinds, units not known, such a
   * value) `fallback` when given, else the ladder unit that suits `reference` (displayUnit).
   */
  unit(kind: QuantityKind, reference: number, fallback?: DisplayUnit): DisplayUnit;
  /** "15.00 G", "1.772 in": an SI value in unit(kind, value, fallback) with `significant` digits (4 unless given). */
  format(value: number, kind: QuantityKind, options?: { significant?: number; fallback?: DisplayUnit }): string;
}

/**
 * The units to show a survey's fields and lengths in: the ones its file was written in
 * (Survey.units, SurveyReport.units), so the person who took the readings reads numbers
 * in their meter's units. Currents and moments, and every value of a survey whose units
 * are not known, keep the unit chosen from the value (today's displayUnit ladder).
 *
 * @example surveyUnits({ units: { field: 'G', distance: 'in' } }).format(0.0015, 'field') // "15.00 G"
 */
export function surveyUnits(survey: { readonly units?: SurveyUnits | null } | null | undefined): SurveyUnitChoice {
  const units = survey?.units ?? null;
  const known: Partial<Record<QuantityKind, DisplayUnit>> = {};
  if (units !== null) {
    const field = lookupUnit(units.field);
    const length = lookupUnit(units.distance);
    if (field?.kind === 'field') known.field = { symbol: displaySymbol(field.symbol), factor: field.factor };
    if (length?.kind === 'length') known.length = { symbol: displaySymbol(length.symbol), factor: length.factor };
  }
  const unit = (kind: QuantityKind, reference: number, fallback?: DisplayUnit): DisplayUnit => {
    const own = known[kind];
    // a value the survey's unit could only write with an exponent (1.000e-5 mT) is shown in the ladder's unit instead
    const plain = (magnitude: number) => magnitude === 0 || !Number.isFinite(magnitude) || (magnitude >= 1e-4 && magnitude < 1e6);
    if (own && plain(Math.abs(reference) / own.factor)) return own;
    return fallback ?? displayUnit(reference, kind);
  };
  return {
    units,
    unit,
    format(value, kind, options = {}) {
      if (!Number.isFinite(value)) return `${value}`;
      const chosen = unit(kind, value, options.fallback);
      return `${formatNumber(value / chosen.factor, options.significant ?? 4)} ${chosen.symbol}`;
    },
  };
}
