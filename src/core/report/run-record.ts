import type { ThresholdLevel } from '../analysis/thresholds/threshold-level';
import type { FitSurveyOptions } from '../fit/fit-survey-options';
import { getModel, parameterQuantityKind, type ModelId } from '../models';

/** An SI quantity with its unit, as the JSON report writes values. */
export interface RunQuantity {
  readonly value: number;
  readonly unit: string;
}

/** A setting's value: plain JSON, with quantities as { value, unit } in SI. */
export type RunValue = string | number | boolean | null | RunQuantity | readonly RunValue[] | { readonly [key: string]: RunValue };

/** One file the run read: its name as given, its SHA-256 (hex) and its size in bytes. */
export interface RunInput {
  readonly name: string;
  /** Lower-case hex SHA-256 of the file's bytes, or null when it could not be computed (a reason is then given). */
  readonly sha256: string | null;
  readonly bytes: number | null;
  /** Why there is no hash (the page outside a secure context, a file that could not be read). */
  readonly note?: string;
}

/**
 * How a report was made (CONTRACT.md `run`): the tool and its version, the command, the
 * time of the run (ISO 8601 UTC), every input file with its SHA-256, and every setting
 * that changes the results. Core never reads a clock or a file: the CLI and the page
 * compute the time and the hashes and hand them in, so this is plain data.
 */
export interface RunRecord {
  readonly tool: 'ringfall';
  readonly version: string;
  /** `fit`, `batch`, `demo`, `predict`, `plan`, or `web page`. */
  readonly command: string;
  /** ISO 8601 UTC, e.g. "2026-03-14T09:30:00Z". */
  readonly time: string;
  readonly inputs: readonly RunInput[];
  /** Settings by name, in the order they are listed for people (fitRunSettings for fit-like runs). */
  readonly settings: Readonly<Record<string, RunValue>>;
}

/** What a fit-like run (fit, batch, demo, the page) was asked to do. */
export interface FitRunSettingsInput {
  readonly fit: FitSurveyOptions & { readonly models: readonly ModelId[] };
  readonly thresholds: readonly ThresholdLevel[];
  /** The spec file (name and hash), or null when no spec was given. */
  readonly spec: RunInput | null;
  /** Units for headers that state none (CLI --field-unit, --distance-unit). */
  readonly import?: { readonly fieldUnit?: string; readonly distanceUnit?: string };
  /** Anything else that changed results (the page's hand-set columns, …), listed after the rest. */
  readonly extra?: Readonly<Record<string, RunValue>>;
}

/**
 * The settings of a fit-like run as a RunRecord lists them, SI with units: models, fixed
 * values, reading and position uncertainty, robust loss, seed, whether every start ran,
 * the spec file and its hash, threshold levels and the import units.
 * @example fitRunSettings({ fit: { models: ['loop'], seed: 1 }, thresholds: [], spec: null }).models // ['loop']
 */
export function fitRunSettings(input: FitRunSettingsInput): Record<string, RunValue> {
  const { fit } = input;
  const fixed: Record<string, RunValue> = {};
  for (const [name, value] of Object.entries(fit.fixed ?? {})) fixed[name] = { value, unit: parameterUnitOf(name, fit.models) };
  const uncertainty = fit.instrumentUncertainty ?? null;
  return {
    models: [...fit.models],
    fixed,
    readingUncertainty: uncertainty === null ? null : { relative: uncertainty.relative, absolute: { value: uncertainty.absolute, unit: 'T' } },
    positionUncertainty: fit.positionUncertainty === undefined || fit.positionUncertainty === null ? null : { value: fit.positionUncertainty, unit: 'm' },
    robustLoss: fit.robust ?? null,
    seed: fit.seed ?? 1,
    allStarts: fit.exhaustiveStarts === true,
    spec: input.spec === null ? null : { ...input.spec },
    thresholds: input.thresholds.map((level) => ({ value: level.value, unit: 'T', label: level.label })),
    fieldUnit: input.import?.fieldUnit ?? null,
    distanceUnit: input.import?.distanceUnit ?? null,
    ...(input.extra ?? {}),
  };
}

function parameterUnitOf(name: string, models: readonly ModelId[]): string {
  for (const id of models) {
    const parameter = getModel(id).parameters.find((p) => p.name === name);
    if (parameter) return parameter.unit;
  }
  return '1';
}

/** Is this value a { value, unit } quantity? */
export function isRunQuantity(value: RunValue): value is RunQuantity {
  return typeof value === 'object' && value !== null && !Array.isArray(value)
    && typeof (value as RunQuantity).value === 'number' && typeof (value as RunQuantity).unit === 'string' && Object.keys(value).length === 2;
}

/** Kind of an SI unit for display, or null to print the number as it is. */
export function runUnitKind(unit: string): ReturnType<typeof parameterQuantityKind> {
  return parameterQuantityKind(unit as Parameters<typeof parameterQuantityKind>[0]);
}
