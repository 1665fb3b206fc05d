/**
 * User text (a header cell, a cell value, a coil id, a file name, an option value) as it
 * may appear inside a one-line message or a line of the text report: every character
 * that could break the line or drive a terminal is shown escaped, so one message stays
 * one line and an ESC sequence in a file cannot recolour, move or clear the terminal.
 *
 * Escaped: C0 controls (U+0000–U+001F) as `\n`, `\r`, `\t` or `\xHH`; DEL and the C1
 * controls (U+007F–U+009F, where CSI U+009B starts a sequence on some terminals) as
 * `\xHH`; the Unicode line and paragraph separators and the bidirectional controls
 * (U+061C, U+200E–U+200F, U+202A–U+202E, U+2066–U+2069: "Trojan Source", CVE-2021-42574)
 * as `\uHHHH`. Backslashes are kept as written, so Windows paths read as typed.
 * With `limit`, text longer than that many characters is cut, saying how long it was.
 * Linear in the length of the text.
 *
 * @example printable('B\r\n(mT)\u001b[2J') // 'B\\r\\n(mT)\\x1b[2J'
 */
export function printable(text: string, limit?: number): string {
  const cut = limit !== undefined && text.length > limit;
  const shown = cut ? text.slice(0, limit) : text;
  let out = '';
  let from = 0;
  for (let i = 0; i < shown.length; i += 1) {
    const code = shown.charCodeAt(i);
    if (!needsEscape(code)) continue;
    out += shown.slice(from, i) + escapeOne(code);
    from = i + 1;
  }
  out = from === 0 ? shown : out + shown.slice(from);
  return cut ? `${out}… (${text.length} characters)` : out;
}

/** True when the text holds a character {@link printable} would escape. */
export function hasControlCharacters(text: string): boolean {
  for (let i = 0; i < text.length; i += 1) if (needsEscape(text.charCodeAt(i))) return true;
  return false;
}

function needsEscape(code: number): boolean {
  if (code < 0x20) return true;
  if (code < 0x7f) return false;
  if (code <= 0x9f) return true;
  if (code < 0x61c) return false;
  return code === 0x61c || code === 0x200e || code === 0x200f || code === 0x2028 || code === 0x2029 ||
    (code >= 0x202a && code <= 0x202e) || (code >= 0x2066 && code <= 0x2069);
}

function escapeOne(code: number): string {
  if (code === 10) return '\\n';
  if (code === 13) return '\\r';
  if (code === 9) return '\\t';
  return code <= 0xff ? `\\x${code.toString(16).padStart(2, '0')}` : `\\u${code.toString(16).padStart(4, '0')}`;
}
