import type { FleetSummary } from '../../core/analysis/fleet/fleet-history';
import type { JsonSurvey } from '../../core/report/json-types';
import type { Report, SurveyReport } from '../../core/report/report';
import { summaryModelJson, toJsonReport } from '../../core/report/to-json-report';
import type { JsonReportStream } from '../json-report-stream';
import type { WorkerSpoolPlace, WorkerSpools, WorkerSpoolWriter } from './worker-spool';

type SummaryModel = JsonSurvey['summaryModel'];

/**
 * A survey's `summaryModel` for each model its coil's fleet history may have: the one
 * field of a survey's JSON that needs the fleet (summaryFit: the spec's model, else the
 * coil history's model when this survey has a converged fit of it, else its best physical
 * model). `byHistory` holds only the history models that change it.
 */
export interface SummaryChoices {
  /** summaryModel when the coil's history model is none of byHistory's (or the survey has no coil, or no history). */
  readonly otherwise: SummaryModel;
  readonly byHistory: Readonly<Record<string, SummaryModel>>;
}

/** A survey's JSON text in a thread's spool (spoolSurveyJson), and what its summaryModel will be. */
export interface SurveyJsonPlace extends WorkerSpoolPlace {
  /** Bytes from `offset` to where summaryModel's value goes; -1 when the text holds it already (it does not depend on the fleet). */
  readonly gap: number;
  /** With a gap: JSON text of the SummaryChoices (JSON text, so that the main thread keeps one copy of each distinct one). */
  readonly summary?: string;
  /** With a gap: the survey's coil, whose history model picks the choice. */
  readonly coil?: string | null;
}

/**
 * The survey's part of the JSON report, made where the survey was fitted (a batch worker)
 * and appended to that thread's spool, so the main thread of a large batch neither
 * rebuilds, re-stringifies nor re-indents it: the UTF-8 of `JSON.stringify(survey, null, 2)`
 * for the survey as toJsonReport maps it, with every line after the first indented by 4
 * spaces as an element of the report's "surveys" list (JSON.stringify of the survey inside
 * two arrays gives exactly that indentation). When summaryModel depends on the coil's
 * fleet history, the text has a gap where its value goes (the place's `gap`, in bytes),
 * and `summary` says what fills it for each history model (SummaryChoices).
 */
export function spoolSurveyJson(survey: SurveyReport, spool: WorkerSpoolWriter): SurveyJsonPlace {
  const json = toJsonReport({ surveys: [survey] }).surveys[0]!;
  const choices = summaryChoices(survey);
  if (choices === null) return { ...spool.append(surveyText(json)), gap: -1 };
  const text = surveyText({ ...json, summaryModel: null });
  // the survey's own keys are the only lines of its text indented by exactly 6 spaces, and a
  // string's line breaks are escaped (\n), so this is the survey's summaryModel and no other
  const key = '\n      "summaryModel": ';
  const at = text.indexOf(`${key}null`) + key.length;
  const { place, lengths } = spool.appendParts([text.slice(0, at), text.slice(at + 'null'.length)]);
  return { ...place, gap: lengths[0]!, summary: JSON.stringify(choices), coil: survey.coil };
}

/** The survey's text as an element of the report's surveys list ("{\n      …\n    }"). */
function surveyText(json: JsonSurvey): string {
  // "[\n  [\n    {…}\n  ]\n]": the object from its "{" to its "}"
  return JSON.stringify([[json]], null, 2).slice(10, -6);
}

/** The survey's summaryModel for each history model that changes it, or null when none does (the value is fixed). */
function summaryChoices(survey: SurveyReport): SummaryChoices | null {
  const withHistory = (model: string | null): SummaryModel => {
    const fleet = { coils: survey.coil === null || model === null ? [] : [{ coil: survey.coil, model }], unreadable: [] } as unknown as FleetSummary;
    return summaryModelJson({ surveys: [], fleet }, survey);
  };
  const otherwise = withHistory(null);
  const byHistory: Record<string, SummaryModel> = {};
  let changed = false;
  for (const model of new Set(survey.fits.map((fit) => fit.model))) {
    const value = withHistory(model);
    if (JSON.stringify(value) === JSON.stringify(otherwise)) continue;
    byHistory[model] = value;
    changed = true;
  }
  return changed ? { otherwise, byHistory } : null;
}

/** Bytes read from a spool at a time when writing the surveys: a batch's surveys follow one another in each thread's spool. */
const readBlock = 1 << 20;

/**
 * Write the surveys (in report order, from where spoolSurveyJson put them) to `stream`,
 * each with the summaryModel its coil's history (in `report`'s fleet section) gives it: the
 * bytes JsonReportStream.surveyText would write for each survey's text. The spools are
 * read a block at a time and the texts handed on as bytes, never decoded.
 */
export async function writeSpooledSurveys(stream: JsonReportStream, places: readonly SurveyJsonPlace[], spools: WorkerSpools, report: Pick<Report, 'fleet'>): Promise<void> {
  const historyModels = new Map((report.fleet?.coils ?? []).map((coil) => [coil.coil, coil.model] as const));
  const choices = new Map<string, SummaryChoices>();
  const summaryBytes = new Map<string, Buffer>();
  const blocks = new Map<number, { start: number; bytes: Buffer }>();
  const bytesAt = (spool: number, offset: number, length: number): Buffer => {
    let block = blocks.get(spool);
    if (block === undefined || offset < block.start || offset + length > block.start + block.bytes.length) {
      // a new buffer each time: the stream may hold pieces of the last one until it writes them
      const bytes = Buffer.allocUnsafe(Math.max(readBlock, length));
      block = { start: offset, bytes: bytes.subarray(0, spools.readUpTo(spool, bytes, offset)) };
      blocks.set(spool, block);
    }
    return block.bytes.subarray(offset - block.start, offset - block.start + length);
  };
  for (const place of places) {
    if (place.gap < 0) {
      await stream.surveyBytes([bytesAt(place.spool, place.offset, place.length)]);
      continue;
    }
    let choice = choices.get(place.summary!);
    if (choice === undefined) {
      choice = JSON.parse(place.summary!) as SummaryChoices;
      choices.set(place.summary!, choice);
    }
    const model = place.coil === null || place.coil === undefined ? undefined : historyModels.get(place.coil);
    const value = model !== undefined && model !== null && Object.hasOwn(choice.byHistory, model) ? choice.byHistory[model]! : choice.otherwise;
    const key = JSON.stringify(value);
    let summary = summaryBytes.get(key);
    if (summary === undefined) {
      summary = Buffer.from(JSON.stringify(value, null, 2).replace(/\n/g, '\n      '), 'utf8');
      summaryBytes.set(key, summary);
    }
    await stream.surveyBytes([
      bytesAt(place.spool, place.offset, place.gap), summary, bytesAt(place.spool, place.offset + place.gap, place.length - place.gap),
    ]);
  }
}
