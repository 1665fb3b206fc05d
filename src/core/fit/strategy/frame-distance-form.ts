import { axisDirection, coilFrame } from '../../physics/coil-pose';
import { nearFaceModels } from '../../models/scan-model';
import type { FitResult, ParameterEstimate } from '../fit-result';

type Point = FitResult['points'][number];

/** A parameter held at a value in a restated fit (probe offset 0, background 0). */
function held(name: string, unit: ParameterEstimate['unit'], value: number): ParameterEstimate {
  return { name, unit, value, stderr: null, ci95: null, fixed: true, determined: true };
}

/**
 * The fit with the parameters `drop` removed (their covariance rows and columns dropped:
 * the marginal covariance of the rest), the held parameters `add` put in, and new points.
 */
function restated(fit: FitResult, drop: ReadonlySet<string>, add: readonly ParameterEstimate[], points: FitResult['points']): FitResult {
  const params: Record<string, ParameterEstimate> = {};
  for (const [name, estimate] of Object.entries(fit.params)) if (!drop.has(name)) params[name] = estimate;
  for (const estimate of add) params[estimate.name] = estimate;
  const keep = fit.freeParameters.map((name, i) => (drop.has(name) ? -1 : i)).filter((i) => i >= 0);
  const k = fit.freeParameters.length;
  const sub = (matrix: readonly number[] | null) => (matrix === null ? null : keep.flatMap((r) => keep.map((c) => matrix[r * k + c]!)));
  return { ...fit, params, freeParameters: keep.map((i) => fit.freeParameters[i]!), covariance: sub(fit.covariance), correlation: sub(fit.correlation), points };
}

/**
 * A transverse scan's fit (parameter `lateralCentre`) with the lateral positions folded to
 * radial offsets |x − lateralCentre| and the parameter dropped: what the catalog model
 * (or its scan form) reads. Any other fit as it is.
 *
 * @example lateralDistanceForm(fit).points[0].radial // |x₀ − lateralCentre|
 */
export function lateralDistanceForm(fit: FitResult): FitResult {
  const centre = fit.params['lateralCentre']?.value;
  if (centre === undefined) return fit;
  return restated(fit, new Set(['lateralCentre']), [], fit.points.map((point) => ({ ...point, radial: Math.abs(point.radial - centre) })));
}

const poseNames: ReadonlySet<string> = new Set(['centreX', 'centreY', 'centreZ', 'tilt', 'azimuth', 'backgroundX', 'backgroundY', 'backgroundZ']);

/**
 * A 3-D map's fit (the pose: centreX, centreY, centreZ, tilt, azimuth) restated in the
 * catalog's distance form, so that thresholds, curves and claims keep measuring from the
 * model's datum on its axis: the pose is dropped (marginal covariance of the rest),
 * `probeOffset` is 0 and held, and each reading becomes one point at distance |u| from the
 * centre along the axis (less length/2 for a near-face model) and radial offset ρ
 * (physics/coil-pose.ts coilFrame). A vector map's three points per reading become one:
 * the background vector is taken off the reading and the prediction, and the point holds
 * the magnitudes of what is left (background 0 and held), with σ the root mean square
 * of the three components' σ. Any other fit as it is.
 */
export function poseDistanceForm(fit: FitResult): FitResult {
  const tilt = fit.params['tilt']?.value;
  if (tilt === undefined) return fit;
  const value = (name: string) => fit.params[name]?.value ?? 0;
  const centre = [value('centreX'), value('centreY'), value('centreZ')];
  const axis = new Float64Array(3);
  axisDirection(tilt, value('azimuth'), axis);
  const frame = new Float64Array(5);
  const shift = nearFaceModels.has(fit.model) ? 0.5 * value('length') : 0;
  const vector = fit.params['backgroundX'] !== undefined;
  const background = [value('backgroundX'), value('backgroundY'), value('backgroundZ')];
  const place = (point: Point) => {
    const position = point.position ?? { x: point.radial, y: 0, z: point.distance };
    coilFrame(position.x, position.y, position.z, centre, axis, frame);
    return { distance: Math.abs(frame[0]!) - shift, radial: frame[1]! };
  };
  const points: Point[] = [];
  if (!vector) {
    for (const point of fit.points) {
      const { position: _position, component: _component, ...rest } = point;
      points.push({ ...rest, ...place(point) });
    }
  } else {
    for (let i = 0; i + 2 < fit.points.length; i += 3) {
      const group = [fit.points[i]!, fit.points[i + 1]!, fit.points[i + 2]!];
      const field = Math.hypot(...group.map((p, c) => p.field - background[c]!));
      const predicted = Math.hypot(...group.map((p, c) => p.predicted - background[c]!));
      const sigma = group.every((p) => p.standardUncertainty !== null)
        ? Math.sqrt(group.reduce((sum, p) => sum + p.standardUncertainty! ** 2, 0) / 3) : null;
      const outlier = group.some((p) => p.outlier === true);
      points.push({
        line: group[0]!.line, ...place(group[0]!), field, predicted, residual: field - predicted, standardUncertainty: sigma,
        ...(group[0]!.outlier === undefined ? {} : { outlier }),
      });
    }
  }
  const add = [held('probeOffset', 'm', 0), ...(vector ? [held('background', 'T', 0)] : [])];
  return restated(fit, poseNames, add, points);
}
