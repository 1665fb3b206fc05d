import { describe, expect, it } from 'vitest';
import { fitSurvey } from '../fit/strategy/fit-survey';
import { evenlySpaced, simulatedSurvey } from '../fit/testing/simulated-survey';
import type { Survey } from '../survey/survey';
import { buildSurveyReport } from './build-survey-report';
import { renderTextReport } from './render-text';
import { toJsonReport } from './to-json-report';

const loopSurvey = (): Survey => {
  const survey = simulatedSurvey({
    model: 'loop', params: { ampereTurns: 400, radius: 0.05, probeOffset: 0.003, background: 2e-5 },
    distances: evenlySpaced(0, 0.3, 25), noise: { relative: 0.01, absolute: 5e-7 }, seed: 31,
  });
  return { ...survey, coil: 'HX-2', date: '2026-03-14', totalRows: 26, rejected: [{ line: 40, column: 'B', value: 'OL', reason: 'over range' }], notes: ['signs flipped'] };
};

describe('buildSurveyReport(survey, fits, extras)', () => {
  it('buildSurveyReport() carries provenance and every rejected row, compares the fits and names the loop best', () => {
    const survey = loopSurvey();
    const report = buildSurveyReport(survey, fitSurvey(survey, { instrumentUncertainty: { relative: 0.01, absolute: 5e-7 } }), { notes: ['weighted by 1 %'] });
    expect(report).toMatchObject({ source: 'simulated loop', coil: 'HX-2', date: '2026-03-14', readingType: 'dc', best: 'loop', verdict: null, thresholds: [], cautions: [] });
    expect(report.readings).toEqual({ total: 26, used: 25, rejected: survey.rejected });
    expect(report.notes).toEqual(['signs flipped', 'weighted by 1 %']);
    expect(report.comparison).toHaveLength(3);
    const weights = report.fits.map((fit) => fit.stats.akaikeWeight!);
    expect(weights.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
  });

  it('buildSurveyReport() with no fits keeps the survey, names no best model and passes the warnings on', () => {
    const report = buildSurveyReport(loopSurvey(), [], { warnings: ['Not fitted: 2 usable readings'] });
    expect(report).toMatchObject({ fits: [], best: null, comparison: [], warnings: ['Not fitted: 2 usable readings'] });
  });

  it('buildSurveyReport() says too few readings, not "did not converge", when no model can be ranked by AICc', () => {
    // AICc = AIC + 2k(k+1)/(n − k − 1) needs n ≥ k + 2 (Burnham & Anderson 2002, §2.4): 4 readings, 3-parameter models
    const small = simulatedSurvey({
      model: 'loop', params: { ampereTurns: 400, radius: 0.05, probeOffset: 0.003, background: 2e-5 },
      distances: evenlySpaced(0.01, 0.04, 4), noise: { relative: 0.01, absolute: 5e-7 }, seed: 32,
    });
    const report = buildSurveyReport(small, fitSurvey(small, { models: ['inverse-square', 'dipole'] }));
    expect(report.fits.every((fit) => fit.converged)).toBe(true);
    expect(report.best).toBeNull();
    expect(report.warnings.join(' ')).toContain('Too few readings to rank the models: 4 readings, and AICc needs at least 5');
    expect(report.warnings.join(' ')).not.toContain('No model converged');
    const text = renderTextReport({ surveys: [report] });
    expect(text).toContain('No model can be ranked (too few readings)');
    expect(text).not.toContain('did not converge');
  });

  it('buildSurveyReport() warns when no model converged', () => {
    const survey = loopSurvey();
    const report = buildSurveyReport(survey, fitSurvey(survey, { models: ['loop'], signal: { aborted: true } }));
    expect(report.best).toBeNull();
    expect(report.warnings.join(' ')).toContain('No model converged');
  });

  it('the JSON report gives each physical fit its far-field moment in A·m², and the text report shows it under the parameters', () => {
    const survey = loopSurvey();
    const report = { surveys: [buildSurveyReport(survey, fitSurvey(survey, { instrumentUncertainty: { relative: 0.01, absolute: 5e-7 } }))] };
    const json = toJsonReport(report);
    const loop = json.surveys[0]!.fits.find((fit) => fit.model === 'loop')!;
    expect(loop.moment!.unit).toBe('A·m²');
    // DOMAIN.md §1.11: m = N·I·π·R² = 400·π·0.05² ≈ 3.14 A·m²; within 3 % for 1 % noise
    expect(Math.abs(loop.moment!.value! / (400 * Math.PI * 0.0025) - 1)).toBeLessThan(0.03);
    expect(json.surveys[0]!.fits.find((fit) => fit.model === 'power-law')!.moment).toBeUndefined();
    const text = renderTextReport(report);
    expect(text).toMatch(/far-field moment\s+\d\.\d+ A·m²\s+\d\.\d+ to \d\.\d+ A·m²/);
    expect(text).toContain('<0.001');
  });
});
