import type { Report } from '../core/report/report';
import { exitStatus, worseStatus } from './exit-codes';

/**
 * Exit status from the checks a report holds (CONTRACT.md "Exit status"):
 * 2 when a spec was given but applies to a survey's coil not at all (a check was asked
 * for and could not be made); else 1 when a spec check failed, a threshold level was not
 * found on the fitted curve, or a fleet coil carries a history flag; else 3 when a spec
 * check is inconclusive (its 95 % interval straddles a tolerance limit: the guard-banded
 * decision rule of ISO 14253-1:2017 / JCGM 106:2012 neither accepts nor rejects); else 0.
 */
export function checksStatus(report: Report): number {
  let status: number = exitStatus.passed;
  for (const survey of report.surveys) {
    if (survey.spec?.applied === false) status = worseStatus(status, exitStatus.input);
    if (survey.verdict?.status === 'fail') status = worseStatus(status, exitStatus.failed);
    if (survey.verdict?.status === 'inconclusive') status = worseStatus(status, exitStatus.inconclusive);
    if (survey.thresholds.some((t) => t.distance === null)) status = worseStatus(status, exitStatus.failed);
  }
  if ((report.fleet?.coils ?? []).some((coil) => coil.flags.length > 0)) status = worseStatus(status, exitStatus.failed);
  return status;
}
