import { getModel, scanModel, type ModelId } from '../../src/core/models';

/**
 * The reading a catalog model predicts (src/core/models, getModel(id).evaluate) at one
 * probe position, for the sample-data generator. Parameters by name, SI (A, m, T); the
 * model adds the probe offset and the background itself (DESIGN.md conventions).
 *
 * Parameters with `centre` and no `probeOffset` are a scan's (scanModel): the reading at a
 * signed ruler position along the axis, the coil centred at `centre` on that ruler.
 *
 * @param kind 'axial' for a signed single-axis reading B_z, 'magnitude' for |B|
 * @returns a function of the ruler distance (or position) and radial offset (m) giving the reading (T)
 */
export function catalogReading(
  id: ModelId,
  params: Readonly<Record<string, number>>,
  kind: 'axial' | 'magnitude',
): (distance: number, radial?: number) => number {
  const scan = params['centre'] !== undefined && params['probeOffset'] === undefined;
  const model = scan ? scanModel(getModel(id)) : getModel(id);
  const vector = Float64Array.from(model.parameters.map((parameter) => {
    const value = params[parameter.name];
    if (value === undefined) throw new TypeError(`catalogReading(): no value for ${id} parameter ${parameter.name}`);
    return value;
  }));
  const points = { n: 1, distance: new Float64Array(1), radial: new Float64Array(1), field: new Float64Array(1), kind };
  const out = new Float64Array(1);
  return (distance, radial = 0) => {
    points.distance[0] = distance;
    points.radial[0] = radial;
    model.evaluate(vector, points, out);
    return out[0] as number;
  };
}
