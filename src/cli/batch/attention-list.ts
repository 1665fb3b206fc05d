import type { FleetRow } from './fleet-rows';
import type { UnreadableEntry } from './batch-types';

/** One thing in the fleet that needs someone's attention, with the sentences that show why. */
export interface AttentionItem {
  /** A coil (or a survey without a coil id), or the files that could not be used. */
  readonly kind: 'coil' | 'unreadable';
  /** Coil id, the survey file for a survey without a coil id, or "files not used". */
  readonly subject: string;
  /** Short reasons, most severe first: "failed its spec (degraded)", "degrading −54 A/yr". */
  readonly reasons: readonly string[];
  /** Evidence sentences from the fleet history and the spec verdict: the first for each reason, then the rest. */
  readonly evidence: readonly string[];
  readonly severity: number;
}

/**
 * Severity of each reason, highest first. A coil that fails its label now is out of spec
 * in service; a geometry change means the unit on the bench is not the one on record
 * (swapped or mislabeled); a degrading trend is beyond tolerance but found by the trend;
 * a file that could not be used leaves its coil unchecked; an inconclusive check, a
 * threshold not found or an unfitted survey needs another look before anything can be said. Our own ranking (common practice: act on failures before trends before gaps).
 */
const severity = {
  failedSpec: 5,
  geometryChanged: 4,
  degrading: 3,
  unreadable: 2.5,
  inconclusive: 2,
  notFitted: 1,
} as const;

/**
 * What needs attention first: every coil (or survey without a coil id) with a failed
 * spec, a history flag, an inconclusive spec check, a threshold level not found on its
 * fitted curve or no converged model — the reasons `fit` and `batch` exit 1 for — and one item
 * for the files or parts that could not be used; ordered by the most severe reason, then
 * by the number of reasons, then by the fastest relative decline of ampere-turns, then
 * in summary order (stable, so the list is deterministic).
 */
export function attentionList(rows: readonly FleetRow[], unreadable: readonly Pick<UnreadableEntry, 'source' | 'reason'>[]): AttentionItem[] {
  const items: { item: AttentionItem; decline: number; order: number }[] = [];
  rows.forEach((row, order) => {
    const reasons: { text: string; severity: number; evidence: readonly string[] }[] = [];
    const flags = row.history?.flags ?? [];
    const verdict = row.latest.verdict;
    const flagSentences = (flag: string) => (row.history?.explanations ?? []).filter((s) => s.startsWith(`${flag}:`));
    if (flags.includes('failed-spec') || (row.history === null && verdict?.status === 'fail')) {
      const findings = verdict?.findings.length ? ` (${verdict.findings.join(', ')})` : '';
      reasons.push({ text: `failed its spec${findings}`, severity: severity.failedSpec, evidence: verdict?.explanations ?? [] });
    }
    if (flags.includes('geometry-changed')) {
      reasons.push({ text: 'geometry changed between surveys', severity: severity.geometryChanged, evidence: flagSentences('geometry-changed') });
    }
    const trend = row.history?.trend.ampereTurnsPerYear ?? null;
    if (flags.includes('degrading')) {
      reasons.push({ text: 'degrading' + (trend ? ` ${Math.round(trend.value)} A/yr` : ''), severity: severity.degrading, evidence: flagSentences('degrading') });
    }
    for (const flag of flags) {
      if (flag === 'failed-spec' || flag === 'geometry-changed' || flag === 'degrading') continue;
      reasons.push({ text: flag, severity: severity.inconclusive, evidence: flagSentences(flag) });
    }
    if (verdict?.status === 'inconclusive') {
      reasons.push({ text: 'spec check inconclusive', severity: severity.inconclusive, evidence: verdict.explanations });
    }
    const missing = row.latest.thresholds.filter((t) => t.distance === null);
    if (missing.length > 0) {
      reasons.push({ text: `${missing.length === 1 ? 'a threshold level was' : `${missing.length} threshold levels were`} not found on the fitted curve`, severity: severity.notFitted, evidence: missing.flatMap((t) => t.notes.slice(0, 1)) });
    }
    if (row.latest.best === null) {
      reasons.push({ text: 'no model converged on the latest survey', severity: severity.notFitted, evidence: row.latest.warnings });
    }
    if (reasons.length === 0) return;
    reasons.sort((a, b) => b.severity - a.severity);
    const evidence = [...reasons.flatMap((r) => r.evidence.slice(0, 1)), ...reasons.flatMap((r) => r.evidence.slice(1))];
    const reference = row.history?.reference?.ampereTurns ?? null;
    const decline = trend && reference ? trend.value / Math.abs(reference) : 0;
    items.push({
      item: { kind: 'coil', subject: row.coil ?? row.latest.source, reasons: reasons.map((r) => r.text), evidence: [...new Set(evidence)], severity: reasons[0]!.severity },
      decline,
      order,
    });
  });
  if (unreadable.length > 0) {
    const what = unreadable.length === 1 ? '1 file or part' : `${unreadable.length} files or parts`;
    items.push({
      item: { kind: 'unreadable', subject: 'files not used', reasons: [`${what} could not be used, so the coils in them were not checked`], evidence: unreadable.map((entry) => `${entry.source}: ${entry.reason}`), severity: severity.unreadable },
      decline: 0,
      order: rows.length,
    });
  }
  items.sort((a, b) => b.item.severity - a.item.severity || b.item.reasons.length - a.item.reasons.length || a.decline - b.decline || a.order - b.order);
  return items.map((entry) => entry.item);
}
