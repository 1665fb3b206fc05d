import type { Report } from '../core/report/report';

/**
 * Exit status from the checks a report holds (CONTRACT.md): 1 when a spec check failed
 * or could not be decided (inconclusive is not a pass), a threshold level was not found
 * on the fitted curve, or a fleet coil carries a history flag; else 0.
 */
export function checksStatus(report: Report): number {
  const failed =
    report.surveys.some((survey) => survey.verdict !== null && survey.verdict.status !== 'pass') ||
    report.surveys.some((survey) => survey.thresholds.some((t) => t.distance === null)) ||
    (report.fleet?.coils ?? []).some((coil) => coil.flags.length > 0);
  return failed ? 1 : 0;
}
