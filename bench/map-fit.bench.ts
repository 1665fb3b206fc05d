/**
 * 3-D map benchmark (issue 12): one `ringfall fit` of a 1,000-reading vector map (Bx, By,
 * Bz on a 10 × 10 × 10 grid, 3,000 residuals) of a loop applicator tilted 20° towards
 * azimuth 35°, 1 % + 0.5 µT noise, through fitSurvey with the default models (a map fits
 * loop and dipole with their pose; the power laws are left out) and with the loop alone.
 * Target: the whole fit under 0.5 s (wall, one core). Median of 7 runs after a warm-up;
 * exits 1 when a figure misses it.
 */
import { fitSurvey } from '../src/core/fit/strategy/fit-survey';
import type { FitSurveyOptions } from '../src/core/fit/fit-survey-options';
import { predictFieldAtPoint } from '../src/core/models';
import { mulberry32, normalRandom } from '../src/core/random';
import type { Reading, Survey } from '../src/core/survey/survey';

const TARGET_MS = 500;
const coil = { ampereTurns: 360, radius: 0.045, centreX: 0.012, centreY: -0.008, centreZ: -0.03, tilt: (20 * Math.PI) / 180, azimuth: (35 * Math.PI) / 180 };
const gaussian = normalRandom(mulberry32(1212));
const readings: Reading[] = [];
const grid = Array.from({ length: 10 }, (_, i) => -0.06 + (0.12 * i) / 9);
const heights = Array.from({ length: 10 }, (_, i) => 0.005 + 0.01 * i);
for (const z of heights) {
  for (const y of grid) {
    for (const x of grid) {
      const b = predictFieldAtPoint('loop', coil, { x, y, z }).vector;
      const sigma = 0.01 * Math.hypot(b.x, b.y, b.z) + 5e-7;
      const components = { x: b.x + sigma * gaussian(), y: b.y + sigma * gaussian(), z: b.z + 2.5e-5 + sigma * gaussian() };
      readings.push({ line: readings.length + 2, distance: z, radial: Math.hypot(x, y), field: Math.hypot(components.x, components.y, components.z), components, position: { x, y, z } });
    }
  }
}
const survey: Survey = {
  source: 'bench map', coil: null, date: null, readingType: 'dc', fieldKind: 'components', readings, rejected: [], totalRows: readings.length, meta: {}, notes: [], axis: 'map',
};

function measure(label: string, options: FitSurveyOptions, runs = 7): number {
  fitSurvey(survey, options); // warm-up
  const times: number[] = [];
  for (let r = 0; r < runs; r++) {
    const started = performance.now();
    const fits = fitSurvey(survey, options);
    times.push(performance.now() - started);
    if (!fits[0]!.converged) throw new Error(`${label}: the loop fit did not converge`);
  }
  times.sort((a, b) => a - b);
  const median = times[Math.floor(runs / 2)]!;
  console.log(`${label.padEnd(58)} ${median.toFixed(0).padStart(6)} ms median (target < ${TARGET_MS} ms: ${median < TARGET_MS ? 'MET' : 'MISSED'})`);
  if (median >= TARGET_MS) process.exitCode = 1;
  return median;
}

console.log(`3-D map of ${readings.length} vector readings (${3 * readings.length} residuals)`);
measure('default models (loop, dipole), adaptive starts', {});
measure('loop alone, adaptive starts', { models: ['loop'] });
measure('loop alone, --uncertainty 1%+0.5uT', { models: ['loop'], instrumentUncertainty: { relative: 0.01, absolute: 5e-7 } });
