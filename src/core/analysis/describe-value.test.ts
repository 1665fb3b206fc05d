import { describe, expect, it } from 'vitest';
import { describeTolerance, describeValue } from './describe-value';

describe('describeValue()', () => {
  it('shows a value and its interval in one unit, three significant digits', () => {
    // SI prefixes (SI Brochure 9th ed. §3): 0.0448 m → 44.8 mm
    expect(describeValue(0.0448, 'length', [0.0439, 0.0457])).toBe('44.8 mm (43.9–45.7)');
    // three significant digits, en dash between the ends: our format (regression pin, not truth)
    expect(describeValue(96, 'current', [92, 100])).toBe('96.0 A (92.0–100)');
  });

  it('picks the unit from the largest number shown, so a wide interval stays readable', () => {
    // a trend of 0.986 A/yr with a ±21 A/yr interval: the interval decides the unit
    expect(describeValue(0.986, 'current', [-20.569, 22.541])).toBe('0.986 A (-20.6 to 22.5)');
  });

  it('describeTolerance() writes relative and absolute parts', () => {
    // our format, as the label states it (regression pin, not truth)
    expect(describeTolerance(120, 'current', { relative: 0.1, absolute: 0 })).toBe('120 A ± 10 %');
    expect(describeTolerance(0.045, 'length', { relative: 0, absolute: 0.002 })).toBe('45.0 mm ± 2.00 mm');
    expect(describeTolerance(1.7e-3, 'field', { relative: 0.05, absolute: 2e-5 })).toBe('1.70 mT ± (5 % + 20.0 µT)');
  });
});
