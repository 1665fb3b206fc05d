/** Share of unreadable characters above which text is taken for a binary file. */
const unreadableShare = 0.05;

/**
 * Decide whether decoded text is really a binary file (a spreadsheet workbook, a PDF, a
 * UTF-16 file read as UTF-8): any NUL character, or more than 5 % of the sample being
 * control characters (other than tab, CR, LF, FF) or U+FFFD replacement characters
 * left by invalid UTF-8. Our own rule of thumb, in the spirit of the NUL test git and
 * grep use to call a file binary.
 *
 * @param sample the first few kilobytes of the text
 * @returns a description of what was found, or null for text
 */
export function looksBinary(sample: string): string | null {
  if (sample.startsWith('PK\u0003\u0004')) return 'a ZIP container (a spreadsheet workbook such as .xlsx)';
  if (sample.startsWith('%PDF')) return 'a PDF document';
  if (sample.includes('\u0000')) return 'NUL characters (a binary file, or text saved as UTF-16)';
  let unreadable = 0;
  for (let i = 0; i < sample.length; i += 1) {
    const code = sample.charCodeAt(i);
    if ((code < 0x20 && code !== 0x09 && code !== 0x0a && code !== 0x0d && code !== 0x0c) || code === 0x7f || code === 0xfffd) {
      unreadable += 1;
    }
  }
  if (sample.length > 0 && unreadable / sample.length > unreadableShare) {
    return `${unreadable} unreadable characters in the first ${sample.length}`;
  }
  return null;
}
