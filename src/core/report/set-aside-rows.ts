import type { RejectedRow } from '../survey/survey';

/** A row outside any survey (bad date or reading type, commented out, unclosed quote …) and its file. */
export interface SetAsideRow extends RejectedRow {
  /** The file it came from, as given. */
  readonly source: string;
}

/** Lines named one by one in a summary sentence; the rest are counted. */
const linesListed = 10;

/**
 * One sentence per kind of problem (per code) for rows that belong to no survey, so a
 * human report stays short however many rows a file sets aside: how many, which lines,
 * and the first row's reason as the example. The JSON report lists every row (`rejected`).
 *
 * @example summarizeSetAsideRows([{ line: 4, column: null, value: null, code: 'ROW_COMMENTED', reason: 'the row is commented out' }])
 *   // ['Line 4 belongs to no survey and was not used: the row is commented out']
 */
export function summarizeSetAsideRows(rows: readonly RejectedRow[]): string[] {
  const byCode = new Map<string, RejectedRow[]>();
  for (const row of rows) {
    const key = row.code ?? row.reason;
    const group = byCode.get(key);
    if (group) group.push(row);
    else byCode.set(key, [row]);
  }
  return [...byCode.values()].map((group) => {
    const first = group[0]!;
    if (group.length === 1) return `Line ${first.line} belongs to no survey and was not used: ${first.reason}`;
    const listed = group.slice(0, linesListed).map((row) => row.line).join(', ');
    const more = group.length > linesListed ? ` and ${group.length - linesListed} more` : '';
    return `${group.length} rows belong to no survey and were not used (lines ${listed}${more}; every one is listed in the JSON report's "rejected"). ` +
      `Line ${first.line}: ${first.reason}`;
  });
}
