import { readFileSync } from 'node:fs';
import { dirname, join, relative, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { relativeImports, resolveImport, sourceFiles } from './source-imports';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const src = join(root, 'src');

/** Each source file's relative imports, type-only ones included, as paths from src/. */
function importGraph(): Map<string, string[]> {
  const graph = new Map<string, string[]>();
  for (const file of sourceFiles(src)) {
    const targets = relativeImports(readFileSync(file, 'utf8'))
      .map((specifier) => resolveImport(dirname(file), specifier))
      .filter((target): target is string => target !== null && !relative(src, target).startsWith('..'))
      .map((target) => relative(src, target).split(sep).join('/'));
    graph.set(relative(src, file).split(sep).join('/'), targets);
  }
  return graph;
}

/** Strongly connected sets of more than one file (Tarjan, SIAM J. Comput. 1 (1972) 146), or a file importing itself. */
function cycles(graph: ReadonlyMap<string, readonly string[]>): string[][] {
  const index = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const onStack = new Set<string>();
  const found: string[][] = [];
  const visit = (node: string): void => {
    index.set(node, index.size);
    low.set(node, index.get(node)!);
    stack.push(node);
    onStack.add(node);
    for (const next of graph.get(node) ?? []) {
      if (!graph.has(next)) continue;
      if (!index.has(next)) {
        visit(next);
        low.set(node, Math.min(low.get(node)!, low.get(next)!));
      } else if (onStack.has(next)) low.set(node, Math.min(low.get(node)!, index.get(next)!));
    }
    if (low.get(node) !== index.get(node)) return;
    const set: string[] = [];
    let member: string;
    do {
      member = stack.pop()!;
      onStack.delete(member);
      set.push(member);
    } while (member !== node);
    if (set.length > 1 || graph.get(node)!.includes(node)) found.push(set.sort());
  };
  for (const node of graph.keys()) if (!index.has(node)) visit(node);
  return found;
}

describe('import cycles and the inner folders of core', () => {
  it('no file of src/ reaches itself through imports, type-only imports included', () => {
    expect(cycles(importGraph())).toEqual([]);
  });

  it('the least-squares engine imports nothing of the models; linalg and numeric only themselves', () => {
    // the project's own rules (issue #14, DEVELOPERS.md layout), not an outside standard
    const broken: string[] = [];
    for (const [file, targets] of importGraph()) {
      for (const target of targets) {
        if (file.startsWith('core/fit/engine/') && !/^core\/(fit\/engine|linalg|numeric|stats|random|errors)[/.]/.test(target)) broken.push(`${file} imports ${target}`);
        for (const folder of ['core/linalg/', 'core/numeric/']) if (file.startsWith(folder) && !target.startsWith(folder)) broken.push(`${file} imports ${target}`);
      }
    }
    expect(broken).toEqual([]);
  });

  it('inside core, folders import only folders below them (… models ← fit ← analysis ← report)', () => {
    // the project's own layering (issue #14, DEVELOPERS.md "Imports point one way")
    const rank = new Map<string, number>([
      ['text', 0], ['error-codes.ts', 0],
      ['errors.ts', 1], ['random', 1], ['linalg', 1], ['numeric', 1],
      ['physics', 2], ['stats', 2], ['survey', 2],
      ['units', 3],
      ['models', 4],
      ['fit', 5],
      ['analysis', 6],
      ['report', 7],
    ]);
    const folderOf = (path: string): string => path.split('/')[1]!;
    const unplaced = new Set<string>();
    const upward: string[] = [];
    for (const [file, targets] of importGraph()) {
      if (!file.startsWith('core/') || file.endsWith('.test.ts') || file.includes('/testing/')) continue;
      for (const target of targets) {
        if (!target.startsWith('core/')) continue;
        const [from, to] = [folderOf(file), folderOf(target)];
        for (const folder of [from, to]) if (!rank.has(folder) && folder !== 'index.ts') unplaced.add(folder);
        if (from !== to && rank.has(from) && rank.has(to) && rank.get(to)! >= rank.get(from)!) upward.push(`${file} imports ${target}`);
      }
    }
    expect([...unplaced]).toEqual([]);
    expect(upward).toEqual([]);
  });

  it('finds a cycle when there is one (a sanity check of the search)', () => {
    // hand-made graphs: a → b → c → a is one cycle, d → d another, e → a none
    const graph = new Map([['a', ['b']], ['b', ['c']], ['c', ['a']], ['d', ['d']], ['e', ['a']]]);
    expect(cycles(graph)).toEqual([['a', 'b', 'c'], ['d']]);
  });
});
