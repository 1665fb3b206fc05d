import { describe, expect, it } from 'vitest';
import type { Report } from '../core/report/report';
import { fabricatedReport } from '../render/testing-fixture';
import { packReport, unpackReport } from './packed-report';

describe('packReport() / unpackReport()', () => {
  it('restore the Report exactly, σ null and outlier flags included', () => {
    const survey = fabricatedReport('QA-1');
    const [square, loop] = survey.fits;
    const withFlags = { ...loop!, points: loop!.points.map((p, i) => ({ ...p, standardUncertainty: i === 3 ? null : p.standardUncertainty, outlier: i === 5 })) };
    const report: Report = { surveys: [{ ...survey, fits: [square!, withFlags] }, fabricatedReport(null)] };
    const { message, transfer } = packReport(report);
    // one column buffer per fit, plus the outlier flags of the one robust fit
    expect(transfer.length).toBe(5);
    expect(message.report.surveys[0]!.fits[0]!.points).toEqual([]);
    expect(unpackReport(structuredClone(message))).toStrictEqual(report);
  });
});
