import { displayUnit } from '../units';
import { isRunQuantity, runUnitKind, type RunRecord, type RunValue } from './run-record';

/** Words for people for the settings fitRunSettings writes; other names are shown as they are. */
const labels: Readonly<Record<string, string>> = {
  models: 'models fitted',
  fixed: 'held fixed',
  readingUncertainty: 'reading uncertainty',
  positionUncertainty: 'position uncertainty',
  robustLoss: 'robust loss',
  seed: 'multi-start seed',
  allStarts: 'every extra start run',
  spec: 'spec file',
  thresholds: 'threshold levels',
  fieldUnit: 'field unit of headers without one',
  distanceUnit: 'distance unit of headers without one',
  columnsSetByHand: 'columns set by hand',
  skipLists: 'folders\' .ringfall-skip lists honoured',
  model: 'model',
  parameters: 'parameter values',
  distance: 'distance along the axis',
  radialOffset: 'radial offset',
  points: 'probe positions',
  reach: 'reach (nearest, farthest)',
  probeSize: 'least spacing',
  offAxis: 'off-axis reach',
  interest: 'parameters that matter',
  compare: 'your planned distances',
};

/** What a null setting means, for people. */
const whenNull: Readonly<Record<string, string>> = {
  readingUncertainty: 'none stated (intervals from the scatter of the readings)',
  positionUncertainty: 'none stated',
  robustLoss: 'none (plain least squares)',
  spec: 'none',
  fieldUnit: 'none given',
  distanceUnit: 'none given',
  offAxis: 'on the axis only',
  interest: 'amplitude and geometry',
  compare: 'none',
};

/** One line of the run record for people: a label and its text. */
export interface RunLine {
  readonly label: string;
  readonly text: string;
}

/**
 * The run record in words, one line per fact, for the text, HTML and CSV reports:
 * tool and version, command, time, each input file with its size and SHA-256, then each
 * setting with SI quantities shown in everyday units.
 * @example describeRun(run)[0] // { label: 'made by', text: 'ringfall 0.1.0 (fit)' }
 */
export function describeRun(run: RunRecord): RunLine[] {
  const lines: RunLine[] = [
    { label: 'made by', text: `${run.tool} ${run.version} (${run.command})` },
    { label: 'time of the run', text: run.time },
  ];
  if (run.inputs.length === 0) lines.push({ label: 'input files', text: 'none' });
  for (const input of run.inputs) lines.push({ label: 'input file', text: describeInput(input) });
  for (const [name, value] of Object.entries(run.settings)) {
    lines.push({ label: labels[name] ?? name, text: value === null ? (whenNull[name] ?? 'none') : describeValue(name, value) });
  }
  return lines;
}

function describeInput(input: RunRecord['inputs'][number]): string {
  const size = input.bytes === null ? '' : `, ${input.bytes} bytes`;
  const hash = input.sha256 === null ? `, no SHA-256${input.note ? ` (${input.note})` : ''}` : `, SHA-256 ${input.sha256}`;
  return `${input.name}${size}${hash}`;
}

function describeValue(name: string, value: RunValue): string {
  if (name === 'spec' && typeof value === 'object' && value !== null && !Array.isArray(value) && 'name' in value) {
    return describeInput(value as unknown as RunRecord['inputs'][number]);
  }
  if (name === 'readingUncertainty' && typeof value === 'object' && value !== null && !Array.isArray(value) && 'relative' in value) {
    const { relative, absolute } = value as { relative: number; absolute: RunValue };
    return `${compact(relative * 100)} % of the reading + ${plain(absolute)}`;
  }
  if (name === 'thresholds' && Array.isArray(value)) {
    if (value.length === 0) return 'none';
    return value.map((level) => {
      const { label, ...quantity } = level as { value: number; unit: string; label: string | null };
      return `${plain(quantity)}${label ? ` — ${label}` : ''}`;
    }).join('; ');
  }
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (Array.isArray(value) && value.length === 0) return 'none';
  if (!Array.isArray(value) && typeof value === 'object' && value !== null && !isRunQuantity(value) && Object.keys(value).length === 0) return 'none';
  return plain(value);
}

/** Any value in words: quantities in everyday units, lists with commas, objects as "name value". */
function plain(value: RunValue): string {
  if (value === null) return 'none';
  if (typeof value === 'string') return value;
  if (typeof value === 'number') return String(value);
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (isRunQuantity(value)) {
    const kind = runUnitKind(value.unit);
    if (kind === null) return `${value.value}${value.unit === '1' ? '' : ` ${value.unit}`}`;
    // a length in mm however small (0.5 mm reads better than 500 µm); zero in the everyday unit
    const unit = kind === 'length' && Math.abs(value.value) < 1 ? { symbol: 'mm', factor: 1e-3 }
      : value.value === 0 ? { symbol: value.unit, factor: 1 } : displayUnit(value.value, kind);
    return `${compact(value.value / unit.factor)} ${unit.symbol}`;
  }
  if (Array.isArray(value)) return value.map(plain).join(', ');
  return Object.entries(value as Record<string, RunValue>).map(([key, item]) => `${key} ${plain(item)}`).join('; ');
}

/** A setting as typed: up to 6 significant digits, no trailing zeros (0.5, 2, 1.5). */
function compact(value: number): string {
  return String(Number(value.toPrecision(6)));
}
