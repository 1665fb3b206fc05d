import { axisDirection, canonicalAxis, coilFrame } from '../physics/coil-pose';
import type { FieldModel, ModelId, ParameterSpec, SurveyPoints } from './field-model';
import { locateDipole } from './locate-dipole';
import { fieldReading } from './model-reading';
import { nearFaceModels } from './scan-model';

/** Catalog models that have an axis and a centre, fitted to 3-D maps with their pose. */
export const poseModelIds: readonly ModelId[] = ['loop', 'thick-coil', 'solenoid', 'coil-pair', 'dipole'];

/** The pose parameters, in the order they replace the probe offset. */
export const poseParameters: readonly ParameterSpec[] = [
  { name: 'centreX', unit: 'm', role: 'centre', lower: -Infinity, upper: Infinity, description: 'x of the coil\'s centre in the map\'s frame (winding plane on the axis, midpoint of a pair, mid-length of a solenoid)' },
  { name: 'centreY', unit: 'm', role: 'centre', lower: -Infinity, upper: Infinity, description: 'y of the coil\'s centre in the map\'s frame' },
  { name: 'centreZ', unit: 'm', role: 'centre', lower: -Infinity, upper: Infinity, description: 'z of the coil\'s centre in the map\'s frame' },
  { name: 'tilt', unit: 'rad', role: 'orientation', lower: -Infinity, upper: Infinity, description: 'angle of the coil\'s axis from the map\'s +z axis (0 to 90°: the axis and its opposite are one coil)' },
  { name: 'azimuth', unit: 'rad', role: 'orientation', lower: -Infinity, upper: Infinity, description: 'direction of the tilt, from the map\'s +x axis towards +y (−180° to 180°)' },
];

/** A vector map's uniform background field, one per component of the map's frame. */
export const vectorBackgroundParameters: readonly ParameterSpec[] = ['X', 'Y', 'Z'].map((axis) => ({
  name: `background${axis}`, unit: 'T' as const, role: 'background' as const, lower: -Infinity, upper: Infinity,
  description: `uniform background field along the map's ${axis.toLowerCase()} axis (Earth, offset of the meter's ${axis.toLowerCase()} sensor)`,
}));

/** Names of the parameters that place a coil in a map (not the coil's own). */
export const poseParameterNames: ReadonlySet<string> = new Set(poseParameters.map((p) => p.name));

const caches = { magnitude: new WeakMap<FieldModel, FieldModel>(), vector: new WeakMap<FieldModel, FieldModel>() };

/**
 * An axisymmetric catalog model fitted to a 3-D map (Survey.axis 'map'): readings at
 * points (x, y, z) of the map's frame, each a magnitude |B| or one component of B along
 * the map's x, y or z axis (points.map.component). The model's `probeOffset` is replaced
 * by the pose — centreX, centreY, centreZ (m) and the axis's tilt and azimuth (rad,
 * physics/coil-pose.ts) — and, for vector readings (`vector`), its `background` by a
 * uniform background vector (backgroundX, backgroundY, backgroundZ; T). Each point is
 * taken into the coil's cylinder coordinates (u, ρ); the model's own components at
 * distance |u| from its centre (probe offset −length/2 for a near-face model, as in
 * scanModel) give B_z and B_ρ, B_ρ odd in u, and B = B_z n + B_ρ ρ̂ is read as a
 * component or a magnitude.
 *
 * Jacobian: none here — the engine's central differences (every column costs two
 * evaluations; the pose enters through the geometry only).
 *
 * Initial guess (poseStart): the axis along the field at the strongest reading (vector
 * readings) or along +z (magnitude), the centre on the line through that reading along
 * the axis at the offset whose model start fits best.
 *
 * Canonical parameters: tilt in [0, 90°], azimuth in (−180°, 180°]; an axis turned over
 * (n → −n) reverses the amplitude's sign for vector readings (physics/coil-pose.ts
 * canonicalAxis).
 *
 * @throws RangeError for a model without an axis (rectangle, power laws).
 */
export function poseModel(base: FieldModel, vector: boolean): FieldModel {
  const cache = vector ? caches.vector : caches.magnitude;
  const cached = cache.get(base);
  if (cached !== undefined) return cached;
  if (!poseModelIds.includes(base.id) || base.components === undefined) throw new RangeError(`poseModel: model "${base.id}" has no axis to pose`);
  const components = base.components;
  const offsetIndex = base.parameters.findIndex((p) => p.role === 'offset');
  const backgroundIndex = base.parameters.findIndex((p) => p.role === 'background');
  const lengthIndex = nearFaceModels.has(base.id) ? base.parameters.findIndex((p) => p.name === 'length') : -1;
  // Model order: the base's parameters, with the probe offset replaced by the pose and (vector) the background by three.
  const parameters: ParameterSpec[] = [];
  const source: number[] = [];
  base.parameters.forEach((spec, j) => {
    if (j === offsetIndex) parameters.push(...poseParameters);
    else if (j === backgroundIndex && vector) parameters.push(...vectorBackgroundParameters);
    else {
      parameters.push(spec);
      source.push(j, parameters.length - 1);
    }
  });
  const pose = parameters.findIndex((p) => p.name === 'centreX');
  const backgrounds = vector ? parameters.findIndex((p) => p.name === 'backgroundX') : parameters.findIndex((p) => p.name === 'background');
  const amplitudes = parameters.flatMap((p, j) => (p.role === 'amplitude' ? [j] : []));
  const inner = new Float64Array(base.parameters.length);
  const axis = new Float64Array(3);
  const frame = new Float64Array(5);
  const field = new Float64Array(2);
  const b = new Float64Array(3);
  const innerParams = (params: Float64Array): Float64Array => {
    for (let s = 0; s < source.length; s += 2) inner[source[s]!] = params[source[s + 1]!]!;
    inner[offsetIndex] = lengthIndex >= 0 ? -0.5 * inner[lengthIndex]! : 0;
    if (backgroundIndex >= 0) inner[backgroundIndex] = 0;
    return inner;
  };
  const model: FieldModel = {
    id: base.id,
    label: base.label,
    physical: base.physical,
    parameters,
    evaluate(params: Float64Array, points: SurveyPoints, out: Float64Array): void {
      const map = points.map;
      const coil = innerParams(params);
      if (map === undefined) {
        // points in the coil's own frame (distance = axial coordinate from the centre): the far-field moment, curves
        for (let i = 0; i < points.n; i++) {
          components.call(base, coil, Math.abs(points.distance[i]!), points.radial[i]!, field);
          out[i] = fieldReading(points.kind, field[0]!, field[1]!) + (backgrounds >= 0 && !vector ? params[backgrounds]! : 0);
        }
        return;
      }
      const centre = params.subarray(pose, pose + 3);
      axisDirection(params[pose + 3]!, params[pose + 4]!, axis);
      let lastX = Number.NaN;
      let lastY = Number.NaN;
      let lastZ = Number.NaN;
      for (let i = 0; i < points.n; i++) {
        const x = map.x[i]!;
        const y = map.y[i]!;
        const z = map.z[i]!;
        if (x !== lastX || y !== lastY || z !== lastZ) {
          // the three components of one vector reading share one evaluation
          coilFrame(x, y, z, centre, axis, frame);
          const u = frame[0]!;
          components.call(base, coil, Math.abs(u), frame[1]!, field);
          const radial = u < 0 ? -field[1]! : field[1]!;
          b[0] = field[0]! * axis[0]! + radial * frame[2]!;
          b[1] = field[0]! * axis[1]! + radial * frame[3]!;
          b[2] = field[0]! * axis[2]! + radial * frame[4]!;
          lastX = x;
          lastY = y;
          lastZ = z;
        }
        const c = map.component[i]!;
        if (c < 0) out[i] = Math.sqrt(b[0]! * b[0]! + b[1]! * b[1]! + b[2]! * b[2]!) + (backgrounds >= 0 ? params[backgrounds]! : 0);
        else out[i] = b[c]! + (backgrounds < 0 ? 0 : vector ? params[backgrounds + c]! : params[backgrounds]!);
      }
    },
    components(params: Float64Array, distance: number, radial: number, out: Float64Array): void {
      // in the coil's own frame: distance is the axial coordinate from the centre
      components.call(base, innerParams(params), Math.abs(distance), radial, out);
      if (distance < 0) out[1] = -out[1]!;
    },
    initialGuess(points: SurveyPoints): Float64Array {
      return poseStart(model, base, points, { pose, backgrounds, vector, offsetIndex, source });
    },
    canonicalParameters(params: Float64Array, _points: SurveyPoints, fixed: readonly boolean[]): boolean {
      if (fixed[pose + 3] === true || fixed[pose + 4] === true) return false;
      const [tilt, azimuth, flipped] = canonicalAxis(params[pose + 3]!, params[pose + 4]!);
      if (flipped && vector && amplitudes.some((j) => fixed[j] === true)) return false;
      const changed = tilt !== params[pose + 3] || azimuth !== params[pose + 4];
      params[pose + 3] = tilt;
      params[pose + 4] = azimuth;
      if (flipped && vector) for (const j of amplitudes) params[j] = -params[j]!;
      return changed;
    },
  };
  cache.set(base, model);
  return model;
}

interface PoseLayout {
  readonly pose: number;
  readonly backgrounds: number;
  readonly vector: boolean;
  readonly offsetIndex: number;
  /** Pairs (base index, pose-model index) of the coil's own parameters. */
  readonly source: readonly number[];
}

/** Most readings the start looks at (an even subsample of a larger map). */
const START_READINGS = 160;

/**
 * Data-driven start of a pose fit, on an even subsample of at most 160 readings (the
 * components of one vector reading share a position and stay together). Axis candidates:
 * along the moment of the best point dipole (locate-dipole.ts, whose position is also a
 * candidate centre), along the field at the strongest reading and along the sum of all
 * field vectors (vector readings; the axis and its opposite are one coil), and the map's +z tilted a little
 * (|B| cannot show the axis's direction at one point). For each, the centre is sought on
 * the lines through the strongest reading and through the |B|²-weighted centroid of the
 * readings above half the strongest, along that axis, at offsets s = 0 and ± a
 * log-spaced 2 %…100 % of the map's extent: the readings are folded into the coil's
 * (|u|, ρ) as a distance survey of magnitudes, the model's own initialGuess gives its
 * parameters, and the candidate whose prediction leaves the smallest squared misfit (the
 * best amplitude factor, and for magnitudes the background, solved in closed form) is kept.
 * Last, about that centre, tilts of 0.05, 0.3, 0.6 and 1 rad in four azimuths are tried
 * (the only direction search a magnitude map gets).
 */
function poseStart(model: FieldModel, base: FieldModel, points: SurveyPoints, layout: PoseLayout): Float64Array {
  const sample = mapSample(points, START_READINGS);
  const map = sample.map!;
  const groups = readingGroups(sample);
  const positions: number[] = [];
  const magnitudes: number[] = [];
  const vectors: number[] = [];
  const sum = [0, 0, 0];
  for (let g = 0; g < groups.length; g += 2) {
    const v = [0, 0, 0];
    let magnitude = Number.NaN;
    for (let i = groups[g]!; i < groups[g + 1]!; i++) {
      const c = map.component[i]!;
      if (c < 0) magnitude = Math.abs(sample.field[i]!);
      else v[c] = sample.field[i]!;
    }
    const first = groups[g]!;
    positions.push(map.x[first]!, map.y[first]!, map.z[first]!);
    vectors.push(...v);
    magnitudes.push(Number.isNaN(magnitude) ? Math.hypot(v[0]!, v[1]!, v[2]!) : magnitude);
  }
  const count = magnitudes.length;
  let peak = 0;
  for (let r = 1; r < count; r++) if (magnitudes[r]! > magnitudes[peak]!) peak = r;
  // the field vectors summed with their signs made to agree with the strongest one's
  for (let r = 0; r < count; r++) {
    const agree = vectors[3 * r]! * vectors[3 * peak]! + vectors[3 * r + 1]! * vectors[3 * peak + 1]! + vectors[3 * r + 2]! * vectors[3 * peak + 2]! < 0 ? -1 : 1;
    for (let k = 0; k < 3; k++) sum[k] = sum[k]! + agree * vectors[3 * r + k]!;
  }
  let extent = 0;
  for (let r = 0; r < count; r++) {
    extent = Math.max(extent, Math.hypot(positions[3 * r]! - positions[3 * peak]!, positions[3 * r + 1]! - positions[3 * peak]!, positions[3 * r + 2]! - positions[3 * peak]!));
  }
  if (!(extent > 0)) extent = 0.05;
  const directions: [number, number][] = [[0.05, 0]];
  const anchors = [positions.slice(3 * peak, 3 * peak + 3)];
  if (layout.vector) {
    // the best point dipole (centre and moment, linear in the moment): the centre and axis of the coil, roughly
    const dipole = locateDipole(positions, vectors);
    if (dipole !== null) {
      anchors.push(dipole.centre);
      const [mx, my, mz] = dipole.moment;
      const size = Math.hypot(mx, my, mz);
      if (size > 0) directions.unshift([Math.acos(Math.max(-1, Math.min(1, mz / size))), Math.atan2(my, mx)]);
    }
    for (const v of [vectors.slice(3 * peak, 3 * peak + 3), sum]) {
      const size = Math.hypot(v[0]!, v[1]!, v[2]!);
      if (size > 0) directions.push([Math.acos(Math.max(-1, Math.min(1, v[2]! / size))), Math.atan2(v[1]!, v[0]!)]);
    }
  }
  const axis = new Float64Array(3);
  const frame = new Float64Array(5);
  const distance = new Float64Array(count);
  const radial = new Float64Array(count);
  const folded: SurveyPoints = { n: count, distance, radial, field: Float64Array.from(magnitudes), kind: 'magnitude' };
  const predicted = new Float64Array(sample.n);
  const offsets = [0];
  for (let s = 0; s < 7; s++) {
    const step = extent * 0.02 * 50 ** (s / 6);
    offsets.push(step, -step);
  }
  let best: Float64Array | null = null;
  let bestCost = Infinity;
  const start = new Float64Array(model.parameters.length);
  const amplitudes = amplitudeIndices(model);
  // lines through the strongest reading and through the |B|²-weighted centroid of the readings above half the peak
  const centroid = [0, 0, 0];
  let weights = 0;
  for (let r = 0; r < count; r++) {
    if (!(magnitudes[r]! >= 0.5 * magnitudes[peak]!)) continue;
    const w = magnitudes[r]! ** 2;
    weights += w;
    for (let k = 0; k < 3; k++) centroid[k] = centroid[k]! + w * positions[3 * r + k]!;
  }
  anchors.push(centroid.map((v) => v / weights));
  // keep `start` (amplitude scaled, background set) when it fits the sample better than the best so far
  const consider = (): void => {
    model.evaluate(start, sample, predicted);
    const cost = scaledMisfit(sample, predicted, layout.vector);
    if (cost.misfit < bestCost) {
      bestCost = cost.misfit;
      for (const j of amplitudes) start[j] = start[j]! * cost.scale;
      if (layout.backgrounds >= 0 && !layout.vector) start[layout.backgrounds] = cost.offset;
      best = Float64Array.from(start);
    }
  };
  for (const [tilt, azimuth] of directions) {
    axisDirection(tilt, azimuth, axis);
    for (const anchor of anchors) for (const s of offsets) {
      const centre = [anchor[0]! - s * axis[0]!, anchor[1]! - s * axis[1]!, anchor[2]! - s * axis[2]!];
      for (let r = 0; r < count; r++) {
        coilFrame(positions[3 * r]!, positions[3 * r + 1]!, positions[3 * r + 2]!, centre, axis, frame);
        distance[r] = Math.abs(frame[0]!);
        radial[r] = frame[1]!;
      }
      const guess = base.initialGuess(folded);
      if (!guess.every(Number.isFinite)) continue;
      start.fill(0);
      for (let k = 0; k < layout.source.length; k += 2) start[layout.source[k + 1]!] = guess[layout.source[k]!]!;
      start.set(centre, layout.pose);
      start[layout.pose + 3] = tilt;
      start[layout.pose + 4] = azimuth;
      consider();
    }
  }
  if (best !== null) {
    // then the axis's direction from the best start: tilts 0.05, 0.3, 0.6 and 1 rad in four azimuths (about the centre found)
    const centred = Float64Array.from(best);
    for (const tilt of [0.05, 0.3, 0.6, 1]) {
      for (const azimuth of [0, Math.PI / 2, Math.PI, -Math.PI / 2]) {
        start.set(centred);
        start[layout.pose + 3] = tilt;
        start[layout.pose + 4] = azimuth;
        consider();
      }
    }
  }
  if (best === null) {
    best = new Float64Array(model.parameters.length);
    best.set([positions[3 * peak]!, positions[3 * peak + 1]!, positions[3 * peak + 2]!, 0.05, 0], layout.pose);
    for (const j of amplitudes) best[j] = 1;
  }
  return best;
}

/**
 * An even subsample of a map's points: every k-th reading (the points of one vector
 * reading share a position and stay together), at most `readings` readings; the points
 * themselves when they have no more.
 */
export function mapSample(points: SurveyPoints, readings: number): SurveyPoints {
  const map = points.map;
  if (map === undefined) return points;
  const groups = readingGroups(points);
  const stride = Math.ceil(groups.length / 2 / readings);
  if (stride <= 1) return points;
  const kept: number[] = [];
  for (let g = 0; g < groups.length; g += 2 * stride) for (let i = groups[g]!; i < groups[g + 1]!; i++) kept.push(i);
  const pick = (array: Float64Array) => Float64Array.from(kept, (i) => array[i]!);
  return {
    n: kept.length, distance: pick(points.distance), radial: pick(points.radial), field: pick(points.field), kind: points.kind,
    map: { x: pick(map.x), y: pick(map.y), z: pick(map.z), component: Int8Array.from(kept, (i) => map.component[i]!) },
  };
}

/** [first, end) point index pairs of each reading of a map (consecutive points at one position). */
function readingGroups(points: SurveyPoints): number[] {
  const map = points.map!;
  const groups: number[] = [];
  for (let i = 0; i < points.n;) {
    let j = i + 1;
    while (j < points.n && map.x[j] === map.x[i] && map.y[j] === map.y[i] && map.z[j] === map.z[i]) j++;
    groups.push(i, j);
    i = j;
  }
  return groups;
}

function amplitudeIndices(model: FieldModel): number[] {
  return model.parameters.flatMap((p, j) => (p.role === 'amplitude' ? [j] : []));
}

/** Least squares of y ≈ a·f + b (b only for magnitudes): the misfit left, a and b. */
function scaledMisfit(points: SurveyPoints, predicted: Float64Array, vector: boolean): { misfit: number; scale: number; offset: number } {
  const n = points.n;
  let sf = 0;
  let sy = 0;
  let sff = 0;
  let sfy = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const f = predicted[i]!;
    const y = points.field[i]!;
    if (!Number.isFinite(f)) return { misfit: Infinity, scale: 1, offset: 0 };
    sf += f;
    sy += y;
    sff += f * f;
    sfy += f * y;
    syy += y * y;
  }
  if (vector) {
    const scale = sff > 0 ? sfy / sff : 1;
    return { misfit: syy - scale * sfy, scale, offset: 0 };
  }
  const det = n * sff - sf * sf;
  const scale = det > 0 ? (n * sfy - sf * sy) / det : 1;
  const offset = (sy - scale * sf) / n;
  let misfit = 0;
  for (let i = 0; i < n; i++) misfit += (points.field[i]! - scale * predicted[i]! - offset) ** 2;
  return { misfit, scale, offset };
}
