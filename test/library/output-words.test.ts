/**
 * Words for people: every human output of every sample file (text report, HTML report,
 * fleet summary, and the page's version of each) is scanned for what must never reach a
 * reader — internal document references and review tags, "from memory" as a claim, micro
 * spelled other than µ, and, in the page, command-line syntax and error codes — and every
 * output that shows an exposure threshold says "not medical advice".
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseThresholdLevel } from '../../src/core/analysis/thresholds/threshold-level';
import { fleetHistory } from '../../src/core/analysis/fleet/fleet-history';
import { isRingfallError } from '../../src/core/errors';
import { defaultModels } from '../../src/core/fit/fit-survey-options';
import { analyseSurvey, unfittedSurveyReport, type SurveyAnalysisSettings } from '../../src/core/report/analyse-survey';
import { renderTextReport } from '../../src/core/report/render-text';
import type { Report, SurveyReport } from '../../src/core/report/report';
import { importSurveys } from '../../src/io';
import { parseSpecs } from '../../src/io/spec/parse-specs';
import { renderFleetSummary } from '../../src/cli/batch/render-fleet-summary';
import { renderReportDocument } from '../../src/render';
import { pageReport, pageText } from '../../src/web/page-words';

const root = join(import.meta.dirname, '..', '..');
const sampleFolder = join(root, 'sample-data');
const files = readdirSync(sampleFolder, { recursive: true }).map(String).filter((name) => name.endsWith('.csv')).sort();
const specs = parseSpecs(readFileSync(join(sampleFolder, 'specs', 'all-coils.spec.json'), 'utf8'), 'all-coils.spec.json');
const thresholds = ['implant-static', 'icnirp-public@50Hz', 'pacemaker-ac', 'static-public', 'mr-implant', '0.2 mT'].map((text) => parseThresholdLevel(text));

/** What must never appear in any human output (project brief: output cites only published sources). */
const forbidden: readonly (readonly [RegExp, string])[] = [
  [/DOMAIN\.md|DESIGN\.md|STYLE\.md/, 'an internal document'],
  [/§/, 'a section sign (internal document reference)'],
  [/\[(?:V|M|C|S|P)(?:[:\]])/, 'a review tag such as [V]'],
  [/from memory/i, '"from memory" as a claim'],
  [/(?<![A-Za-z])u[Tm](?![A-Za-z])/, 'micro spelled "u"'],
  [/\u03bc(?=[Tm](?![A-Za-z]))/, 'micro spelled with Greek mu'],
];
/** What must not appear in the page besides: command-line syntax and error codes (codes stay in JSON). */
const forbiddenInPage: readonly (readonly [RegExp, string])[] = [
  ...forbidden,
  [/(?:^|[\s("“])--[a-z]/m, 'command-line syntax'],
  [/\b[A-Z][A-Z0-9]*(?:_[A-Z0-9]+)+\b/, 'an error code'],
];

function findings(text: string, rules: readonly (readonly [RegExp, string])[]): string[] {
  return rules.flatMap(([pattern, what]) => {
    const match = pattern.exec(text);
    return match ? [`${what}: …${text.slice(Math.max(0, match.index - 60), match.index + 40)}…`] : [];
  });
}

/** HTML as the words a reader sees (tags, styles and scripts removed, entities decoded). */
function visibleText(markup: string): string {
  return markup.replace(/<(script|style)[\s\S]*?<\/\1>/g, ' ').replace(/<[^>]+>/g, ' ')
    .replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&amp;/g, '&');
}

function reportsOf(settings: SurveyAnalysisSettings): { reports: SurveyReport[]; problems: string[] } {
  const reports: SurveyReport[] = [];
  const problems: string[] = [];
  for (const file of files) {
    try {
      const imported = importSurveys(readFileSync(join(sampleFolder, file), 'utf8'), { source: file });
      for (const survey of imported.surveys) {
        try {
          reports.push(analyseSurvey(survey, settings));
        } catch (error) {
          if (!isRingfallError(error)) throw error;
          problems.push(error.message);
        }
      }
      for (const skipped of imported.skipped) reports.push(unfittedSurveyReport(skipped.survey, skipped.reason));
      problems.push(...imported.unassigned.map((row) => row.reason));
    } catch (error) {
      if (!isRingfallError(error)) throw error;
      problems.push(error.message);
    }
  }
  return { reports, problems };
}

const runs: { name: string; settings: SurveyAnalysisSettings }[] = [
  { name: 'meter accuracy stated', settings: { fit: { models: defaultModels, instrumentUncertainty: { relative: 0.015, absolute: 2e-6 }, seed: 1 }, specs, thresholds } },
  { name: 'no uncertainty, a parameter held fixed', settings: { fit: { models: ['loop', 'power-law'], fixed: { probeOffset: 0.002 }, seed: 1 }, specs, thresholds } },
];

describe('words for people in every output of every sample file', () => {
  for (const { name, settings } of runs) {
    const { reports, problems } = reportsOf(settings);
    const fleet = fleetHistory(reports.map((r) => ({ source: r.source, coil: r.coil, date: r.date, fits: r.fits, verdict: r.verdict })), { specs, unreadable: [] });
    const report: Report = { surveys: reports, fleet };

    it(`${name}: the text report, the HTML report and the fleet summary cite no internal document and spell micro µ`, () => {
      const outputs: [string, string][] = [
        ['text', renderTextReport(report)],
        ['html', visibleText(renderReportDocument(report, { chartLibrary: '' }))],
        ['fleet summary', renderFleetSummary(report, { filesDone: files.length, filesTotal: files.length, interrupted: false })],
      ];
      for (const [what, text] of outputs) expect(findings(text, forbidden), what).toEqual([]);
    });

    it(`${name}: the page's words hold no command-line syntax and no error code either`, () => {
      const page = visibleText(renderReportDocument(pageReport(report), { chartLibrary: '' }));
      expect(findings(page, forbiddenInPage)).toEqual([]);
      for (const problem of problems) expect(findings(pageText(problem), forbiddenInPage), problem).toEqual([]);
      // the command line's own report does name its options here, so the scan above can fail
      if (settings.fit.instrumentUncertainty === undefined) expect(visibleText(renderReportDocument(report, { chartLibrary: '' }))).toContain('--uncertainty');
    });

    it(`${name}: every survey report that shows a threshold says "not medical advice"`, () => {
      // project brief: exposure output carries "not medical advice"
      const words = (text: string) => text.replace(/\s+/g, ' ');
      expect(words(renderFleetSummary(report, { filesDone: files.length, filesTotal: files.length, interrupted: false }))).toMatch(/not medical advice/i);
      for (const survey of reports.filter((r) => r.thresholds.length > 0)) {
        expect(words(renderTextReport({ surveys: [survey] }))).toMatch(/not medical advice/i);
        expect(words(visibleText(renderReportDocument({ surveys: [survey] }, { chartLibrary: '' })))).toMatch(/not medical advice/i);
      }
    });
  }
});
