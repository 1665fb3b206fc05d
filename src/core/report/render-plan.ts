import { formatNumber, formatQuantity } from '../units';
import { parameterQuantityKind } from '../models';
import { describeValue } from '../analysis/describe-value';
import type { JsonPlan, JsonPlanIntervals } from './json-types';
import type { DesignProblem } from '../analysis/plan/design-problem';
import type { ExpectedIntervals } from '../analysis/plan/expected-intervals';
import type { MeasurementPlan } from '../analysis/plan/plan-measurements';

/** Schema tag of `ringfall plan --json`. */
export const planSchema = 'ringfall-plan/1';

/**
 * The plan as JSON, SI with units: the model and rough parameters (free or fixed), the
 * noise model, and for each plan (recommended, evenlySpaced, compared) its positions and
 * the expected 95 % half-widths of every free parameter and of the moment.
 */
export function planToJson(problem: DesignProblem, plan: MeasurementPlan): JsonPlan {
  const parameters = Object.fromEntries(problem.model.parameters.map((p, j) => [p.name, { value: problem.values[j]!, unit: p.unit, free: problem.free.includes(j) }]));
  const planJson = (intervals: ExpectedIntervals): JsonPlanIntervals => ({
    points: intervals.points.map((p) => ({ distance: { value: p.distance, unit: 'm' }, radial: { value: p.radial, unit: 'm' } })),
    expected: Object.fromEntries(intervals.parameters.map((p) => [p.name, { halfWidth95: p.halfWidth, unit: p.unit, relative: p.relative }])),
    moment: intervals.moment && { value: intervals.moment.value, unit: 'A·m²', halfWidth95: intervals.moment.halfWidth, relative: intervals.moment.relative },
    correlation: intervals.correlation,
    determined: intervals.determined,
    warnings: intervals.warnings,
  });
  return {
    schema: planSchema,
    model: problem.model.id,
    parameters,
    interest: plan.interest,
    noise: { relative: problem.noise.relative, absolute: { value: problem.noise.absolute, unit: 'T' }, position: { value: problem.noise.position, unit: 'm' } },
    ...(plan.scan ? { axis: 'position' as const } : {}),
    plans: {
      recommended: planJson(plan.recommended),
      evenlySpaced: planJson(plan.evenlySpaced),
      compared: plan.compared === null ? null : planJson(plan.compared),
      ...(plan.scan ? { oneSided: plan.oneSided === null ? null : planJson(plan.oneSided) } : {}),
    },
    notes: plan.notes,
  };
}

/** The plan as text for an 80-column terminal: positions, then expected intervals side by side. */
export function renderPlanText(problem: DesignProblem, plan: MeasurementPlan): string {
  const lines: string[] = [];
  const setting = problem.model.parameters.map((p, j) => `${p.name} ${describeValue(problem.values[j]!, parameterQuantityKind(p.unit))}${problem.free.includes(j) ? '' : ' (fixed)'}`);
  lines.push(`Measurement plan for ${problem.model.id}: ${setting.join(', ')}`);
  lines.push(`Optimised for ${plan.interest.join(', ')}; ${plan.notes.join(' ')}`, '');
  const plans: [string, ExpectedIntervals][] = [['recommended', plan.recommended], ['evenly spaced', plan.evenlySpaced]];
  if (plan.compared) plans.push(['your plan', plan.compared]);
  if (plan.oneSided) plans.push(['one side only', plan.oneSided]);
  for (const [name, intervals] of plans) lines.push(`${name} (${intervals.points.length} ${plan.scan && intervals !== plan.oneSided ? 'positions on the ruler' : 'positions'}): ${positions(intervals)}${intervals === plan.oneSided ? ' from the datum, probe offset free' : ''}`);
  lines.push('', 'Expected 95 % half-widths');
  const header = ['', ...plans.map(([name]) => name)];
  const rows = plan.recommended.parameters.map((p, a) => [
    p.name,
    ...plans.map(([, intervals]) => halfWidthText(intervals.parameters[a]!.halfWidth, intervals.parameters[a]!.relative, parameterQuantityKind(p.unit))),
  ]);
  if (plan.recommended.moment) rows.push(['moment', ...plans.map(([, i]) => halfWidthText(i.moment?.halfWidth ?? null, i.moment?.relative ?? null, 'moment'))]);
  rows.push(['ρ(amplitude, size)', ...plans.map(([, i]) => (i.correlation === null ? '—' : formatNumber(i.correlation, 3)))]);
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? '').length)));
  for (const row of [header, ...rows]) lines.push('  ' + row.map((cell, i) => cell.padEnd(widths[i]!)).join('  ').trimEnd());
  const warnings = plans.flatMap(([name, intervals]) => intervals.warnings.map((w) => `${name}: ${w}`));
  if (warnings.length > 0) lines.push('', 'Warnings', ...warnings.map((w) => `  - ${w}`));
  return lines.join('\n') + '\n';
}

function positions(intervals: ExpectedIntervals): string {
  return intervals.points
    .map((p) => formatNumber(p.distance * 1e3, 3) + (p.radial > 0 ? `@${formatNumber(p.radial * 1e3, 3)}` : ''))
    .join(' ') + ' mm' + (intervals.points.some((p) => p.radial > 0) ? ' (distance@radial offset)' : '');
}

function halfWidthText(halfWidth: number | null, relative: number | null, kind: Parameters<typeof formatQuantity>[1] | null): string {
  if (halfWidth === null) return 'not determined';
  const value = kind ? `±${describeValue(halfWidth, kind)}` : `±${formatNumber(halfWidth, 3)}`;
  return relative === null ? value : `${value} (${formatNumber(100 * relative, 2)} %)`;
}
