/**
 * Builds every sample-data file in memory from stated true parameters and seeded noise,
 * so the writer script and the tests share one definition (same seed → same bytes).
 */
import { buildFlawedFiles } from './build-flawed-files';
import { catalogReading } from './catalog-reading';
import { buildSpecFiles } from './build-spec-files';
import { gaussianSource, noisyReading, display, type NoiseModel } from './noisy-reading';
import {
  applicatorDistancesMm, applicatorProbeOffset, benchBackground, benchName, calibrationPair, calibrationPairCentre, fleetAmpereTurns,
  fleetDates, fleetDistancesMm, fleetRadius, handheldMeter, inventedNote, labMeter, pairScanPositionsMm, applicatorMapGridMm, tiltedApplicator,
} from './scenario';
import { predictFieldAtPoint } from '../../src/core/models';
import { roundToDigits } from './noisy-reading';

/** What TRUTH.json says about one survey: model, parameters (SI), noise and seed. */
export interface TruthEntry {
  readonly file: string;
  readonly story: string;
  readonly coil: string;
  readonly date: string;
  readonly readingType: 'dc' | 'rms' | 'peak';
  readonly model: string;
  readonly params: Readonly<Record<string, number>>;
  readonly noise: NoiseModel;
  readonly seed: number;
  /** For files with many surveys: one entry per coil and date. */
  readonly surveys?: readonly Omit<TruthEntry, 'file' | 'story' | 'noise' | 'surveys' | 'expected'>[];
  /** For deliberately flawed files: what importing them must give. */
  readonly expected?: Readonly<Record<string, unknown>>;
}

/** The 20 mm reference point is read first, after 50 mm, and last (DOMAIN §3.7: repeat a reference point). */
export const healthyOrderMm = [20, ...applicatorDistancesMm.slice(0, 15), 20, ...applicatorDistancesMm.slice(15), 20];

/** Header block shared by the single-survey files. */
function metadata(coil: string, date: string, reading: string, probe: string): string[] {
  return [`# coil: ${coil}`, `# date: ${date}`, `# reading: ${reading}`, `# probe: ${probe}`, `# site: ${benchName}`, `# note: ${inventedNote}`];
}

/** A loop applicator survey on axis with the bench's handheld meter; rows of [mm, tesla]. */
export function loopSurvey(ampereTurns: number, radius: number, distancesMm: readonly number[], seed: number, background = benchBackground): [number, number][] {
  const gaussian = gaussianSource(seed);
  const reading = catalogReading('loop', { ampereTurns, radius, probeOffset: applicatorProbeOffset, background }, 'axial');
  return distancesMm.map((mm) => [mm, noisyReading(reading, mm / 1000, handheldMeter, gaussian)]);
}

function loopTruth(file: string, story: string, coil: string, date: string, ampereTurns: number, radius: number, seed: number): TruthEntry {
  return {
    file, story, coil, date, readingType: 'dc', model: 'loop', seed, noise: handheldMeter,
    params: { ampereTurns, radius, probeOffset: applicatorProbeOffset, background: benchBackground },
  };
}

/** All sample files (path relative to sample-data/ → text) and the truth behind them. */
export function buildSampleData(): { files: Map<string, string>; truth: TruthEntry[] } {
  const files = new Map<string, string>();
  const truth: TruthEntry[] = [];
  const axialProbe = 'axial Hall probe, element 1.5 mm behind the tip; applicator housing 2.5 mm';

  // 1. Healthy loop applicator, near and far field, with a repeated reference point.
  const healthy = loopSurvey(360, 0.045, healthyOrderMm, 1101);
  files.set('qa-107-2025-03-11-healthy.csv', [...metadata('QA-107', '2025-03-11', 'dc', axialProbe), 'distance (mm),B (mT)',
    ...healthy.map(([mm, tesla]) => `${mm},${display(tesla, 1e-3, 4)}`)].join('\n') + '\n');
  truth.push(loopTruth('qa-107-2025-03-11-healthy.csv', 'healthy applicator, matches its label', 'QA-107', '2025-03-11', 360, 0.045, 1101));

  // 2. The same coil a year later: 15 % fewer ampere-turns (shorted turns), same radius.
  const degraded = loopSurvey(306, 0.045, applicatorDistancesMm, 1102);
  files.set('qa-107-2026-03-10-degraded.csv', [...metadata('QA-107', '2026-03-10', 'dc', axialProbe), 'distance (mm),B (mT)',
    ...degraded.map(([mm, tesla]) => `${mm},${display(tesla, 1e-3, 4)}`)].join('\n') + '\n');
  truth.push(loopTruth('qa-107-2026-03-10-degraded.csv', 'degraded: ampere-turns 15 % low, geometry unchanged', 'QA-107', '2026-03-10', 306, 0.045, 1102));

  // 3. Labelled as a 45 mm applicator, wound on a 60 mm former: shape disagrees with the label. Written in gauss.
  const mislabeled = loopSurvey(360, 0.06, applicatorDistancesMm, 1103);
  files.set('qa-214-2026-02-17-mislabeled.csv', [...metadata('QA-214', '2026-02-17', 'dc', axialProbe), 'distance_mm,field_G',
    ...mislabeled.map(([mm, tesla]) => `${mm},${display(tesla, 1e-4, 4)}`)].join('\n') + '\n');
  truth.push(loopTruth('qa-214-2026-02-17-mislabeled.csv', 'mislabeled: label says radius 45 mm, true radius 60 mm', 'QA-214', '2026-02-17', 360, 0.06, 1103));

  // 4. Rectangular therapy mat, 300 × 200 mm, on its 50 Hz drive, true-RMS meter; a clinic's semicolon/decimal-comma export.
  const matParams = { ampereTurns: 150, width: 0.3, height: 0.2, probeOffset: 0.006, background: 0 };
  const matReading = catalogReading('rectangle', matParams, 'axial');
  const matGaussian = gaussianSource(1104);
  const matDistancesMm = [0, 10, 20, 30, 40, 50, 60, 80, 100, 125, 150, 175, 200, 250, 300];
  const mat = matDistancesMm.map((mm) => [mm, noisyReading(matReading, mm / 1000, handheldMeter, matGaussian)] as const);
  files.set('qm-03-2026-01-20-mat.csv', '\uFEFF' + [...metadata('QM-03', '2026-01-20', 'rms', 'transverse Hall probe flat on the mat cover (cover 4.5 mm, blade 1.5 mm)'),
    'distance (mm);B (uT)', ...mat.map(([mm, tesla]) => `${mm};${display(tesla, 1e-6, 4).replace('.', ',')}`)].join('\r\n') + '\r\n');
  truth.push({
    file: 'qm-03-2026-01-20-mat.csv', story: 'rectangular mat 300 × 200 mm, 50 Hz drive, RMS readings (no DC background in an AC reading)',
    coil: 'QM-03', date: '2026-01-20', readingType: 'rms', model: 'rectangle', seed: 1104, noise: handheldMeter,
    params: matParams,
  });

  // 5. Thick coil (a lab electromagnet insert) on a jig with a lab teslameter; tab-separated with an uncertainty column.
  const thick = { ampereTurns: 1500, innerRadius: 0.02, outerRadius: 0.04, length: 0.03, probeOffset: 0.0015, background: benchBackground };
  const thickReading = catalogReading('thick-coil', thick, 'axial');
  const thickGaussian = gaussianSource(1105);
  const thickDistancesMm = [0, 2, 5, 8, 10, 15, 20, 25, 30, 40, 50, 60, 75, 90, 110, 130, 150];
  const thickRows = thickDistancesMm.map((mm) => {
    const tesla = noisyReading(thickReading, mm / 1000, labMeter, thickGaussian);
    return `${mm}\t${display(tesla, 1e-3, 5)}\t${display(labMeter.relativeSd * Math.abs(tesla) + labMeter.floorSd, 1e-6, 2)}`;
  });
  files.set('qt-9-2026-02-03-thick.csv', [...metadata('QT-9', '2026-02-03', 'dc', 'lab teslameter axial probe in a jig, element 1.5 mm behind the tip; distance from the coil face'),
    'z [mm]\tB [mT]\tuncertainty (uT)', ...thickRows].join('\n') + '\n');
  truth.push({
    file: 'qt-9-2026-02-03-thick.csv', story: 'thick coil, distance from its near face; uncertainty column = 0.25 % + 0.2 uT',
    coil: 'QT-9', date: '2026-02-03', readingType: 'dc', model: 'thick-coil', seed: 1105, noise: labMeter, params: thick,
  });

  // 6. Off-axis grid with a triaxial probe moved along +x: Bx is the radial component, By ≈ 0, Bz axial. Coil-off background subtracted.
  const gridParams = { ampereTurns: 400, radius: 0.05, probeOffset: applicatorProbeOffset, background: 0 };
  const [gridAxial, gridMagnitude] = [catalogReading('loop', gridParams, 'axial'), catalogReading('loop', gridParams, 'magnitude')];
  const gridGaussian = gaussianSource(1106);
  const gridRows: string[] = [];
  for (const mm of [10, 25, 50, 75, 100]) {
    for (const rhoMm of [0, 15, 30, 45, 60, 75]) {
      const distance = mm / 1000 + handheldMeter.positionSd * gridGaussian();
      const axial = gridAxial(distance, rhoMm / 1000);
      const size = gridMagnitude(distance, rhoMm / 1000);
      // B_ρ from |B| and B_z; for a loop B_ρ has the sign of z (here positive), DOMAIN §1.2 and §9 rows 7, 10, 11
      const radial = Math.sqrt(Math.max(0, size ** 2 - axial ** 2));
      const noisy = (value: number) => value + handheldMeter.relativeSd * size * gridGaussian() + handheldMeter.floorSd * gridGaussian();
      gridRows.push([mm, rhoMm, ...[radial, 0, axial].map((v) => display(noisy(v), 1e-3, 4))].join(','));
    }
  }
  files.set('qa-330-2026-03-02-offaxis-grid.csv', [...metadata('QA-330', '2026-03-02', 'dc', 'triaxial Hall probe, element 1.5 mm behind the tip; coil-off background subtracted per axis'),
    'distance (mm),radial offset (mm),Bx (mT),By (mT),Bz (mT)', ...gridRows].join('\n') + '\n');
  truth.push({
    file: 'qa-330-2026-03-02-offaxis-grid.csv', story: 'off-axis grid, components from a triaxial probe; |B| = √(Bx²+By²+Bz²)',
    coil: 'QA-330', date: '2026-03-02', readingType: 'dc', model: 'loop', seed: 1106, noise: handheldMeter,
    params: gridParams,
  });

  // 7. Fleet log: three coils on five quarterly dates in one file.
  const fleetRows: string[] = [];
  const fleetSurveys: NonNullable<TruthEntry['surveys']>[number][] = [];
  fleetDates.forEach((date, dateIndex) => {
    for (const coil of Object.keys(fleetAmpereTurns)) {
      const ampereTurns = fleetAmpereTurns[coil]?.[dateIndex] ?? Number.NaN;
      const radius = fleetRadius[coil] ?? Number.NaN;
      const seed = 1200 + 10 * dateIndex + Object.keys(fleetAmpereTurns).indexOf(coil);
      for (const [mm, tesla] of loopSurvey(ampereTurns, radius, fleetDistancesMm, seed)) fleetRows.push(`${coil},${date},dc,${mm},${display(tesla, 1e-3, 4)}`);
      fleetSurveys.push({ coil, date, readingType: 'dc', model: 'loop', seed, params: { ampereTurns, radius, probeOffset: applicatorProbeOffset, background: benchBackground } });
    }
  });
  files.set('fleet-log-2025-2026.csv', [`# site: ${benchName}`, `# probe: ${axialProbe}`, `# note: ${inventedNote}`, 'coil,date,reading,distance (mm),B (mT)', ...fleetRows].join('\n') + '\n');
  truth.push({
    file: 'fleet-log-2025-2026.csv', story: 'fleet log: QA-107 drops 15 % at the last date, QA-330 steady, QA-412 declines about 6 % a year',
    coil: 'QA-107, QA-330, QA-412', date: `${fleetDates[0]} to ${fleetDates.at(-1)}`, readingType: 'dc', model: 'loop', seed: 1200, noise: handheldMeter,
    params: {}, surveys: fleetSurveys,
  });

  // 8. The calibration coil pair QH-70 scanned along its axis on a rail, through both coils:
  // signed positions from the rail's ruler zero, which is 23.1 mm from the pair's midpoint.
  const pairParams = { ...calibrationPair, centre: calibrationPairCentre, background: benchBackground };
  const pairReading = catalogReading('coil-pair', pairParams, 'axial');
  const pairGaussian = gaussianSource(1107);
  const pairRows = pairScanPositionsMm.map((mm) => `${mm},${display(noisyReading(pairReading, mm / 1000, labMeter, pairGaussian), 1e-3, 5)}`);
  files.set('qh-70-2026-03-05-pair-scan.csv', [...metadata('QH-70', '2026-03-05', 'dc', 'lab teslameter axial probe on a rail through both coils; ruler zero at the rail\'s end stop, not the midpoint'),
    'position (mm),B (mT)', ...pairRows].join('\n') + '\n');
  truth.push({
    file: 'qh-70-2026-03-05-pair-scan.csv', story: 'calibration coil pair at Helmholtz spacing, scanned through both coils: signed positions, midpoint 23.1 mm from the ruler zero',
    coil: 'QH-70', date: '2026-03-05', readingType: 'dc', model: 'coil-pair', seed: 1107, noise: labMeter, params: pairParams,
  });

  // 8. A tilted applicator mapped in 3-D with a triaxial probe (Bx, By, Bz along the map's x, y, z), lab meter noise per component.
  const { backgroundX, backgroundY, backgroundZ, ...placed } = tiltedApplicator;
  const mapGaussian = gaussianSource(1108);
  const mapRows: string[] = [];
  for (const zMm of applicatorMapGridMm.z) {
    for (const yMm of applicatorMapGridMm.y) {
      for (const xMm of applicatorMapGridMm.x) {
        const at = (mm: number) => mm / 1000 + labMeter.positionSd * mapGaussian();
        const b = predictFieldAtPoint('loop', placed, { x: at(xMm), y: at(yMm), z: at(zMm) }).vector;
        const size = Math.hypot(b.x, b.y, b.z);
        const noisy = (value: number) => roundToDigits(value + labMeter.relativeSd * size * mapGaussian() + labMeter.floorSd * mapGaussian(), labMeter.significantDigits);
        mapRows.push([xMm, yMm, zMm, ...[b.x + backgroundX, b.y + backgroundY, b.z + backgroundZ].map((v) => display(noisy(v), 1e-6, 5))].join(','));
      }
    }
  }
  files.set('qa-512-2026-03-12-tilted-map.csv', [...metadata('QA-512', '2026-03-12', 'dc', 'lab teslameter triaxial probe on an x-y-z stage; probe axes along the stage\'s x, y, z; z = 0 at the applicator cover, the applicator sat tilted in its cradle'),
    'x (mm),y (mm),z (mm),Bx (uT),By (uT),Bz (uT)', ...mapRows].join('\n') + '\n');
  truth.push({
    file: 'qa-512-2026-03-12-tilted-map.csv', story: 'applicator tilted 12° in its cradle, mapped in 3-D with a triaxial probe: vector readings, pose fitted (centre, tilt, azimuth)',
    coil: 'QA-512', date: '2026-03-12', readingType: 'dc', model: 'loop', seed: 1108, noise: labMeter, params: tiltedApplicator,
  });

  for (const [path, text] of buildSpecFiles()) files.set(path, text);
  const flawed = buildFlawedFiles(healthy, metadata('QA-107', '2025-03-11', 'dc', axialProbe));
  for (const [path, text] of flawed.files) files.set(path, text);
  truth.push(...flawed.truth);
  files.set('TRUTH.json', `${JSON.stringify({ note: inventedNote, units: 'SI: A, m, T, rad; probeOffset, centre and background as DESIGN.md defines them; a 3-D map\'s pose (centreX, centreY, centreZ, tilt, azimuth) and background vector as docs/CONTRACT.md defines them', surveys: truth }, null, 2)}\n`);
  return { files, truth };
}
