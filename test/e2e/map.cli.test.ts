import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { evenlySpaced } from '../../src/core/fit/testing/simulated-survey';
import { loopByBiotSavart, placedLoopByBiotSavart } from '../support/biot-savart';
import { expectClose } from '../support/expect-close';
import { schemaErrors } from '../support/json-schemas';

const root = join(import.meta.dirname, '..', '..');

function ringfall(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const result = spawnSync(process.execPath, ['bin/ringfall.mjs', ...args], { cwd: root, encoding: 'utf8', timeout: 120_000 });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

const degrees = Math.PI / 180;
const folder = mkdtempSync(join(tmpdir(), 'ringfall-map-'));

// A 30 mm loop of 250 ampere-turns tilted 25° towards azimuth −60°, centred at
// (8.3, −12.1, −25) mm, mapped on 6 × 6 × 3 points; direct Biot–Savart in the map's frame
// (test/support/biot-savart.ts), ±0.3 % wobble on each component.
const tilt = 25 * degrees;
const azimuth = -60 * degrees;
const normal: [number, number, number] = [Math.sin(tilt) * Math.cos(azimuth), Math.sin(tilt) * Math.sin(azimuth), Math.cos(tilt)];
const mapRows: string[] = [];
for (const x of evenlySpaced(-45, 45, 6)) {
  for (const y of evenlySpaced(-45, 45, 6)) {
    for (const z of [-5, 10, 25]) {
      const b = placedLoopByBiotSavart(250, 0.03, [0.0083, -0.0121, -0.025], normal, [x / 1000, y / 1000, z / 1000]);
      mapRows.push([x, y, z, ...b.map((v, k) => (v * 1e6 * (1 + 0.003 * Math.sin(3 * mapRows.length + k))).toFixed(4))].join(','));
    }
  }
}
const mapFile = join(folder, 'map.csv');
writeFileSync(mapFile, ['x (mm),y (mm),z (mm),Bx (uT),By (uT),Bz (uT)', ...mapRows].join('\n') + '\n');

// A 40 mm loop of 300 ampere-turns read across it at 10 and 25 mm from the winding plane, the
// lateral ruler's zero 13.7 mm from the axis (loopByBiotSavart), ±0.3 % wobble.
const lateralRows: string[] = [];
for (const d of [10, 25]) {
  for (const x of evenlySpaced(-60, 60, 25)) {
    const [bz, br] = loopByBiotSavart(300, 0.04, d / 1000, Math.abs(x / 1000 - 0.0137));
    lateralRows.push(`${x},${d},${(Math.hypot(bz, br) * 1000 * (1 + 0.003 * Math.sin(lateralRows.length))).toFixed(6)}`);
  }
}
const lateralFile = join(folder, 'across.csv');
writeFileSync(lateralFile, ['lateral position (mm),distance (mm),|B| (mT)', ...lateralRows].join('\n') + '\n');

describe('ringfall fit on a 3-D map and on a transverse scan', () => {
  it('a vector map: the pose with intervals in JSON (schema-valid, axis "map", points with x, y, z and component), text and HTML', () => {
    const run = ringfall('fit', mapFile, '--json', '--threshold', '100uT');
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    const report = JSON.parse(run.stdout);
    expect(schemaErrors('report', report)).toEqual([]);
    const survey = report.surveys[0];
    expect(survey.axis).toBe('map');
    expect(survey.fits.map((f: { model: string }) => f.model)).toEqual(['loop', 'dipole']);
    const loop = survey.fits[0];
    expect(loop.params.probeOffset).toBeUndefined();
    expect(loop.params.tilt.unit).toBe('rad');
    // the map file above: 6 × 6 × 3 = 108 positions, three residuals (Bx, By, Bz) each
    expect(loop.stats.n).toBe(3 * 108);
    expect(loop.points.component.slice(0, 3)).toEqual(['x', 'y', 'z']);
    expect(loop.points.x).toHaveLength(3 * 108);
    // truth of the generator above; the wobble is ±0.3 %, so 1 % (or 1 mm, 1°) is generous
    const truth: Record<string, [number, number]> = {
      ampereTurns: [250, 2.5], radius: [0.03, 3e-4], centreX: [0.0083, 1e-3], centreY: [-0.0121, 1e-3], centreZ: [-0.025, 1e-3], tilt: [tilt, degrees], azimuth: [azimuth, degrees],
    };
    for (const [name, [value, tolerance]] of Object.entries(truth)) {
      expect(Math.abs(loop.params[name].value - value), name).toBeLessThan(tolerance);
      expect(loop.params[name].ci95, name).not.toBeNull();
    }
    // the threshold is a distance on the axis from the winding plane
    expect(survey.thresholds[0].distance.value).toBeGreaterThan(0.03);

    const text = ringfall('fit', mapFile, '--model', 'loop', '--html', join(folder, 'map.html'));
    expect(text.status).toBe(0);
    expect(text.stdout).toMatch(/tilt\s+25\.\d+°\s+2\d\.\d+ to 2\d\.\d+°/u);
    expect(text.stdout).toContain('3-D map');
    expect(readFileSync(join(folder, 'map.html'), 'utf8')).toContain('data-param="tilt"');
  });

  it('--csv of a vector map: three rows per reading with x_m, y_m, z_m and the component', () => {
    const csv = join(folder, 'map-points.csv');
    expect(ringfall('fit', mapFile, '--model', 'loop', '--csv', csv).status).toBe(0);
    const rows = readFileSync(csv, 'utf8').split('\r\n').filter((line) => line !== '' && !line.startsWith('#'));
    expect(rows[0]!.endsWith(',outlier,x_m,y_m,z_m,component')).toBe(true);
    // 108 readings (6 × 6 × 3 above) × 3 components, one model
    expect(rows).toHaveLength(1 + 3 * 108);
    expect(rows.slice(1, 4).map((row) => row.split(',').slice(-4))).toEqual(['x', 'y', 'z'].map((c) => ['-0.045', '-0.045', '-0.005', c]));
  });

  it('a transverse scan: the lateral centre with an interval, marked "lateral": "position" in JSON', () => {
    const run = ringfall('fit', lateralFile, '--model', 'loop', '--json');
    expect(run.status).toBe(0);
    const report = JSON.parse(run.stdout);
    expect(schemaErrors('report', report)).toEqual([]);
    const survey = report.surveys[0];
    expect(survey.lateral).toBe('position');
    const centre = survey.fits[0].params.lateralCentre;
    // truth 13.7 mm; ±0.3 % wobble
    expect(Math.abs(centre.value - 0.0137)).toBeLessThan(2e-4);
    expect(centre.ci95).not.toBeNull();
  });
});

describe('ringfall predict --point (a coil placed in a map)', () => {
  it('a loop turned to the +x axis gives the on-axis field along x', () => {
    const run = ringfall('predict', '--model', 'loop', '--set', 'ampereTurns=1A', '--set', 'radius=100mm', '--set', 'tilt=90deg', '--point', '100mm,0mm,0mm', '--json');
    expect(run.status).toBe(0);
    const json = JSON.parse(run.stdout);
    expect(schemaErrors('predict', json)).toEqual([]);
    // DOMAIN.md §9 row 2 (μ0·I/(2^{5/2}·R) at z = R = 0.1 m): 2.2214414703e-6 T, here along the map's x
    expectClose(json.vector.x.value, 2.2214414703e-6, { rel: 1e-9 });
    expect(Math.abs(json.vector.z.value)).toBeLessThan(1e-15);
    expect(json.point.x).toEqual({ value: 0.1, unit: 'm' });
  });

  it('agrees with direct Biot–Savart for a tilted, moved loop off its axis', () => {
    const run = ringfall('predict', '--model', 'loop', '--set', 'ampereTurns=250A', '--set', 'radius=30mm', '--set', 'centreX=8.3mm', '--set', 'centreY=-12.1mm', '--set', 'centreZ=-25mm',
      '--set', 'tilt=25deg', '--set', 'azimuth=-60deg', '--point', '20mm,5mm,10mm', '--json');
    expect(run.status).toBe(0);
    const json = JSON.parse(run.stdout);
    // independent method: test/support/biot-savart.ts placedLoopByBiotSavart, converged to 1e-13
    const b = placedLoopByBiotSavart(250, 0.03, [0.0083, -0.0121, -0.025], normal, [0.02, 0.005, 0.01]);
    for (const [k, axis] of (['x', 'y', 'z'] as const).entries()) expectClose(json.vector[axis].value, b[k]!, { rel: 1e-9, abs: 1e-15 });
  });

  it('--point with a model that has no axis, or with --at, is refused with what to do', () => {
    const rectangle = ringfall('predict', '--model', 'rectangle', '--set', 'ampereTurns=1A', '--set', 'width=1cm', '--set', 'height=1cm', '--point', '0mm,0mm,10mm');
    expect(rectangle.status).toBe(2);
    expect(rectangle.stderr).toContain('no axis to place');
    const both = ringfall('predict', '--model', 'loop', '--set', 'ampereTurns=1A', '--set', 'radius=1cm', '--point', '0mm,0mm,10mm', '--at', '1cm');
    expect(both.status).toBe(2);
    expect(both.stderr).toContain('leave out --at');
  });
});
