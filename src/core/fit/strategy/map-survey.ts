import type { FieldModel, ModelId, SurveyPoints } from '../../models/field-model';
import { getModel } from '../../models';
import { lateralModel } from '../../models/lateral-model';
import { mapSample, poseModel, poseModelIds } from '../../models/pose-model';
import { scanModel } from '../../models/scan-model';
import type { Reading, Survey } from '../../survey/survey';
import { fieldModelProblem } from './field-model-problem';
import type { FitResult } from '../fit-result';
import { fitLeastSquares } from '../engine/least-squares';
import { surveyPoints } from './survey-points';

const componentNames = ['x', 'y', 'z'] as const;

/** True when a 3-D map's readings are vectors (Bx, By, Bz given): three residuals per reading. */
export function isVectorMap(survey: Survey): boolean {
  return survey.axis === 'map' && survey.fieldKind === 'components' && survey.readings.every((r) => r.components !== undefined);
}

/**
 * What a survey is fitted as: the readings the engine sees (a vector map's reading becomes
 * three, one per component of the map's frame, each with the reading's line, position and
 * uncertainty), their points, and each asked catalog model wrapped for the survey's frame —
 * scanModel for signed axial positions, lateralModel for a transverse scan (both for a
 * grid), poseModel for a 3-D map. A map leaves out the models without an axis (rectangle,
 * power laws; `omitted`).
 */
export function surveyProblem(survey: Survey, ids: readonly ModelId[]): {
  readonly survey: Survey;
  readonly points: SurveyPoints;
  readonly models: readonly FieldModel[];
  readonly omitted: readonly ModelId[];
} {
  if (survey.axis !== 'map') {
    const models = ids.map((id) => {
      const axial = survey.axis === 'position' ? scanModel(getModel(id)) : getModel(id);
      return survey.lateral === 'position' ? lateralModel(axial) : axial;
    });
    return { survey, points: surveyPoints(survey), models, omitted: [] };
  }
  const vector = isVectorMap(survey);
  const expanded = vector ? { ...survey, readings: survey.readings.flatMap(componentReadings) } : survey;
  const readings = expanded.readings;
  const n = readings.length;
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  const z = new Float64Array(n);
  const component = new Int8Array(n);
  const field = new Float64Array(n);
  let cx = 0;
  let cy = 0;
  let cz = 0;
  for (let i = 0; i < n; i++) {
    const reading = readings[i]!;
    const position = reading.position ?? { x: reading.radial, y: 0, z: reading.distance };
    x[i] = position.x;
    y[i] = position.y;
    z[i] = position.z;
    cx += position.x / n;
    cy += position.y / n;
    cz += position.z / n;
    field[i] = reading.field;
    component[i] = vector ? i % 3 : survey.fieldKind === 'magnitude' ? -1 : 2;
  }
  // distance from the map's centroid stands in for the engine's sense of the survey's size
  const distance = new Float64Array(n);
  for (let i = 0; i < n; i++) distance[i] = Math.hypot(x[i]! - cx, y[i]! - cy, z[i]! - cz);
  const points: SurveyPoints = { n, distance, radial: new Float64Array(n), field, kind: survey.fieldKind === 'axial' ? 'axial' : 'magnitude', map: { x, y, z, component } };
  const kept = ids.filter((id) => poseModelIds.includes(id));
  return { survey: expanded, points, models: kept.map((id) => stagedStart(poseModel(getModel(id), vector))), omitted: ids.filter((id) => !poseModelIds.includes(id)) };
}

/** Readings of the sub-fit that starts a large map's fit. */
const STAGE_READINGS = 160;

const staged = new WeakMap<FieldModel, FieldModel>();

/**
 * A pose model whose start, on a map of more than 160 readings, is first fitted to an even
 * subsample of 160 (mapSample): the pose start is rough, and on the subsample the search
 * from it costs a fraction of what it costs on every reading; the full fit then starts
 * near its minimum. Smaller maps start from the pose start itself. The same object for
 * the same model.
 */
function stagedStart(model: FieldModel): FieldModel {
  const cached = staged.get(model);
  if (cached !== undefined) return cached;
  const wrapped: FieldModel = {
    ...model,
    initialGuess(points: SurveyPoints): Float64Array {
      const start = model.initialGuess(points);
      const sample = mapSample(points, STAGE_READINGS);
      if (sample === points) return start;
      const solution = fitLeastSquares(fieldModelProblem(model, sample), { initial: start, lower: model.parameters.map((p) => p.lower), upper: model.parameters.map((p) => p.upper) });
      return solution.params.every(Number.isFinite) ? Float64Array.from(solution.params) : start;
    },
  };
  staged.set(model, wrapped);
  return wrapped;
}

/** A vector reading as three, one per component (field = that component, T). */
function componentReadings(reading: Reading): Reading[] {
  const c = reading.components!;
  return [c.x, c.y, c.z].map((value) => ({ ...reading, field: value }));
}

/**
 * A map fit's points with each reading's position and (vector map) component added, and
 * the pose read near its singularity: when the tilt's 95 % interval reaches 0 the axis
 * cannot be told from the map's z, so the azimuth (the direction of a tilt that may be
 * none) is reported as not determined, with a warning, and the tilt's interval starts at 0
 * (tilt ≥ 0 by definition).
 */
export function withMapPoints(fit: FitResult, fitted: Survey, vector: boolean): FitResult {
  const tilt = fit.params['tilt'];
  const azimuth = fit.params['azimuth'];
  const upright = tilt !== undefined && azimuth !== undefined && !azimuth.fixed && tilt.ci95 !== null && tilt.ci95[0] <= 0;
  return {
    ...fit,
    ...(upright ? {
      params: {
        ...fit.params,
        tilt: { ...tilt, ci95: [0, tilt.ci95![1]] as const },
        azimuth: { ...azimuth, stderr: null, ci95: null, determined: false },
      },
      warnings: [...fit.warnings, `The coil's axis cannot be told from the map's z axis (tilt ${(tilt.value * 180 / Math.PI).toPrecision(2)}°, its interval reaching 0°), so azimuth, the direction of the tilt, is not determined and has no interval; read the axis as along z within the tilt's interval.`],
    } : {}),
    points: fit.points.map((point, i) => {
      const position = fitted.readings[i]?.position;
      return { ...point, ...(position === undefined ? {} : { position }), ...(vector ? { component: componentNames[i % 3]! } : {}) };
    }),
  };
}

/** The report's sentence on models a 3-D map leaves out, or none. */
export function omittedModelNote(omitted: readonly ModelId[]): string[] {
  if (omitted.length === 0) return [];
  return [`Not fitted to this 3-D map: ${omitted.join(', ')} (no axis to place in space); the map fits loop, thick-coil, solenoid, coil-pair and dipole with their pose.`];
}
