import type { FitResult } from '../core/fit/fit-result';
import type { Report } from '../core/report/report';

type FitPoint = FitResult['points'][number];

/** A fit's per-reading points as columns of numbers (σ NaN for none), cheap to move between threads. */
export interface PackedPoints {
  readonly columns: Float64Array;
  readonly count: number;
  /** 1/0 per reading when the fit flagged outliers, else null (no `outlier` key). */
  readonly outliers: Uint8Array | null;
  /** A 3-D map's x, y, z per reading (3·count), else null. */
  readonly positions?: Float64Array | null;
  /** A vector map's component per point (0, 1, 2 for x, y, z), else null. */
  readonly components?: Int8Array | null;
}

/** A Report whose fits carry `packed` columns in place of `points`. */
export interface PackedReport {
  readonly report: Report;
  readonly packed: readonly (readonly PackedPoints[])[];
}

const fields = 7;

/**
 * Move every fit's per-reading points into one Float64Array per fit (line, distance,
 * radial, field, predicted, residual, σ), so a Report of 10⁵ readings × 5 models crosses
 * from the worker as a few transferable buffers instead of 5·10⁵ cloned objects.
 * `unpackReport` restores the Report exactly (same numbers, same keys).
 */
export function packReport(report: Report): { message: PackedReport; transfer: ArrayBuffer[] } {
  const transfer: ArrayBuffer[] = [];
  const packed = report.surveys.map((survey) => survey.fits.map((fit) => {
    const count = fit.points.length;
    const columns = new Float64Array(count * fields);
    const hasOutliers = count > 0 && 'outlier' in fit.points[0]!;
    const outliers = hasOutliers ? new Uint8Array(count) : null;
    const positions = count > 0 && fit.points[0]!.position !== undefined ? new Float64Array(3 * count) : null;
    const components = count > 0 && fit.points[0]!.component !== undefined ? new Int8Array(count) : null;
    fit.points.forEach((p, i) => {
      if (positions) positions.set([p.position?.x ?? Number.NaN, p.position?.y ?? Number.NaN, p.position?.z ?? Number.NaN], 3 * i);
      if (components) components[i] = p.component === 'x' ? 0 : p.component === 'y' ? 1 : 2;
      columns[i] = p.line;
      columns[count + i] = p.distance;
      columns[2 * count + i] = p.radial;
      columns[3 * count + i] = p.field;
      columns[4 * count + i] = p.predicted;
      columns[5 * count + i] = p.residual;
      columns[6 * count + i] = p.standardUncertainty ?? Number.NaN;
      if (outliers) outliers[i] = p.outlier ? 1 : 0;
    });
    transfer.push(columns.buffer as ArrayBuffer);
    if (outliers) transfer.push(outliers.buffer as ArrayBuffer);
    if (positions) transfer.push(positions.buffer as ArrayBuffer);
    if (components) transfer.push(components.buffer as ArrayBuffer);
    return { columns, count, outliers, positions, components };
  }));
  const stripped: Report = { ...report, surveys: report.surveys.map((survey) => ({ ...survey, fits: survey.fits.map((fit) => ({ ...fit, points: [] })) })) };
  return { message: { report: stripped, packed }, transfer };
}

/** The Report `packReport` packed, with every fit's points as objects again. */
export function unpackReport(message: PackedReport): Report {
  const { report, packed } = message;
  return {
    ...report,
    surveys: report.surveys.map((survey, s) => ({
      ...survey,
      fits: survey.fits.map((fit, f) => ({ ...fit, points: unpackPoints(packed[s]![f]!) })),
    })),
  };
}

function unpackPoints({ columns, count, outliers, positions, components }: PackedPoints): FitPoint[] {
  const points: FitPoint[] = new Array(count);
  for (let i = 0; i < count; i++) {
    const sigma = columns[6 * count + i]!;
    const point = {
      line: columns[i]!, distance: columns[count + i]!, radial: columns[2 * count + i]!, field: columns[3 * count + i]!,
      predicted: columns[4 * count + i]!, residual: columns[5 * count + i]!, standardUncertainty: Number.isNaN(sigma) ? null : sigma,
    };
    const withOutlier = outliers ? { ...point, outlier: outliers[i] === 1 } : point;
    const placed = positions ? { ...withOutlier, position: { x: positions[3 * i]!, y: positions[3 * i + 1]!, z: positions[3 * i + 2]! } } : withOutlier;
    points[i] = components ? { ...placed, component: (['x', 'y', 'z'] as const)[components[i]!]! } : placed;
  }
  return points;
}
