import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { compareModels } from '../../src/core/fit/strategy/compare-models';
import { fitSurvey } from '../../src/core/fit/strategy/fit-survey';
import type { FitSurveyOptions } from '../../src/core/fit/fit-survey-options';
import { importSurveys } from '../../src/io';

const folder = join(import.meta.dirname, '..', '..', 'sample-data');

interface TruthEntry {
  readonly file: string;
  readonly model: string;
  readonly noise: { readonly relativeSd: number; readonly floorSd: number; readonly positionSd: number };
  readonly params: Readonly<Record<string, number>>;
}
const truth = (JSON.parse(readFileSync(join(folder, 'TRUTH.json'), 'utf8')) as { surveys: TruthEntry[] }).surveys;

describe('fitSurvey() on the invented sample surveys against sample-data/TRUTH.json', () => {
  for (const file of ['qa-107-2025-03-11-healthy.csv', 'qa-107-2026-03-10-degraded.csv', 'qa-214-2026-02-17-mislabeled.csv']) {
    const entry = truth.find((t) => t.file === file)!;
    const survey = importSurveys(readFileSync(join(folder, file), 'utf8'), { source: file }).surveys[0]!;
    const cases: [string, FitSurveyOptions][] = [
      ['no stated uncertainty', {}],
      ['the generator\'s noise stated', { instrumentUncertainty: { relative: entry.noise.relativeSd, absolute: entry.noise.floorSd }, positionUncertainty: entry.noise.positionSd }],
    ];
    for (const [label, options] of cases) {
      it(`${file} (${label}): the loop wins on AICc and the 95 % intervals of ampereTurns and radius contain the true values`, () => {
        const result = compareModels(fitSurvey(survey, options));
        expect(result.best).toBe('loop');
        const loop = result.fits.find((fit) => fit.model === 'loop')!;
        for (const name of ['ampereTurns', 'radius']) {
          const interval = loop.params[name]!.ci95!;
          expect(interval[0], name).toBeLessThanOrEqual(entry.params[name]!);
          expect(interval[1], name).toBeGreaterThanOrEqual(entry.params[name]!);
        }
      });
    }
  }
});

describe('fitSurvey() on the invented two-sided scan of the calibration coil pair against sample-data/TRUTH.json', () => {
  it('qh-70-2026-03-05-pair-scan.csv: every reading used; the 95 % intervals of ampere-turns, radius, separation and centre contain the true values', () => {
    const file = 'qh-70-2026-03-05-pair-scan.csv';
    const entry = truth.find((t) => t.file === file)!;
    const survey = importSurveys(readFileSync(join(folder, file), 'utf8'), { source: file }).surveys[0]!;
    expect(survey.axis).toBe('position');
    const [fit] = fitSurvey(survey, { models: ['coil-pair'], instrumentUncertainty: { relative: entry.noise.relativeSd, absolute: entry.noise.floorSd }, positionUncertainty: entry.noise.positionSd });
    expect(fit!.stats.n).toBe(survey.totalRows);
    for (const name of ['ampereTurns', 'radius', 'separation', 'centre']) {
      const interval = fit!.params[name]!.ci95!;
      // TRUTH.json, written by the generator from the stated parameters
      expect(interval[0], name).toBeLessThanOrEqual(entry.params[name]!);
      expect(interval[1], name).toBeGreaterThanOrEqual(entry.params[name]!);
    }
  });
});
