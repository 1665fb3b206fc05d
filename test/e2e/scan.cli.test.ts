import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { schemaErrors } from '../support/json-schemas';

const root = join(import.meta.dirname, '..', '..');

function ringfall(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const result = spawnSync(process.execPath, ['bin/ringfall.mjs', ...args], { cwd: root, encoding: 'utf8', timeout: 120_000 });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

// On-axis field of a circular loop, B = μ0 N I a² / (2 (a² + z²)^{3/2})
// (Griffiths, Introduction to Electrodynamics, 4th ed., Example 5.6), CODATA 2018 μ0.
const mu0 = 1.25663706212e-6;
const loopAxial = (ampereTurns: number, radius: number, z: number) => (mu0 * ampereTurns * radius ** 2) / (2 * (radius ** 2 + z ** 2) ** 1.5);

// A 70 mm coil pair at Helmholtz spacing (100 ampere-turns each), its midpoint 23.1 mm
// from the ruler's zero, read every 11.4 mm from −304 mm to +256 mm, ±0.5 % wobble.
const truth = { ampereTurns: 100, radius: 0.035, separation: 0.035, centre: 0.0231 };
const rows = Array.from({ length: 50 }, (_, i) => {
  const position = -0.304 + (0.56 * i) / 49;
  const z = position - truth.centre;
  const field = (loopAxial(100, 0.035, z - 0.0175) + loopAxial(100, 0.035, z + 0.0175)) * (1 + 0.005 * Math.sin(7 * i));
  return `${(position * 1000).toFixed(1)},${(field * 1000).toFixed(5)}`;
});
const folder = mkdtempSync(join(tmpdir(), 'ringfall-scan-'));
const file = join(folder, 'pair-scan.csv');
writeFileSync(file, ['position (mm),B (mT)', ...rows].join('\n') + '\n');

describe('ringfall fit on a scan through the coil (signed positions)', () => {
  it('uses every reading, both sides of the coil, and reports the centre with an interval in JSON, text and HTML', () => {
    const run = ringfall('fit', file, '--model', 'coil-pair,loop', '--threshold', '0.5mT', '--json');
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    const report = JSON.parse(run.stdout);
    expect(schemaErrors('report', report)).toEqual([]);
    const survey = report.surveys[0];
    expect(survey.axis).toBe('position');
    expect(survey.readings).toEqual({ total: 50, used: 50, rejected: [] });
    const pair = survey.fits.find((f: { model: string }) => f.model === 'coil-pair');
    expect(pair.params.probeOffset).toBeUndefined();
    // every one of the 50 rows written above, both sides of the coil
    expect(pair.stats.n).toBe(50);
    for (const [name, value] of Object.entries(truth)) {
      const estimate = pair.params[name];
      // truth of the generator above; the wobble is ±0.5 %, so 1 % of the value is generous
      expect(Math.abs(estimate.value - value)).toBeLessThan(0.01 * value);
      expect(estimate.ci95).not.toBeNull();
    }
    expect(pair.params.centre.unit).toBe('m');
    // the threshold is a distance from the pair's midpoint, not a ruler position
    expect(survey.thresholds[0].distance.value).toBeGreaterThan(0.035);

    const text = ringfall('fit', file, '--model', 'coil-pair', '--html', join(folder, 'report.html'));
    expect(text.status).toBe(0);
    expect(text.stdout).toMatch(/centre\s+23\.\d+ mm\s+23\.\d+ to 23\.\d+ mm/u);
    expect(text.stdout).toContain('50 of 50 rows used');
    expect(readFileSync(join(folder, 'report.html'), 'utf8')).toContain('data-param="centre"');
  });

  it('a distance column keeps refusing negative values, and names the position form', () => {
    const distanceFile = join(folder, 'distance.csv');
    writeFileSync(distanceFile, ['distance (mm),B (mT)', ...rows].join('\n') + '\n');
    const run = ringfall('fit', distanceFile, '--model', 'loop', '--json');
    const report = JSON.parse(run.stdout);
    expect(report.surveys[0].axis).toBeUndefined();
    expect(report.surveys[0].readings.used).toBeLessThan(50);
    expect(report.surveys[0].readings.rejected[0].reason).toContain('name the column "position"');
  });
});
