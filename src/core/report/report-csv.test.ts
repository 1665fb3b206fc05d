import { describe, expect, it } from 'vitest';
import { neutraliseCell, reportCsv } from './report-csv';
import type { Report } from './report';

describe('reportCsv()', () => {
  it('neutraliseCell() prefixes cells starting with = + - @ so spreadsheets do not run them', () => {
    // OWASP "CSV Injection": cells beginning with = + - @ (and tab, CR) are formulas in spreadsheets
    for (const cell of ['=1+1', '+SUM(A1)', '-2+3', '@cmd', '\tx']) expect(neutraliseCell(cell)).toBe(`'${cell}`);
    expect(neutraliseCell('QA-107')).toBe('QA-107');
  });

  it('reportCsv() writes one row per reading and model, with a hostile coil id neutralised and quoted', () => {
    const report: Report = {
      surveys: [{
        source: 'a.csv', coil: '=HYPERLINK("http://x","y")', date: '2026-01-02', readingType: 'dc',
        readings: { total: 1, used: 1, rejected: [] },
        fits: [{
          model: 'dipole', converged: true, stopReason: 'ok', iterations: 3, params: {}, freeParameters: [], covariance: null,
          correlation: null, uncertaintyScale: 'estimated',
          stats: { n: 1, k: 1, rss: 0, rmse: 0, chiSquare: 0, reducedChiSquare: null, aicc: 0, bic: 0, akaikeWeight: 1 },
          points: [{ line: 5, distance: 0.01, radial: 0, field: 1e-3, predicted: 1.1e-3, residual: -1e-4, standardUncertainty: null }],
          warnings: [],
        }],
        best: 'dipole', comparison: [], verdict: null, thresholds: [], warnings: [], cautions: [], notes: [],
      }],
    };
    const lines = reportCsv(report).trimEnd().split('\r\n');
    expect(lines).toHaveLength(2);
    expect(lines[1]).toContain(`"'=HYPERLINK(""http://x"",""y"")"`);
    expect(lines[1]).toContain(',dipole,yes,5,0.01,0,0.001,0.0011,-0.0001,,no');
  });
});
