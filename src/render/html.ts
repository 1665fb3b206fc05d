/**
 * Safe HTML building: the `html` tagged template escapes every interpolated value
 * unless it is already `SafeHtml`, so text from survey files (coil ids, notes, column
 * names) can never become markup. Works the same in the browser and in Node.
 */

/** A string known to be markup we built ourselves. */
export class SafeHtml {
  constructor(readonly value: string) {}
  toString(): string {
    return this.value;
  }
}

const entities: Readonly<Record<string, string>> = {
  '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;',
};

/** Escape text for an HTML text node or a quoted attribute value (OWASP rule #1/#2). */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (character) => entities[character]!);
}

/** A value the template accepts: text (escaped), numbers, SafeHtml, lists of these, or nothing. */
export type HtmlValue = string | number | SafeHtml | null | undefined | false | readonly HtmlValue[];

function render(value: HtmlValue): string {
  if (value === null || value === undefined || value === false) return '';
  if (value instanceof SafeHtml) return value.value;
  if (Array.isArray(value)) return value.map(render).join('');
  return escapeHtml(String(value));
}

/** Tagged template: `html\`<td>${coil}</td>\`` escapes `coil`. */
export function html(strings: TemplateStringsArray, ...values: HtmlValue[]): SafeHtml {
  let out = strings[0] ?? '';
  for (let i = 0; i < values.length; i++) out += render(values[i]!) + (strings[i + 1] ?? '');
  return new SafeHtml(out);
}

/** Trust a string as markup. Only for markup this program generated (SVG paths, CSS). */
export function trusted(markup: string): SafeHtml {
  return new SafeHtml(markup);
}

/**
 * JSON for an inline `<script type="application/json">`: `<`, `>`, `&` and the line
 * separators become \u escapes so no file text can close the script element. With
 * `significant`, numbers are rounded to that many significant digits (chart data).
 */
export function inlineJson(value: unknown, options: { readonly significant?: number } = {}): SafeHtml {
  const digits = options.significant;
  // numbers for drawing need no more digits than a screen shows: fewer make a fleet's pages far smaller
  const replacer = digits === undefined ? undefined : (_key: string, item: unknown) => (typeof item === 'number' && Number.isFinite(item) && item !== 0 ? Number(item.toPrecision(digits)) : item);
  const text = JSON.stringify(value, replacer).replace(/[<>&\u2028\u2029]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
  return new SafeHtml(text);
}
