import type { Command } from 'commander';
import { parseThresholdLevel, type ThresholdLevel } from '../core/analysis/thresholds/threshold-level';
import { RingfallError } from '../core/errors';
import { defaultModels, type FitSurveyOptions } from '../core/fit/fit-survey-options';
import type { RobustLoss } from '../core/fit/strategy/robust-fit';
import { getModel, parseParameterAssignment, scanModel } from '../core/models';
import type { FieldModel, ModelId } from '../core/models';
import { lookupUnit, parseQuantity, parseRelativePlusAbsolute, unitsOfKind } from '../core/units';

/** Options of `ringfall fit` (and `batch`), typed and in SI, ready for core. */
export interface FitCommandOptions {
  /** For fitSurvey: models, fixed parameters, uncertainties, robust loss, seed. */
  readonly fit: FitSurveyOptions & { readonly models: readonly ModelId[] };
  /** For importSurveys: units of headers that state none (`--field-unit`, `--distance-unit`). */
  readonly import: { readonly fieldUnit?: string; readonly distanceUnit?: string };
  readonly json: boolean;
  /** `--spec FILE`, or null. */
  readonly spec: string | null;
  /** `--threshold QTY|PRESET` levels, in the order given. */
  readonly thresholds: readonly ThresholdLevel[];
  /** `--html FILE`, `--csv FILE`, or null. */
  readonly html: string | null;
  readonly csv: string | null;
}

/** Commander's parsed flags for the options {@link addFitOptions} declares. */
export interface FitFlags {
  readonly model?: string[];
  readonly fix?: string[];
  readonly uncertainty?: string;
  readonly positionUncertainty?: string;
  readonly distanceUnit?: string;
  readonly fieldUnit?: string;
  readonly json?: boolean;
  readonly robust?: string;
  readonly seed?: string;
  readonly allStarts?: boolean;
  readonly spec?: string;
  readonly threshold?: string[];
  readonly html?: string;
  readonly csv?: string;
}

const collect = (value: string, previous: string[] | undefined): string[] => [...(previous ?? []), value];

/**
 * Declare the fitting options of CONTRACT.md on a command (`fit` and `batch`):
 * --model, --fix, --uncertainty, --position-uncertainty, --distance-unit, --field-unit,
 * --json, --robust, --seed, --all-starts, --spec, --threshold, --html, --csv.
 */
export function addFitOptions(command: Command): Command {
  return command
    .option('--model <ids>', `models to fit, comma-separated (default ${defaultModels.join(',')})`, collect)
    .option('--fix <name=qty>', 'hold a parameter at a value, e.g. radius=45mm (repeatable)', collect)
    .option('--uncertainty <rel%+abs>', 'standard uncertainty of one reading, e.g. 1.5%+2µT')
    .option('--position-uncertainty <qty>', 'standard uncertainty of each distance, e.g. 0.5mm')
    .option('--distance-unit <unit>', 'unit of distance columns whose header states none (mm, cm, m, in)')
    .option('--field-unit <unit>', 'unit of field columns whose header states none (mT, µT, G, …)')
    .option('--json', 'print the JSON report (SI units) instead of text')
    .option('--robust <loss>', 'robust loss that flags outliers: huber or soft-l1')
    .option('--seed <n>', 'seed of the multi-start (same seed, same report)', '1')
    .option('--all-starts', 'run every extra start of every model (the data-driven one and 8 seeded) instead of stopping once the fit is settled or two agree (slower; can find a lower minimum for models that do not describe the readings)')
    .option('--spec <file>', 'check against a spec file')
    .option('--threshold <qty|preset>', 'report where the field falls below this level, e.g. 0.5mT or implant-static (repeatable)', collect)
    .option('--html <file>', 'also write a self-contained HTML report')
    .option('--csv <file>', 'also write each reading with every model\'s prediction and residual as CSV');
}

/**
 * Turn commander's flags into typed options in SI, checking everything a user can get
 * wrong before any file is read.
 *
 * @throws RingfallError `MODEL_UNKNOWN`; `FIT_UNKNOWN_PARAMETER` (a --fix name no chosen
 *   model has, naming the valid ones); `PARAMETER_SYNTAX`, `PARAMETER_VALUE` and the
 *   `QUANTITY_*` codes for a bad --fix; `OPTION_TWICE` (a parameter fixed twice);
 *   `TOLERANCE_SYNTAX` (--uncertainty); `OPTION_VALUE` (--position-uncertainty < 0,
 *   --model with no id, --field-unit or --distance-unit not a unit of that kind,
 *   --robust or --seed not understood); `THRESHOLD_LEVEL` and `THRESHOLD_FREQUENCY` (--threshold, parseThresholdLevel).
 * @example readFitFlags({ fix: ['radius=45mm'], uncertainty: '1.5%+2µT' }).fit.fixed // { radius: 0.045 }
 */
export function readFitFlags(flags: FitFlags): FitCommandOptions {
  const ids = [...new Set((flags.model ?? []).flatMap((list) => list.split(',')).map((id) => id.trim()).filter((id) => id !== ''))];
  if (flags.model !== undefined && ids.length === 0) throw optionValue('--model', flags.model.join(' '), `model ids, e.g. loop,dipole, or leave --model out for the default ${defaultModels.join(',')}`);
  const models = ids.length === 0 ? defaultModels.map((id) => getModel(id)) : ids.map((id) => getModel(id, '--model'));
  const fixed = readFixed(flags.fix ?? [], models);
  const fit: FitSurveyOptions & { models: readonly ModelId[] } = {
    models: models.map((m) => m.id),
    fixed,
    instrumentUncertainty: flags.uncertainty === undefined ? null : parseRelativePlusAbsolute(flags.uncertainty, 'field', '--uncertainty'),
    positionUncertainty: flags.positionUncertainty === undefined ? null : readPositionUncertainty(flags.positionUncertainty),
    robust: readRobust(flags.robust),
    seed: readSeed(flags.seed ?? '1'),
    ...(flags.allStarts === true ? { exhaustiveStarts: true } : {}),
  };
  const thresholds = (flags.threshold ?? []).map((text) => parseThresholdLevel(text));
  return {
    fit,
    import: {
      ...(flags.fieldUnit === undefined ? {} : { fieldUnit: readUnit(flags.fieldUnit, 'field', '--field-unit') }),
      ...(flags.distanceUnit === undefined ? {} : { distanceUnit: readUnit(flags.distanceUnit, 'length', '--distance-unit') }),
    },
    json: flags.json === true,
    spec: flags.spec ?? null,
    thresholds,
    html: flags.html ?? null,
    csv: flags.csv ?? null,
  };
}

/** --fix NAME=QTY... → { name: SI value }, each parsed in the unit kind of the first chosen model that has the name. */
function readFixed(texts: readonly string[], models: readonly FieldModel[]): Record<string, number> {
  const fixed: Record<string, number> = {};
  for (const text of texts) {
    const name = /^\s*([A-Za-z]+)\s*=/.exec(text)?.[1];
    // centre is the scan form's parameter (a survey of signed positions): looked up there.
    const owner = name === undefined ? models[0]! : [...models, ...models.map(scanModel)].find((m) => m.parameters.some((p) => p.name === name));
    if (owner === undefined) {
      const valid = models.map((m) => `${m.id}: ${m.parameters.map((p) => p.name).join(', ')}`).join('; ');
      throw new RingfallError(
        'FIT_UNKNOWN_PARAMETER',
        `--fix: "${name}" is not a parameter of ${models.map((m) => m.id).join(', ')}. Parameters — ${valid}.`,
        { value: text, where: '--fix' },
      );
    }
    const assignment = parseParameterAssignment(owner, text, '--fix');
    if (Object.prototype.hasOwnProperty.call(fixed, assignment.name)) {
      throw new RingfallError('OPTION_TWICE', `--fix: ${assignment.name} is fixed twice. Give each parameter once.`, { value: text, where: '--fix' });
    }
    fixed[assignment.name] = assignment.value;
  }
  return fixed;
}

function readPositionUncertainty(text: string): number {
  const value = parseQuantity(text, 'length', '--position-uncertainty').value;
  if (!(value >= 0)) throw optionValue('--position-uncertainty', text, 'a length of 0 or more, e.g. 0.5mm');
  return value;
}

/** A --field-unit or --distance-unit checked once here, so a bad one is not reported again for every file. */
function readUnit(text: string, kind: 'field' | 'length', option: string): string {
  if (lookupUnit(text)?.kind !== kind) throw optionValue(option, text, `a ${kind} unit: ${unitsOfKind(kind).join(', ')}`);
  return text;
}

function readRobust(text: string | undefined): RobustLoss | null {
  if (text === undefined) return null;
  const loss = text.trim().toLowerCase();
  if (loss === 'huber' || loss === 'soft-l1') return loss;
  throw optionValue('--robust', text, 'huber or soft-l1');
}

function readSeed(text: string): number {
  const seed = Number(text);
  if (!Number.isInteger(seed) || seed < 0 || seed > 0xffffffff) throw optionValue('--seed', text, 'a whole number from 0 to 4294967295');
  return seed;
}

function optionValue(option: string, text: string, expected: string): RingfallError {
  return new RingfallError('OPTION_VALUE', `${option}: "${text}" is not usable. Give ${expected}.`, { value: text, where: option });
}
