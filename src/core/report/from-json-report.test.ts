import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { RingfallError } from '../errors';
import { importSurveys } from '../../io';
import { analyseSurvey } from './analyse-survey';
import { fromJsonReport } from './from-json-report';
import type { Report } from './report';
import { toJsonReport } from './to-json-report';

describe('fromJsonReport()', () => {
  it('fromJsonReport(toJsonReport(report)) gives back the report a view draws, points and run record included', () => {
    const text = readFileSync('sample-data/qa-107-2026-03-10-degraded.csv', 'utf8');
    const survey = importSurveys(text, { source: 'degraded.csv' }).surveys[0]!;
    const analysed = analyseSurvey(survey, { fit: { models: ['loop', 'inverse-square'], instrumentUncertainty: { relative: 0.015, absolute: 2e-6 } }, specs: [], thresholds: [] });
    const report: Report = {
      surveys: [analysed],
      run: { tool: 'ringfall', version: '0.1.0', command: 'fit', time: '2026-03-14T09:30:00Z', inputs: [{ name: 'degraded.csv', sha256: 'ab', bytes: 1 }], settings: { seed: 1 } },
    };
    // a round trip through JSON text (RFC 8259) loses nothing of a report with finite numbers
    const back = fromJsonReport(JSON.parse(JSON.stringify(toJsonReport(report))), 'r.json');
    expect(back.run).toEqual(report.run);
    expect(back.surveys[0]!.fits.map((f) => f.points)).toEqual(analysed.fits.map((f) => f.points));
    expect(back.surveys[0]!.fits.map((f) => f.params)).toEqual(analysed.fits.map((f) => f.params));
    expect(back.surveys[0]!.fits.map((f) => f.covariance)).toEqual(analysed.fits.map((f) => f.covariance));
    expect(back.surveys[0]!.verdict).toEqual(analysed.verdict);
    expect(back.surveys[0]!.readings).toEqual(analysed.readings);
  });

  it('a 3-D map\'s report comes back with its marker, pose and points (x, y, z, component)', () => {
    const text = readFileSync('sample-data/qa-512-2026-03-12-tilted-map.csv', 'utf8');
    const survey = importSurveys(text, { source: 'map.csv' }).surveys[0]!;
    const analysed = analyseSurvey(survey, { fit: { models: ['loop'] }, specs: [], thresholds: [] });
    expect(analysed.axis).toBe('map');
    // a round trip through JSON text (RFC 8259) loses nothing of a report with finite numbers
    const back = fromJsonReport(JSON.parse(JSON.stringify(toJsonReport({ surveys: [analysed] }))), 'map.json');
    expect(back.surveys[0]!.axis).toBe('map');
    expect(back.surveys[0]!.fits.map((f) => f.points)).toEqual(analysed.fits.map((f) => f.points));
    expect(back.surveys[0]!.fits[0]!.params['tilt']).toEqual(analysed.fits[0]!.params['tilt']);
  });

  it('fromJsonReport() refuses what is not a ringfall report with REPORT_NOT_RINGFALL, naming the file', () => {
    for (const json of [{ schema: 'other/1', surveys: [] }, [1, 2], { surveys: [] }]) {
      let error: unknown;
      try { fromJsonReport(json, 'notes.json'); } catch (caught) { error = caught; }
      expect(error).toBeInstanceOf(RingfallError);
      expect((error as RingfallError).code).toBe('REPORT_NOT_RINGFALL');
      expect((error as RingfallError).message).toContain('notes.json: not a saved ringfall report');
    }
  });
});
