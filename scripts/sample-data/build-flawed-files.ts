/**
 * Deliberately flawed survey files for tests and demos, made from the healthy QA-107
 * survey: one with bad rows of every common kind, one whose field column has no unit,
 * and one read with the probe reversed. TRUTH.json says what importing each must give.
 */
import type { TruthEntry } from './build-sample-data';
import { display, gaussianSource, noisyReading } from './noisy-reading';
import { applicatorProbeOffset, handheldMeter } from './scenario';
import { catalogReading } from './catalog-reading';

/** Cell text that replaces a healthy row, keyed by its ruler distance in mm; why, for the reader. */
const badRows: ReadonlyMap<number, { row: string; code: string }> = new Map([
  [0, { row: '0,OL', code: 'ROW_OVER_RANGE' }],
  [2, { row: '2,OL', code: 'ROW_OVER_RANGE' }],
  [10, { row: '10,', code: 'ROW_EMPTY_CELL' }],
  [16, { row: '16,n/a', code: 'ROW_NOT_A_NUMBER' }],
  [30, { row: '30,3,412', code: 'ROW_EXTRA_CELLS' }],
  [45, { row: '45,NaN', code: 'ROW_NOT_FINITE' }],
  [70, { row: '# 70,0.61 probe slipped', code: 'ROW_COMMENTED' }],
  [100, { row: '-100,0.1187', code: 'ROW_NEGATIVE_DISTANCE' }],
  [140, { row: '14O,0.0539', code: 'ROW_NOT_A_NUMBER' }],
]);

export function buildFlawedFiles(healthy: readonly [number, number][], metadata: readonly string[]): { files: Map<string, string>; truth: TruthEntry[] } {
  const files = new Map<string, string>();
  const truth: TruthEntry[] = [];
  const noteFlawed = (what: string) => [...metadata.filter((line) => !line.startsWith('# note:')), `${metadata.find((line) => line.startsWith('# note:'))} — DELIBERATELY FLAWED: ${what}`];
  const params = { ampereTurns: 360, radius: 0.045, probeOffset: applicatorProbeOffset, background: 2.5e-5 };

  const seen = new Set<number>();
  const rows = healthy.map(([mm, tesla]) => {
    const bad = seen.has(mm) ? undefined : badRows.get(mm);
    seen.add(mm);
    return bad ? bad.row : `${mm},${display(tesla, 1e-3, 4)}`;
  });
  files.set('flawed/bad-rows.csv', [...noteFlawed('nine rows are broken on purpose'), 'distance (mm),B (mT)', ...rows].join('\n') + '\n');
  truth.push({
    file: 'flawed/bad-rows.csv', story: 'the healthy QA-107 survey with nine broken rows', coil: 'QA-107', date: '2025-03-11', readingType: 'dc',
    model: 'loop', params, noise: handheldMeter, seed: 1101,
    expected: { used: healthy.length - badRows.size, rejectedCodes: [...badRows.values()].map((b) => b.code).sort() },
  });

  files.set('flawed/no-field-unit.csv', [...noteFlawed('the field column states no unit (the values are mT)'), 'distance (mm),B',
    ...healthy.map(([mm, tesla]) => `${mm},${display(tesla, 1e-3, 4)}`)].join('\n') + '\n');
  truth.push({
    file: 'flawed/no-field-unit.csv', story: 'the healthy QA-107 survey with "B" for "B (mT)"', coil: 'QA-107', date: '2025-03-11', readingType: 'dc',
    model: 'loop', params, noise: handheldMeter, seed: 1101, expected: { errorCode: 'IMPORT_FIELD_UNIT_MISSING', importsWith: { fieldUnit: 'mT' } },
  });

  // Probe held reversed: the meter shows −(field + background) plus its own zero offset of +30 uT, so far readings are above zero.
  const gaussian = gaussianSource(1107);
  // Seen after the flip: +10 uT of background along the probe minus the meter's +30 uT zero offset.
  const reversedParams = { ampereTurns: 400, radius: 0.05, probeOffset: applicatorProbeOffset, background: -2e-5 };
  const reversedReading = catalogReading('loop', reversedParams, 'axial');
  const reversed = [0, 5, 10, 15, 20, 30, 40, 50, 60, 80, 100, 130, 160, 200, 250, 300, 400, 500].map((mm) =>
    `${mm},${display(-noisyReading(reversedReading, mm / 1000, handheldMeter, gaussian), 1e-3, 4)}`);
  files.set('flawed/reversed-probe.csv', [...noteFlawed('read with the probe turned round; the importer flips the signs').map((l) => l.replace('QA-107', 'QA-330').replace('2025-03-11', '2026-03-02')),
    'distance (mm),B (mT)', ...reversed].join('\n') + '\n');
  truth.push({
    file: 'flawed/reversed-probe.csv', story: 'QA-330 read with the probe reversed and a +30 uT meter zero offset; after the flip the background is −20 uT',
    coil: 'QA-330', date: '2026-03-02', readingType: 'dc', model: 'loop', noise: handheldMeter, seed: 1107,
    params: reversedParams, expected: { flipped: true },
  });
  return { files, truth };
}
