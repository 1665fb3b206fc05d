import { readFileSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { relativeImports, sourceFiles } from './source-imports';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const src = join(root, 'src');

/**
 * The layers under src/ and what each may import (DEVELOPERS.md, "Imports point one way"):
 * core ← io ← {cli, web, render}, render shared by cli and web, cli and web apart.
 * The rule is the project's own (issue #14), not an outside standard.
 */
const allowed: ReadonlyMap<string, readonly string[]> = new Map([
  ['core', ['core']],
  ['io', ['core', 'io']],
  ['render', ['core', 'io', 'render']],
  ['cli', ['core', 'io', 'render', 'cli']],
  ['web', ['core', 'io', 'render', 'web']],
]);

function layerOf(path: string): string {
  return relative(src, path).split(/[\\/]/)[0]!;
}

describe('import directions between the layers of src/', () => {
  it('each layer imports only the layers below it (render imports nothing of cli or web; cli and web never each other)', () => {
    const broken: string[] = [];
    for (const file of sourceFiles(src)) {
      const layer = layerOf(file);
      const may = allowed.get(layer);
      if (!may) continue; // src/index.ts, the library surface
      for (const specifier of relativeImports(readFileSync(file, 'utf8'))) {
        const target = resolve(dirname(file), specifier);
        const targetLayer = relative(src, target).startsWith('..') ? '(outside src)' : layerOf(target);
        if (targetLayer === '(outside src)' && specifier.includes('node_modules')) { broken.push(`${relative(root, file)} reaches into node_modules by a relative path: ${specifier}`); continue; }
        if (targetLayer !== '(outside src)' && !may.includes(targetLayer)) broken.push(`${relative(root, file)} (${layer}) imports ${specifier} (${targetLayer})`);
      }
    }
    expect(broken).toEqual([]);
  });

  it('finds the imports it checks (a sanity check of the scanner)', () => {
    // the scanner's own cases, written here: static, re-export, side-effect and dynamic imports
    expect(relativeImports("import { a } from './a';\nexport { b } from '../b';\nimport './c';\nconst d = await import('./d?raw');")).toEqual(['./a', '../b', './c', './d?raw']);
  });
});
