import type { Report, SurveyReport } from '../core/report/report';

/**
 * The page speaks in its own controls. Messages made in core and io are shared with the
 * command line and may name its options ("--uncertainty 1.5%+2µT", "--fix radius=…");
 * here each such hint becomes the page control that does the same. Error codes stay in
 * the data (JSON export, data-code attributes) and are never shown as words.
 */

const uncertaintyControl = '“Instrument uncertainty of one reading”';
const positionControl = '“Position uncertainty of each distance”';
const fixControl = '“Hold a parameter fixed”';
const columnsControl = 'choose its unit under “What the files said” and use that reading';

/** [pattern, replacement] in order: the specific hints first, then any option left over. */
const rewrites: readonly (readonly [RegExp, string | ((...groups: string[]) => string)])[] = [
  [/\(--uncertainty(?: [^\s)]+)?\)/g, `(${uncertaintyControl})`],
  [/e\.g\. --uncertainty [^\s,;)]+/g, `e.g. 1.5 % + 2 µT in ${uncertaintyControl}`],
  [/--uncertainty(?: [^\s,;)]+)?/g, uncertaintyControl],
  [/see --position-uncertainty/g, `see ${positionControl}`],
  [/\(--position-uncertainty\)/g, `(${positionControl})`],
  [/--position-uncertainty/g, positionControl],
  [/,? ?or pass --field-unit [^;.]*?(?=;|\.)/g, `, or ${columnsControl}`],
  [/,? ?or pass --distance-unit [^;.]*?(?=;|\.)/g, `, or ${columnsControl}`],
  [/--(field|distance)-unit ([^\s;,.]+)/g, (_m, kind: string, unit: string) => `the ${kind} unit ${unit} chosen for columns without one`],
  [/drop --fix (\w+)/g, (_m, name: string) => `stop holding ${name} fixed`],
  [/\(--fix NAME=[^)]*\)/g, `(${fixControl})`],
  [/\(--fix (\w+)=[^)]*\)/g, (_m, name: string) => `(${fixControl}: ${name})`],
  [/\(--fix\)/g, `(${fixControl})`],
  [/--fix (\w+) does not apply/g, (_m, name: string) => `Holding ${name} fixed does not apply`],
  [/--fix (\w+)=\S*/g, (_m, name: string) => `${fixControl} for ${name}`],
  [/--fix/g, fixControl],
  [/fit it with --model ([\w-]+)/g, (_m, id: string) => `tick ${id} under “Models to fit”`],
  [/--model ([\w-]+)/g, (_m, id: string) => `${id} ticked under “Models to fit”`],
  [/--json or --html lists them/g, 'the saved report (HTML or JSON) lists them'],
  [/--json lists every one/g, 'the JSON export lists every one'],
  [/Check the path given to --spec\./g, 'Check the spec file chosen.'],
  [/--spec/g, 'the spec'],
  [/--threshold/g, 'the level'],
  // any option left: its name without the dashes, so no command-line syntax reaches the page
  [/(^|[\s("“])--([a-z][a-z-]*)/g, (_m, before: string, name: string) => `${before}${name.replace(/-/g, ' ')}`],
];

/**
 * A message in the page's words: command-line hints become the page control that does
 * the same, and a leading error code ("IMPORT_FIELD_UNIT_MISSING: …") is dropped.
 * @example pageText('Give the meter\'s accuracy (--uncertainty 1.5%+2µT).') // "Give the meter's accuracy (“Instrument uncertainty of one reading” (under How to fit))."
 */
export function pageText(text: string): string {
  let out = text.replace(/^[A-Z][A-Z0-9]*(?:_[A-Z0-9]+)+:\s*/, '');
  for (const [pattern, replacement] of rewrites) {
    out = typeof replacement === 'string' ? out.replace(pattern, replacement) : out.replace(pattern, replacement);
  }
  return out;
}

/** Every sentence of a Report meant for people, in the page's words (numbers and codes untouched). */
export function pageReport(report: Report): Report {
  return { ...report, surveys: report.surveys.map(pageSurvey), ...(report.fleet ? { fleet: { ...report.fleet, coils: report.fleet.coils.map((coil) => ({ ...coil, explanations: coil.explanations.map(pageText) })), unreadable: report.fleet.unreadable.map((u) => ({ ...u, reason: pageText(u.reason) })) } } : {}) };
}

function pageSurvey(survey: SurveyReport): SurveyReport {
  const words = (list: readonly string[]) => list.map(pageText);
  return {
    ...survey,
    readings: { ...survey.readings, rejected: survey.readings.rejected.map((row) => ({ ...row, reason: pageText(row.reason) })) },
    fits: survey.fits.map((fit) => ({ ...fit, warnings: words(fit.warnings) })),
    comparison: words(survey.comparison),
    verdict: survey.verdict === null ? null : {
      ...survey.verdict,
      explanations: words(survey.verdict.explanations),
      checks: survey.verdict.checks.map((check) => ({ ...check, evidence: pageText(check.evidence), ...(check.toDecide === undefined ? {} : { toDecide: pageText(check.toDecide) }) })),
    },
    thresholds: survey.thresholds.map((t) => ({ ...t, notes: words(t.notes) })),
    warnings: words(survey.warnings),
    cautions: words(survey.cautions),
    notes: words(survey.notes),
  };
}
