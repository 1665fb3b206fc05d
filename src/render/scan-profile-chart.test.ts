import { describe, expect, it } from 'vitest';
import { loopByBiotSavart } from '../../test/support/biot-savart';
import { parseThresholdLevel } from '../core/analysis/thresholds/threshold-level';
import { analyseSurvey } from '../core/report/analyse-survey';
import type { Reading, Survey } from '../core/survey/survey';
import { scanProfileChart } from './scan-profile-chart';
import { catalogLookup } from './survey-facts';

// A loop of 200 A·turns, radius 40 mm, scanned through from a ruler zero 20 mm below its
// winding plane: readings by direct Biot–Savart integration (test/support/biot-savart.ts),
// independent of src/core/physics.
const centre = 0.02;
const positions = Array.from({ length: 45 }, (_, i) => -0.2 + (0.44 * i) / 44);
const readings: Reading[] = positions.map((p, i) => {
  const field = loopByBiotSavart(200, 0.04, p - centre, 0)[0];
  return { line: i + 2, distance: p, radial: 0, field, standardUncertainty: 0.005 * field + 1e-8 };
});
const survey: Survey = {
  source: 'simulated scan', coil: 'SC-1', date: null, readingType: 'dc', fieldKind: 'magnitude',
  readings, rejected: [], totalRows: readings.length, meta: {}, notes: [], axis: 'position',
};

describe('scanProfileChart()', () => {
  const report = analyseSurvey(survey, { fit: { models: ['loop', 'power-law'] }, specs: [], thresholds: [parseThresholdLevel('0.5mT', '--threshold')] });
  const chart = scanProfileChart(report, catalogLookup)!;
  const dataset = (label: string) => chart.config.data.datasets.filter((d) => d.label === label);

  it('draws a scan as taken: field against the signed ruler position, on linear axes', () => {
    expect(chart.config.options?.scales?.['x']?.type).toBe('linear');
    const xs = dataset('readings')[0]!.data.map((p) => (p as { x: number }).x);
    // positions in mm on the ruler: both sides of the coil, as read
    expect(Math.min(...xs)).toBeCloseTo(-200, 6);
    expect(Math.max(...xs)).toBeCloseTo(240, 6);
  });

  it('marks the fitted centre where the readings were made around (20 mm on the ruler)', () => {
    const line = dataset('loop centre')[0]!.data as { x: number }[];
    // the readings were made with the winding plane at `centre` = 20 mm on the ruler (noise-free, so within 0.01 mm)
    expect(Math.abs(line[0]!.x - 20)).toBeLessThan(0.01);
  });

  it('drops the threshold on both sides, where the on-axis loop field equals the level', () => {
    const drops = dataset('loop reaches 500 µT').map((d) => (d.data as { x: number }[])[0]!.x / 1e3);
    expect(drops).toHaveLength(2);
    for (const x of drops) {
      // on-axis loop field, Jackson, Classical Electrodynamics, 3rd ed., §5.5: μ0·N·I·R²/(2(R² + z²)^{3/2})
      const z = x - centre;
      const field = (4e-7 * Math.PI * 200 * 0.04 ** 2) / (2 * (0.04 ** 2 + z * z) ** 1.5);
      expect(Math.abs(field - 5e-4) / 5e-4).toBeLessThan(1e-3);
    }
    // symmetric about the centre
    expect(Math.abs(drops[0]! + drops[1]! - 2 * centre)).toBeLessThan(1e-6);
  });

  it('is null for a survey of distances from the datum', () => {
    const { axis: _scan, ...distances } = report;
    expect(scanProfileChart(distances, catalogLookup)).toBeNull();
  });
});
