import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { importSurveys } from '../import';
import { fitSurvey } from '../../core/fit/strategy/fit-survey';
import { fleetHistory, parseThresholdLevel, selectSpec, thresholdDistances, verifySpec } from '../../core/analysis';
import type { ModelId } from '../../core/models';
import { readSpecFile } from './read-spec-file';

// The bundled invented surveys, whose true coils are in sample-data/TRUTH.json, checked
// end to end: import → fit → spec verdict / fleet history.
const truth = JSON.parse(readFileSync('sample-data/TRUTH.json', 'utf8')) as { surveys: { file: string; story: string }[] };
const story = (file: string) => truth.surveys.find((s) => s.file === file)!.story;

async function verdictFor(file: string) {
  const specs = await readSpecFile('sample-data/specs/all-coils.spec.json');
  const [survey] = importSurveys(readFileSync(`sample-data/${file}`, 'utf8'), { source: file }).surveys;
  const spec = selectSpec(specs, survey!.coil)!;
  const models = [...new Set<ModelId>(['loop', 'dipole', 'power-law', 'inverse-square', spec.model])];
  const fits = fitSurvey(survey!, { models });
  return { verdict: verifySpec(spec, fits, survey!.readingType), fits, survey: survey! };
}

describe('sample data verdicts against TRUTH.json', () => {
  it('qa-107 2025: the healthy applicator passes its label parameters and its claims measured from the surface', async () => {
    expect(story('qa-107-2025-03-11-healthy.csv')).toContain('matches its label');
    const { verdict } = await verdictFor('qa-107-2025-03-11-healthy.csv');
    expect(verdict.checks.filter((c) => c.kind === 'parameter').map((c) => c.status)).toEqual(['pass', 'pass']);
    // the label's "1.3 mT at 50 mm" is from the applicator surface (datum "surface"): 54 mm from the winding with the 4 mm probe offset of TRUTH.json
    expect(verdict.checks.filter((c) => c.kind === 'claim').map((c) => [c.what, c.status])).toEqual([
      ['field at 0 mm from the surface', 'pass'], ['field at 50.0 mm from the surface', 'pass'],
    ]);
    expect(verdict.status).toBe('pass');
  });

  it('qa-107 2026: ampere-turns 15 % low with unchanged geometry is "degraded"', async () => {
    expect(story('qa-107-2026-03-10-degraded.csv')).toContain('ampere-turns 15 % low, geometry unchanged');
    const { verdict } = await verdictFor('qa-107-2026-03-10-degraded.csv');
    expect(verdict.status).toBe('fail');
    expect(verdict.findings).toContain('degraded');
    expect(verdict.findings).not.toContain('mislabeled');
  });

  it('qa-214: a 60 mm coil labeled 45 mm is "mislabeled"', async () => {
    expect(story('qa-214-2026-02-17-mislabeled.csv')).toContain('true radius 60 mm');
    const { verdict } = await verdictFor('qa-214-2026-02-17-mislabeled.csv');
    expect(verdict.findings[0]).toBe('mislabeled');
    expect(verdict.findings).not.toContain('degraded');
  });

  it('qa-107 2025: the 0.5 mT implant line falls within the interval around the true coil\'s closed-form distance', async () => {
    const { fits, survey } = await verdictFor('qa-107-2025-03-11-healthy.csv');
    const result = thresholdDistances(fits, [parseThresholdLevel('implant-static')], { readingType: survey.readingType })[0]!;
    // TRUTH.json: NI = 360 A, R = 45 mm → z = R·√((μ0NI/2RB)^(2/3) − 1) (DOMAIN.md §1.10), μ0 CODATA 2018
    const centre = (1.25663706212e-6 * 360) / (2 * 0.045);
    const closedForm = 0.045 * Math.sqrt((centre / 5e-4) ** (2 / 3) - 1);
    expect(result.distance!.ci95![0]).toBeLessThan(closedForm);
    expect(result.distance!.ci95![1]).toBeGreaterThan(closedForm);
  });

  it('fleet log: QA-107\'s 15 % drop at the last date is "degrading"; QA-330 (steady) is not flagged', async () => {
    expect(story('fleet-log-2025-2026.csv')).toContain('QA-107 drops 15 % at the last date, QA-330 steady');
    const specs = await readSpecFile('sample-data/specs/all-coils.spec.json');
    const { surveys } = importSurveys(readFileSync('sample-data/fleet-log-2025-2026.csv', 'utf8'), { source: 'fleet-log-2025-2026.csv' });
    const fleet = fleetHistory(
      surveys.map((survey) => {
        const fits = fitSurvey(survey, { models: ['loop', 'dipole'] });
        const spec = selectSpec(specs, survey.coil);
        return { source: survey.source, coil: survey.coil, date: survey.date, fits, verdict: spec ? verifySpec(spec, fits, survey.readingType) : null };
      }),
      { specs },
    );
    const coil = (id: string) => fleet.coils.find((c) => c.coil === id)!;
    expect(coil('QA-107').flags).toContain('degrading');
    expect(coil('QA-107').surveys).toBe(5);
    expect(coil('QA-107').latest).toBe('2026-03-10');
    expect(coil('QA-330').flags).toEqual([]);
    expect(coil('QA-412').trend.ampereTurnsPerYear!.unit).toBe('A/yr');
  });
});
