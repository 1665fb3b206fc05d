import type { Command } from 'commander';
import { RingfallError } from '../../core/errors';
import { printable } from '../../core/text/printable';
import { planMeasurements } from '../../core/analysis/plan/plan-measurements';
import { planToJson, renderPlanText } from '../../core/report/render-plan';
import type { DesignPoint, DesignProblem } from '../../core/analysis/plan/design-problem';
import { exampleValue, getModel, parseParameterAssignment, scanModel } from '../../core/models';
import { parseQuantity, parseRelativePlusAbsolute } from '../../core/units';
import type { CommandContext } from './command-context';
import { renderRunText } from '../../core/report/render-text';
import type { RunRecord, RunValue } from '../../core/report/run-record';
import { cliRunRecord, runTime } from '../run-record';

interface PlanFlags {
  model: string;
  set: string[];
  fix: string[];
  points: string;
  reach?: string;
  probeSize?: string;
  compare?: string;
  uncertainty: string;
  positionUncertainty: string;
  offAxis?: string;
  interest?: string;
  scan?: boolean;
  json?: boolean;
}

const collect = (value: string, previous: string[]) => [...previous, value];

/** Most probe positions a plan takes: more than a survey by hand can use, and the design stays fast and small. */
const mostPoints = 1000;

/**
 * `ringfall plan --model ID --set NAME=QTY... [--fix NAME=QTY] [--points N]
 * [--reach 5mm..200mm] [--probe-size 5mm] [--compare 10mm,20mm,…] [--uncertainty 2%+1µT]
 * [--position-uncertainty 0.5mm] [--off-axis 60mm] [--interest NAME,…] [--scan] [--json]`:
 * where to put the probe so that the parameters that matter are determined
 * (planMeasurements) — with `--scan`, signed positions of a scan through the coil on a
 * ruler whose zero is the coil's centre (or `--set centre=…`), with the expected 95 % intervals of the recommended plan, an evenly
 * spaced plan of the same size and the user's own plan (CONTRACT.md).
 */
export function registerPlan(program: Command, _context: CommandContext): void {
  program
    .command('plan')
    .description('where to put the probe so the parameters are determined')
    .requiredOption('--model <id>', 'coil model (catalog id, e.g. loop)')
    .option('--set <name=qty>', 'rough value of a parameter, e.g. radius=45mm (repeatable)', collect, [])
    .option('--fix <name=qty>', 'a parameter the fit will hold fixed, e.g. probeOffset=3mm (repeatable)', collect, [])
    .option('--points <n>', 'number of probe positions', '12')
    .option('--reach <near..far>', 'nearest and farthest probe distance, e.g. 5mm..200mm (default 0 to 4× the coil size)')
    .option('--probe-size <qty>', 'least spacing between positions (default min(5 mm, reach/(2·points)))')
    .option('--compare <list>', 'your planned distances, e.g. 10mm,20mm,40mm')
    .option('--uncertainty <rel+abs>', 'standard uncertainty of one reading', '2%+1µT')
    .option('--position-uncertainty <qty>', 'standard uncertainty of each distance', '0.5mm')
    .option('--off-axis <qty>', 'also consider off-axis positions up to this radial offset')
    .option('--interest <names>', 'parameters that matter, comma-separated (default amplitude and geometry)')
    .option('--scan', 'plan a scan through the coil: signed positions on a ruler whose zero is the coil centre, readings on both sides (default reach ±4× the coil size)')
    .option('--json', 'print the plan as JSON')
    .action((flags: PlanFlags) => {
      const time = runTime();
      const { problem, options } = readPlanFlags(flags);
      const plan = planMeasurements(problem, options);
      const run = planRun(problem, options, time);
      process.stdout.write(flags.json ? `${JSON.stringify({ run, ...planToJson(problem, plan) }, null, 2)}\n` : `${renderPlanText(problem, plan)}\n${renderRunText(run)}`);
    });
}

/** Turn the command-line flags into a design problem and plan options. Exported for tests. */
export function readPlanFlags(flags: PlanFlags): { problem: DesignProblem; options: Parameters<typeof planMeasurements>[1] } {
  const model = flags.scan ? scanModel(getModel(flags.model, '--model')) : getModel(flags.model, '--model');
  const values = new Float64Array(model.parameters.length);
  const given = new Set<string>();
  const fixed = new Set<string>();
  for (const [list, option] of [[flags.set, '--set'], [flags.fix, '--fix']] as const) {
    for (const text of list) {
      const { index, name, value } = parseParameterAssignment(model, text, option);
      if (given.has(name)) {
        throw new RingfallError('OPTION_TWICE', `${option}: ${name} is given twice (--set and --fix together count). Give each parameter once.`, { value: text, where: option });
      }
      values[index] = value;
      given.add(name);
      if (option === '--fix') fixed.add(name);
    }
  }
  const missing = model.parameters.filter((p) => !given.has(p.name) && !['offset', 'centre', 'background'].includes(p.role));
  if (missing.length > 0) {
    throw new RingfallError('USAGE_SET', `--set: ${model.id} needs rough values for ${missing.map((p) => p.name).join(', ')}. Give them like --set ${missing[0]!.name}=${exampleValue(missing[0]!.unit)}.`, { value: missing.map((p) => p.name) });
  }
  const size = Math.max(0, ...model.parameters.map((p, j) => (p.role === 'geometry' ? values[j]! : 0)));
  const count = Number(flags.points);
  if (!Number.isInteger(count) || count < 2 || count > mostPoints) {
    throw new RingfallError('USAGE_POINTS', `--points: "${flags.points}" is not a whole number from 2 to ${mostPoints}. Give the number of probe positions, e.g. --points 12.`, { value: flags.points });
  }
  const scan = flags.scan === true;
  const centre = scan ? values[model.parameters.findIndex((p) => p.role === 'centre')]! : 0;
  const farthest = size > 0 ? 4 * size : 0.2;
  const reach = flags.reach ? readReach(flags.reach, scan) : scan ? ([centre - farthest, centre + farthest] as const) : ([0, farthest] as const);
  const probeSize = flags.probeSize ? length(flags.probeSize, '--probe-size') : Math.min(0.005, (reach[1] - reach[0]) / (2 * count));
  const uncertainty = parseRelativePlusAbsolute(flags.uncertainty, 'field', '--uncertainty');
  const problem: DesignProblem = {
    model,
    values,
    free: model.parameters.flatMap((p, j) => (fixed.has(p.name) ? [] : [j])),
    noise: { relative: uncertainty.relative, absolute: uncertainty.absolute, position: length(flags.positionUncertainty, '--position-uncertainty') },
  };
  const compare = flags.compare ? readDistances(flags.compare, scan) : undefined;
  return {
    problem,
    options: {
      count,
      reach,
      probeSize,
      ...(scan ? { signed: true } : {}),
      ...(flags.offAxis ? { maxRadial: length(flags.offAxis, '--off-axis') } : {}),
      ...(flags.interest ? { interest: flags.interest.split(',').map((s) => s.trim()).filter((s) => s !== '') } : {}),
      ...(compare ? { compare } : {}),
    },
  };
}

/** The run record of a plan: no input files; every setting the plan was made with, SI. */
function planRun(problem: DesignProblem, options: Parameters<typeof planMeasurements>[1], time: string): RunRecord {
  const m = (value: number): RunValue => ({ value, unit: 'm' });
  return cliRunRecord('plan', time, [], {
    model: problem.model.id,
    parameters: Object.fromEntries(problem.model.parameters.map((p, j) => [p.name, { value: problem.values[j]!, unit: p.unit }])),
    fixed: problem.model.parameters.filter((_, j) => !problem.free.includes(j)).map((p) => p.name),
    scan: options.signed === true,
    points: options.count,
    reach: [m(options.reach[0]), m(options.reach[1])],
    probeSize: m(options.probeSize),
    readingUncertainty: { relative: problem.noise.relative, absolute: { value: problem.noise.absolute, unit: 'T' } },
    positionUncertainty: m(problem.noise.position),
    offAxis: options.maxRadial === undefined ? null : m(options.maxRadial),
    interest: options.interest === undefined ? null : [...options.interest],
    compare: options.compare === undefined ? null : options.compare.map((p) => m(p.distance)),
  });
}

/** `near..far`; with `signed` (a scan) either end may be negative: -150mm..150mm. */
function readReach(text: string, signed: boolean): readonly [number, number] {
  const parts = text.split('..');
  if (parts.length !== 2) throw new RingfallError('USAGE_REACH', `--reach: "${printable(text, 60)}" is not a range. Write it like ${signed ? '-150mm..150mm' : '5mm..200mm'}.`, { value: text });
  const read = signed ? position : length;
  return [read(parts[0]!, '--reach'), read(parts[1]!, '--reach')];
}

function readDistances(text: string, signed: boolean): DesignPoint[] {
  const items = text.split(',').map((s) => s.trim()).filter((s) => s !== '');
  const unit = trailingUnit(items[items.length - 1] ?? '');
  const read = signed ? position : length;
  return items.map((item) => ({ distance: read(trailingUnit(item) !== '' ? item : `${item}${unit}`, '--compare'), radial: 0 }));
}

/** The unit letters at the end of a trimmed item ("mm" of "20mm"), by a scan from the end (linear, where an unanchored pattern was not). */
function trailingUnit(item: string): string {
  let at = item.length;
  while (at > 0 && /[a-zA-Zµμ"]/.test(item[at - 1]!)) at -= 1;
  return item.slice(at);
}

function length(text: string, what: string): number {
  const value = parseQuantity(text, 'length', what).value;
  if (value < 0) {
    const scan = what === '--reach' || what === '--compare' ? ', or add --scan to plan signed positions of a scan through the coil' : '';
    throw new RingfallError('USAGE_LENGTH', `${what}: "${printable(text, 60)}" is negative. Give a distance ≥ 0${scan}.`, { value: text });
  }
  return value;
}

/** A signed position on a scan's ruler, m. */
function position(text: string, what: string): number {
  return parseQuantity(text, 'length', what).value;
}
