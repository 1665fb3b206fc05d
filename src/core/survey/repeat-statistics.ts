import type { Survey } from './survey';

/** Mean and spread of the readings taken at one probe position. SI (m, T). */
export interface RepeatGroup {
  /** Distance along the axis, m. */
  readonly distance: number;
  /** Radial offset from the axis, m. */
  readonly radial: number;
  /** Number of readings at this position. */
  readonly count: number;
  /** Arithmetic mean of the readings, T. */
  readonly mean: number;
  /** Sample standard deviation s = √(Σ(x − x̄)²/(n − 1)), T; null for a single reading. */
  readonly standardDeviation: number | null;
  /** Source lines of the readings, in file order. */
  readonly lines: readonly number[];
}

/**
 * Group a survey's readings by probe position (exactly equal distance and radial offset)
 * and give each group's mean and sample standard deviation, computed with Welford's
 * one-pass update (Welford 1962, Technometrics 4(3):419) to avoid cancellation.
 * Groups come in order of first appearance in the file.
 *
 * @param survey an imported survey (readings in T, distances in m)
 * @returns one RepeatGroup per distinct position; `standardDeviation` in T (n − 1 divisor)
 * @example repeatStatistics(survey)[0] // { distance: 0.01, radial: 0, count: 3, mean: 1.2e-3, standardDeviation: 1e-5, lines: [4, 9, 15] }
 */
export function repeatStatistics(survey: Pick<Survey, 'readings'>): RepeatGroup[] {
  const groups = new Map<string, { distance: number; radial: number; count: number; mean: number; m2: number; lines: number[] }>();
  for (const reading of survey.readings) {
    const key = `${reading.distance}|${reading.radial}`;
    let group = groups.get(key);
    if (!group) {
      group = { distance: reading.distance, radial: reading.radial, count: 0, mean: 0, m2: 0, lines: [] };
      groups.set(key, group);
    }
    group.count += 1;
    const delta = reading.field - group.mean;
    group.mean += delta / group.count;
    group.m2 += delta * (reading.field - group.mean);
    group.lines.push(reading.line);
  }
  return [...groups.values()].map((group) => ({
    distance: group.distance,
    radial: group.radial,
    count: group.count,
    mean: group.mean,
    standardDeviation: group.count > 1 ? Math.sqrt(group.m2 / (group.count - 1)) : null,
    lines: group.lines,
  }));
}
