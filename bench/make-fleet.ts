/**
 * Generator of an invented fleet of survey files for the batch benchmark and the batch
 * end-to-end tests: coils surveyed quarterly, one CSV file per survey, each with its
 * `# coil` and `# date` lines and `readings` on-axis readings of a loop (the catalog's
 * loop model, DOMAIN.md §1.1) with seeded gaussmeter noise (scripts/sample-data). Every
 * 7th coil loses 4 % of its ampere-turns per quarter from the third survey on (degrading);
 * every 11th is replaced by a unit of 1.3× the radius at its last survey (geometry change).
 * Same arguments, same bytes.
 *
 * Run: `npx tsx bench/make-fleet.ts DIR [FILES] [READINGS]` (default 10000 files, 30 readings).
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { mulberry32 } from '../src/core/random';
import { catalogReading } from '../scripts/sample-data/catalog-reading';
import { display, gaussianSource, noisyReading, type NoiseModel } from '../scripts/sample-data/noisy-reading';

/** Options of {@link makeFleet}. */
export interface FleetOptions {
  /** Survey files to write. */
  readonly files: number;
  /** Readings per survey. Default 30. */
  readonly readings?: number;
  /** Surveys per coil (one per quarter). Default 5. */
  readonly surveysPerCoil?: number;
  /** Seed of the coils' parameters and the noise. Default 20260301. */
  readonly seed?: number;
}

/** Noise of a good handheld Hall meter (DOMAIN.md §3.2, §3.7): 0.5 % of reading, 1 µT floor, 0.2 mm placement, 4 digits. */
const noise: NoiseModel = { relativeSd: 0.005, floorSd: 1e-6, positionSd: 2e-4, significantDigits: 4 };

/**
 * Write the fleet's files into `folder` (created if needed).
 * @returns the paths written, sorted
 */
export function makeFleet(folder: string, options: FleetOptions): string[] {
  const readings = options.readings ?? 30;
  const perCoil = options.surveysPerCoil ?? 5;
  const seed = options.seed ?? 20260301;
  const uniform = mulberry32(seed);
  mkdirSync(folder, { recursive: true });
  const paths: string[] = [];
  const coils = Math.ceil(options.files / perCoil);
  for (let c = 0; c < coils; c++) {
    const coil = `FL-${String(c + 1).padStart(5, '0')}`;
    const ampereTurns = 200 + 400 * uniform();
    const radius = 0.03 + 0.05 * uniform();
    const probeOffset = 0.002 + 0.003 * uniform();
    const background = 2e-5 * uniform();
    for (let s = 0; s < perCoil && paths.length < options.files; s++) {
      const loss = c % 7 === 3 && s >= 2 ? 1 - 0.04 * (s - 1) : 1;
      const swapped = c % 11 === 5 && s === perCoil - 1 ? 1.3 : 1;
      const truth = { ampereTurns: ampereTurns * loss, radius: radius * swapped, probeOffset, background };
      const reading = catalogReading('loop', truth, 'axial');
      const gaussian = gaussianSource(seed + 7919 * (paths.length + 1));
      const date = quarterDate(s);
      const reach = 4 * radius;
      const lines = [`# coil: ${coil}`, `# date: ${date}`, '# reading: dc', '# note: INVENTED benchmark fleet (bench/make-fleet.ts)', 'distance (mm),B (mT)'];
      for (let i = 0; i < readings; i++) {
        const distance = reach * (i / (readings - 1)) ** 1.5;
        lines.push(`${display(distance, 1e-3, 4)},${display(noisyReading(reading, distance, noise, gaussian), 1e-3, noise.significantDigits)}`);
      }
      const path = join(folder, `${coil.toLowerCase()}-${date}.csv`);
      writeFileSync(path, lines.join('\n') + '\n');
      paths.push(path);
    }
  }
  return paths.sort();
}

/** Survey s of a coil: quarterly from 2025-01-15. */
function quarterDate(s: number): string {
  const month = s * 3;
  return `${2025 + Math.floor(month / 12)}-${String((month % 12) + 1).padStart(2, '0')}-15`;
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const [folder, files = '10000', readings = '30'] = process.argv.slice(2);
  const count = Number(files);
  const perFile = Number(readings);
  if (folder === undefined || !Number.isInteger(count) || count < 1 || !Number.isInteger(perFile) || perFile < 2) {
    const wrong = folder === undefined ? 'no DIR given' : `FILES "${files}" and READINGS "${readings}" must be whole numbers, at least 1 and 2`;
    process.stderr.write(`make-fleet: ${wrong}. Usage: npx tsx bench/make-fleet.ts DIR [FILES] [READINGS]\n`);
    process.exitCode = 2;
  } else {
    const written = makeFleet(folder, { files: count, readings: perFile });
    process.stdout.write(`wrote ${written.length} survey files to ${folder}\n`);
  }
}
