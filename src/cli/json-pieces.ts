/**
 * JSON text in pieces: the bytes of `JSON.stringify(value, null, 2)` (with every line after
 * the first indented by `pad`), but a large array or object is opened up and written part
 * by part, so a fleet section or run record of 50,000 entries never becomes one giant
 * string. A part that is small (at most `smallNodes` values in all) is stringified whole:
 * few pieces, and JSON.stringify's own rules for it. Containers are opened only when they
 * are plain (arrays, and objects without a toJSON method), where the rules are the simple
 * ones below: keys in Object.keys order, a value JSON cannot hold (undefined, a function,
 * a symbol) left out of an object and null in an array, "[]" and "{}" when empty.
 */
export function* jsonPieces(value: unknown, pad = ''): Generator<string> {
  if (!openable(value) || isSmall(value)) {
    yield indentLines(JSON.stringify(value, null, 2), pad);
    return;
  }
  const inner = `${pad}  `;
  if (Array.isArray(value)) {
    if (value.length === 0) {
      yield '[]';
      return;
    }
    for (let i = 0; i < value.length; i++) {
      yield i === 0 ? `[\n${inner}` : `,\n${inner}`;
      const item: unknown = value[i];
      // an element JSON cannot hold is null in an array, as JSON.stringify writes it
      yield* jsonText(item) === undefined ? ['null'] : jsonPieces(item, inner);
    }
    yield `\n${pad}]`;
    return;
  }
  let opened = false;
  for (const key of Object.keys(value)) {
    const item: unknown = (value as Record<string, unknown>)[key];
    if (jsonText(item) === undefined) continue;
    yield `${opened ? ',' : '{'}\n${inner}${JSON.stringify(key)}: `;
    opened = true;
    yield* jsonPieces(item, inner);
  }
  yield opened ? `\n${pad}}` : '{}';
}

/** Values at most in a part stringified whole. */
const smallNodes = 256;

/** An array, or an object without toJSON: JSON.stringify writes its own parts by the simple rules. */
function openable(value: unknown): value is object {
  if (typeof value !== 'object' || value === null) return false;
  return typeof (value as { toJSON?: unknown }).toJSON !== 'function';
}

/** Undefined for a value JSON.stringify leaves out (undefined, a function, a symbol); else any string (not the text). */
function jsonText(value: unknown): string | undefined {
  if (value === undefined || typeof value === 'function' || typeof value === 'symbol') return undefined;
  // an object with toJSON may turn into anything: ask JSON.stringify (such objects are small)
  return openable(value) || typeof value !== 'object' || value === null ? '' : JSON.stringify(value);
}

/** True when `value` holds at most smallNodes values, counting itself (stops counting past that). */
function isSmall(value: object): boolean {
  let left = smallNodes;
  const stack: unknown[] = [value];
  while (stack.length > 0) {
    const next = stack.pop();
    if (--left < 0) return false;
    if (typeof next === 'object' && next !== null) {
      for (const key in next) stack.push((next as Record<string, unknown>)[key]);
    }
  }
  return true;
}

function indentLines(text: string | undefined, pad: string): string {
  if (text === undefined) throw new Error('jsonPieces: a value JSON cannot hold was given on its own');
  return pad === '' ? text : text.replace(/\n/g, `\n${pad}`);
}
