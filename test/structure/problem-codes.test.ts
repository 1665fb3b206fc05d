import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { isProblemCode, problemCodes } from '../../src/core/error-codes';

const root = join(import.meta.dirname, '..', '..');

function sources(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return sources(path);
    return entry.name.endsWith('.ts') && !entry.name.endsWith('.test.ts') ? [path] : [];
  });
}

/** Quoted upper-case words with an underscore that are not problem codes: environment variable names and a code prefix. */
const notCodes = new Set(['RINGFALL_TEST_WRITE_LIMIT', 'SOURCE_DATE_EPOCH', 'FIT_POSITION']);

describe('problem codes: one table (src/core/error-codes.ts), used and documented', () => {
  const code = sources(join(root, 'src')).filter((path) => !path.endsWith('error-codes.ts')).map((path) => readFileSync(path, 'utf8')).join('\n');
  const literals = new Set([...code.matchAll(/'([A-Z][A-Z0-9]*(?:_[A-Z0-9]+)+)'/g)].map((m) => m[1]!));

  it('every code-like literal in the sources is in the table', () => {
    expect([...literals].filter((text) => !notCodes.has(text) && !isProblemCode(text))).toEqual([]);
  });

  it('every code in the table is used somewhere', () => {
    expect(Object.keys(problemCodes).filter((c) => !literals.has(c))).toEqual([]);
  });

  it('is not fooled by prototype names', () => {
    expect(isProblemCode('constructor')).toBe(false);
    expect(isProblemCode('__proto__')).toBe(false);
  });

  it('docs/CONTRACT.md "Problem codes" lists exactly the table, in order, with the same meanings', () => {
    const contract = readFileSync(join(root, 'docs', 'CONTRACT.md'), 'utf8');
    const section = /<!-- problem-codes:start -->\n([\s\S]*?)\n<!-- problem-codes:end -->/.exec(contract)?.[1];
    const expected = ['| code | meaning |', '|---|---|', ...Object.entries(problemCodes).map(([c, meaning]) => `| \`${c}\` | ${meaning} |`)].join('\n');
    expect(section).toBe(expected);
  });
});
