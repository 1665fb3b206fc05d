/**
 * Map every value in a JSON text to the 1-based line where it starts, keyed by its path
 * ("" for the root, "0.params.radius", "claims.1.field"), so that messages about a bad
 * spec can name the line. Scans the text once (strings, escapes, brackets, commas); it
 * assumes the text already parsed with JSON.parse.
 *
 * JSON.parse keeps only the last of two equal keys in one object (ECMA-262 JSON.parse,
 * InternalizeJSONProperty), silently; every repeat is pushed to `duplicateKeys` (path and
 * line of the repeat) so the caller can refuse it.
 *
 * @example jsonLineIndex('{\n "a": [1,\n 2]\n}').get('a.1') // 3
 */
export function jsonLineIndex(text: string, duplicateKeys?: { path: string; line: number }[]): Map<string, number> {
  const lines = new Map<string, number>();
  const stack: { kind: 'object' | 'array'; key: string; index: number; keys: Set<string> }[] = [];
  let line = 1;
  let pendingKey: string | null = null;
  let expectValue = true;
  const pathOf = (last: string | null): string => {
    const parts = stack.map((frame) => frame.key);
    if (last !== null) parts.push(last);
    return parts.filter((p) => p !== '').join('.');
  };
  const childName = (): string | null => {
    const top = stack[stack.length - 1];
    if (!top) return null;
    return top.kind === 'array' ? String(top.index) : pendingKey ?? '';
  };
  const markValue = (): string => {
    const path = stack.length === 0 ? '' : pathOf(childName());
    if (!lines.has(path)) lines.set(path, line);
    return path;
  };
  for (let i = 0; i < text.length; i += 1) {
    const c = text[i]!;
    if (c === '\n') {
      line += 1;
      continue;
    }
    if (c === ' ' || c === '\t' || c === '\r') continue;
    const top = stack[stack.length - 1];
    if (c === '"') {
      let j = i + 1;
      let value = '';
      while (j < text.length && text[j] !== '"') {
        if (text[j] === '\\') {
          value += text.slice(j, j + 2);
          j += 2;
        } else {
          value += text[j];
          j += 1;
        }
      }
      if (top?.kind === 'object' && !expectValue) {
        pendingKey = JSON.parse(`"${value}"`) as string;
        if (top.keys.has(pendingKey)) duplicateKeys?.push({ path: pathOf(pendingKey), line });
        top.keys.add(pendingKey);
      } else {
        markValue();
        expectValue = false;
      }
      i = j;
      continue;
    }
    if (c === ':') {
      expectValue = true;
      continue;
    }
    if (c === ',') {
      if (top?.kind === 'array') {
        top.index += 1;
        expectValue = true;
      } else expectValue = false;
      continue;
    }
    if (c === '{' || c === '[') {
      const path = markValue();
      const key = stack.length === 0 ? '' : path.split('.').pop() ?? '';
      stack.push({ kind: c === '{' ? 'object' : 'array', key: stack.length === 0 ? '' : key, index: 0, keys: new Set() });
      pendingKey = null;
      expectValue = c === '[';
      continue;
    }
    if (c === '}' || c === ']') {
      stack.pop();
      expectValue = false;
      continue;
    }
    // number, true, false, null
    markValue();
    expectValue = false;
    while (i + 1 < text.length && /[^\s,\]}]/.test(text[i + 1]!)) i += 1;
  }
  return lines;
}
