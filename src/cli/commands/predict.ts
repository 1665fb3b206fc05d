import type { Command } from 'commander';
import { isRingfallError, RingfallError } from '../../core/errors';
import { exampleValue, getModel, isSurveyParameter, parameterQuantityKind, parseParameterAssignment, predictField } from '../../core/models';
import type { FieldModel, ModelId } from '../../core/models';
import { formatNumber, formatQuantity, parseQuantity } from '../../core/units';
import type { JsonPrediction } from '../../core/report/json-types';
import type { CommandContext } from './command-context';
import { renderRunText } from '../../core/report/render-text';
import type { RunRecord } from '../../core/report/run-record';
import { cliRunRecord, runTime } from '../run-record';

interface PredictFlags {
  model: string;
  set: string[];
  at: string;
  radial: string;
  json?: boolean;
}

/** The field of a model at one point, SI. */
export interface Prediction {
  readonly model: FieldModel;
  readonly params: Float64Array;
  readonly distance: number;
  readonly radial: number;
  /** |B| of the source plus the background parameter (what a magnitude meter reads), T. */
  readonly field: number;
  /** Axial and radial components of the source alone, T. */
  readonly axial: number;
  readonly radialComponent: number;
}

/** Where each model's distance is measured from (DESIGN.md conventions), for people. */
const datum: Readonly<Record<ModelId, string>> = {
  'loop': 'from the winding plane',
  'thick-coil': 'from the near face of the winding',
  'solenoid': 'from the near face of the winding',
  'coil-pair': 'from the midpoint between the coils',
  'rectangle': 'from the winding plane',
  'dipole': 'from the dipole',
  'power-law': 'from the datum',
  'inverse-square': 'from the datum',
  'inverse-cube': 'from the datum',
};

const collect = (value: string, previous: string[]): string[] => [...previous, value];

/**
 * `ringfall predict --model ID --set NAME=QTY... --at DIST [--radial RHO] [--json]`: the
 * forward field of a catalog model at one point (CONTRACT.md). JSON: `{ field, components:
 * { axial, radial }, model, point, params }`, all SI with units.
 */
export function registerPredict(program: Command, _context: CommandContext): void {
  program
    .command('predict')
    .description('forward field of a coil at a point')
    .requiredOption('--model <id>', 'coil model (catalog id, e.g. loop)')
    .option('--set <name=qty>', 'a parameter value, e.g. radius=50mm (repeatable)', collect, [])
    .requiredOption('--at <distance>', 'distance along the axis from the model\'s datum, e.g. 10mm')
    .option('--radial <offset>', 'radial offset from the axis, e.g. 20mm', '0mm')
    .option('--json', 'print JSON (SI units) instead of text')
    .action((flags: PredictFlags) => {
      const time = runTime();
      const prediction = predictFromFlags(flags);
      const run = predictionRun(prediction, time);
      process.stdout.write(flags.json ? `${JSON.stringify({ run, ...predictionToJson(prediction) }, null, 2)}\n` : `${renderPrediction(prediction)}\n${renderRunText(run)}`);
    });
}

/**
 * Turn the flags into a prediction. Exported for tests.
 * @throws RingfallError `MODEL_UNKNOWN`, `PARAMETER_*`, `QUANTITY_*`, `PREDICT_MISSING`
 *   (a required parameter not set), `PREDICT_TWICE`, `PREDICT_SINGULAR` (on the winding)
 */
export function predictFromFlags(flags: PredictFlags): Prediction {
  const model = getModel(flags.model, '--model');
  const params = new Float64Array(model.parameters.length);
  const given = new Set<string>();
  for (const text of flags.set) {
    const { index, name, value } = parseParameterAssignment(model, text, '--set');
    if (given.has(name)) {
      throw new RingfallError('PREDICT_TWICE', `--set: ${name} is set twice. Give each parameter once.`, { value: text, where: '--set' });
    }
    given.add(name);
    params[index] = value;
  }
  const missing = model.parameters.filter((p) => !given.has(p.name) && !isSurveyParameter(p));
  if (missing.length > 0) {
    const first = missing[0]!;
    throw new RingfallError(
      'PREDICT_MISSING',
      `--set: the ${model.id} model needs ${missing.map((p) => p.name).join(', ')}. Pass ${missing.map((p) => `--set ${p.name}=${p === first ? exampleValue(p.unit) : '…'}`).join(' ')}.`,
      { value: missing.map((p) => p.name), where: '--set' },
    );
  }
  const distance = parseQuantity(flags.at, 'length', '--at').value;
  const radial = parseQuantity(flags.radial, 'length', '--radial').value;
  const assigned = Object.fromEntries(model.parameters.map((p, j) => [p.name, params[j]!]));
  let prediction;
  try {
    prediction = predictField(model.id, assigned, { distance, radial });
  } catch (error) {
    if (!isRingfallError(error, 'PREDICT_SINGULAR')) throw error;
    throw new RingfallError(
      'PREDICT_SINGULAR',
      `Point: the ${model.id} field is undefined at ${flags.at} along the axis, ${flags.radial} off it (on the winding, or at the source itself). Move the point off the winding.`,
      { value: [distance, radial], where: '--at', cause: error },
    );
  }
  const { field, axial, radial: radialComponent } = prediction;
  return { model, params, distance, radial, field, axial, radialComponent };
}

const si = <Unit extends string>(value: number, unit: Unit) => ({ value, unit });

/** The run record of a prediction: no input files; the model, its parameters and the point. */
function predictionRun(prediction: Prediction, time: string): RunRecord {
  return cliRunRecord('predict', time, [], {
    model: prediction.model.id,
    parameters: Object.fromEntries(prediction.model.parameters.map((p, j) => [p.name, si(prediction.params[j]!, p.unit)])),
    distance: si(prediction.distance, 'm'),
    radialOffset: si(prediction.radial, 'm'),
  });
}

/** The JSON form of CONTRACT.md (`field`, `components.axial`, `components.radial`) plus the inputs. */
export function predictionToJson(prediction: Prediction): JsonPrediction {
  return {
    field: si(prediction.field, 'T'),
    components: { axial: si(prediction.axial, 'T'), radial: si(prediction.radialComponent, 'T') },
    model: prediction.model.id,
    point: { distance: si(prediction.distance, 'm'), radial: si(prediction.radial, 'm') },
    params: Object.fromEntries(prediction.model.parameters.map((p, j) => [p.name, si(prediction.params[j]!, p.unit)])),
  };
}

/** Text for people: the field in mT/µT/nT and in gauss, with the point and parameters restated. */
export function renderPrediction(prediction: Prediction): string {
  const { model, params } = prediction;
  const parameterText = model.parameters.map((p, j) => {
    const kind = parameterQuantityKind(p.unit);
    const value = params[j]!;
    if (kind !== null && value !== 0) return `${p.name} ${formatQuantity(value, kind)}`;
    return `${p.name} ${formatNumber(value, 4)}${p.unit === '1' ? '' : ` ${kind === 'length' ? 'mm' : p.unit}`}`;
  }).join(', ');
  const gauss = (value: number) => formatQuantity(value, 'field', { unit: Math.abs(value) >= 1e-4 ? { symbol: 'G', factor: 1e-4 } : { symbol: 'mG', factor: 1e-7 } });
  const line = (label: string, value: number) => `  ${label.padEnd(22)}${formatQuantity(value, 'field').padStart(12)}   (${gauss(value)})\n`;
  const background = params[model.parameters.findIndex((p) => p.role === 'background')] ?? 0;
  return (
    `${model.id}: ${model.label}\n` +
    `  ${parameterText}\n` +
    `Point: ${lengthText(prediction.distance)} along the axis ${datum[model.id]}, ` +
    `${lengthText(prediction.radial)} off the axis\n` +
    line(background === 0 ? 'field |B|' : 'field |B| + background', prediction.field) +
    (model.physical
      ? line('axial component B_z', prediction.axial) + line('radial component B_ρ', prediction.radialComponent)
      : `  (a power law has no direction; its value ${formatQuantity(prediction.axial, 'field')} is reported as the axial component)\n`)
  );
}

/** A length for people; zero reads "0 mm" rather than the smallest unit of the ladder. */
function lengthText(value: number): string {
  return value === 0 ? '0 mm' : formatQuantity(value, 'length');
}
