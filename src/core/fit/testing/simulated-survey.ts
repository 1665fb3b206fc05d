import { getModel } from '../../models';
import type { ModelId, SurveyPoints } from '../../models/field-model';
import { mulberry32 } from '../../random/mulberry32';
import { normalRandom } from '../../random/normal-random';
import type { Reading, Survey } from '../../survey/survey';

/** What to simulate: a catalog model at known parameters, read at given distances with known noise. */
export interface SimulatedSurveyOptions {
  readonly model: ModelId;
  /** Parameters by name, SI (every parameter of the model). */
  readonly params: Readonly<Record<string, number>>;
  /** Stated distances, m. */
  readonly distances: readonly number[];
  /** Radial offsets, m (default 0 for every reading). */
  readonly radial?: readonly number[];
  /** Reading noise: σᵢ = relative·|Bᵢ| + absolute (T) of the true reading; default none. */
  readonly noise?: { readonly relative: number; readonly absolute: number };
  /** Standard deviation of the true position about the stated distance, m (default 0). */
  readonly positionNoise?: number;
  /** Seed of the mulberry32 stream. */
  readonly seed?: number;
  /** Write each reading's σ into the survey, as an uncertainty column would. */
  readonly statedUncertainty?: boolean;
  readonly fieldKind?: Survey['fieldKind'];
}

/**
 * A Survey generated from the model catalog (test support, not a fit): true readings
 * model.evaluate(θ) at the stated distances (moved by Gaussian position noise when asked),
 * plus Gaussian noise of standard deviation relative·|B| + absolute, seeded, so a test can
 * check what fits recover. Lines are numbered from 2 as after a header row.
 */
export function simulatedSurvey(options: SimulatedSurveyOptions): Survey {
  const model = getModel(options.model);
  const gaussian = normalRandom(mulberry32(options.seed ?? 1));
  const n = options.distances.length;
  const values = Float64Array.from(model.parameters, (p) => {
    const value = options.params[p.name];
    if (value === undefined) throw new RangeError(`simulatedSurvey: parameter ${p.name} of ${model.id} not given`);
    return value;
  });
  const position = options.positionNoise ?? 0;
  const truePoints: SurveyPoints = {
    n,
    distance: Float64Array.from(options.distances, (d) => d + position * gaussian()),
    radial: Float64Array.from({ length: n }, (_, i) => options.radial?.[i] ?? 0),
    field: new Float64Array(n),
    kind: options.fieldKind === 'axial' ? 'axial' : 'magnitude',
  };
  const truth = new Float64Array(n);
  model.evaluate(values, truePoints, truth);
  const readings: Reading[] = options.distances.map((distance, i) => {
    const sigma = options.noise ? options.noise.relative * Math.abs(truth[i]!) + options.noise.absolute : 0;
    const field = truth[i]! + sigma * gaussian();
    const reading: Reading = { line: i + 2, distance, radial: truePoints.radial[i]!, field };
    return options.statedUncertainty ? { ...reading, standardUncertainty: sigma } : reading;
  });
  return {
    source: `simulated ${model.id}`,
    coil: null,
    date: null,
    readingType: 'dc',
    fieldKind: options.fieldKind ?? 'magnitude',
    readings,
    rejected: [],
    totalRows: n,
    meta: {},
    notes: [],
  };
}

/** n distances evenly spaced from first to last (m). */
export function evenlySpaced(first: number, last: number, n: number): number[] {
  return Array.from({ length: n }, (_, i) => first + ((last - first) * i) / (n - 1));
}
