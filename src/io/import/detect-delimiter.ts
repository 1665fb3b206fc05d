/** Delimiters ringfall reads, in order of preference when two explain the file equally. */
const candidates = ['\t', ';', ','] as const;

export type Delimiter = (typeof candidates)[number];

/**
 * Choose the delimiter: the candidate (tab, semicolon, comma) that splits the header into
 * at least two fields and gives the same number of fields on the most sample lines.
 * Ties go to tab, then semicolon: a "12,5" decimal comma in a semicolon file gives
 * comma-split lines a spurious extra field, while a tab or semicolon in a header is
 * rarely there by accident. A one-column header falls back to comma (the column checks
 * then say what is missing).
 *
 * @param headerText the header line
 * @param sampleLines up to ten data lines after it
 * @example detectDelimiter('distance (mm);B (mT)', ['10;1,25']) // ';'
 */
export function detectDelimiter(headerText: string, sampleLines: readonly string[]): Delimiter {
  let best: Delimiter = ',';
  let bestScore = -1;
  for (const delimiter of candidates) {
    const width = countFields(headerText, delimiter);
    if (width < 2) continue;
    const score = sampleLines.filter((line) => countFields(line, delimiter) === width).length;
    if (score > bestScore) {
      best = delimiter;
      bestScore = score;
    }
  }
  return best;
}

/** Number of fields in one line, not counting delimiters inside double quotes. */
export function countFields(line: string, delimiter: string): number {
  let fields = 1;
  let quoted = false;
  for (const character of line) {
    if (character === '"') quoted = !quoted;
    else if (character === delimiter && !quoted) fields += 1;
  }
  return fields;
}
