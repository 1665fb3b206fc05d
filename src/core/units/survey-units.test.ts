import { describe, it, expect } from 'vitest';
import { surveyUnits } from './survey-units';

describe('surveyUnits(survey)', () => {
  it('surveyUnits() shows fields in gauss and lengths in inches for a survey written in G and in', () => {
    const units = surveyUnits({ units: { field: 'G', distance: 'in' } });
    // 1 G = 1e-4 T exactly (SI Brochure, 9th ed., Table 8): 1.5 mT = 15 G
    expect(units.format(1.5e-3, 'field')).toBe('15.00 G');
    // 1 in = 25.4 mm exactly (international yard and pound agreement, 1959): 45 mm = 1.771653… in
    expect(units.format(0.045, 'length')).toBe('1.772 in');
    expect(units.format(0.045, 'length', { significant: 3 })).toBe('1.77 in');
  });

  it('surveyUnits() writes micro as µ and keeps the survey unit for small and large values alike', () => {
    const units = surveyUnits({ units: { field: 'µT', distance: 'cm' } });
    // 1 µT = 1e-6 T, 1 cm = 1e-2 m (SI Brochure, 9th ed., Table 7 prefixes)
    expect(units.format(1.5e-3, 'field')).toBe('1500 µT');
    expect(units.format(2e-7, 'field')).toBe('0.2000 µT');
    expect(units.format(0.5, 'length')).toBe('50.00 cm');
    expect(surveyUnits({ units: { field: 'uT', distance: 'cm' } }).unit('field', 1e-3).symbol).toBe('µT');
  });

  it('surveyUnits() falls back to the unit chosen from the value when the units are not known', () => {
    const units = surveyUnits({});
    // the displayUnit ladder (format-quantity.ts): largest unit in which |x| ≥ 1
    expect(units.format(1.5e-3, 'field')).toBe('1.500 mT');
    expect(units.format(2e-5, 'field')).toBe('20.00 µT');
    expect(units.format(0.045, 'length', { fallback: { symbol: 'mm', factor: 1e-3 } })).toBe('45.00 mm');
    expect(units.units).toBeNull();
  });

  it('surveyUnits() keeps currents and moments on the ladder whatever the survey units', () => {
    const units = surveyUnits({ units: { field: 'G', distance: 'in' } });
    expect(units.format(1500, 'current')).toBe('1.500 kA');
    expect(units.unit('moment', 3).symbol).toBe('A·m²');
  });

  it('surveyUnits() shows a value the survey unit could only write with an exponent in the ladder unit', () => {
    const units = surveyUnits({ units: { field: 'mT', distance: 'm' } });
    // 20 nT = 2e-5 mT would read "2.000e-5 mT" (formatNumber switches below 1e-4)
    expect(units.format(2e-8, 'field')).toBe('20.00 nT');
    expect(units.format(2e-5, 'field')).toBe('0.02000 mT');
    expect(units.format(0, 'field')).toBe('0 mT');
  });

  it('surveyUnits() ignores a unit it does not know or of the wrong kind (a hand-edited JSON report)', () => {
    const units = surveyUnits({ units: { field: 'furlong', distance: 'mT' } });
    expect(units.format(1.5e-3, 'field')).toBe('1.500 mT');
    expect(units.format(0.045, 'length')).toBe('45.00 mm');
  });
});
