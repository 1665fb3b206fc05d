import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';

/** Every source file under `folder` (.ts, .mts, .mjs), tests left out. */
export function sourceFiles(folder: string): string[] {
  return readdirSync(folder, { withFileTypes: true }).flatMap((entry) => {
    const path = join(folder, entry.name);
    if (entry.isDirectory()) return sourceFiles(path);
    return /\.(ts|mts|mjs)$/.test(entry.name) && !entry.name.endsWith('.test.ts') ? [path] : [];
  });
}

/** Relative module specifiers of `import … from '…'`, `export … from '…'` and `import('…')`. */
export function relativeImports(text: string): string[] {
  const found: string[] = [];
  for (const match of text.matchAll(/(?:\bfrom\s*|\bimport\s*\(\s*|^\s*import\s+)'(\.{1,2}\/[^']*)'/gm)) found.push(match[1]!);
  return found;
}

/** The file a relative specifier names: X.ts, X/index.ts or X itself; null for a Vite query (?raw) or a file outside the sources. */
export function resolveImport(fromFolder: string, specifier: string): string | null {
  if (specifier.includes('?')) return null;
  const base = join(fromFolder, specifier);
  for (const candidate of [`${base}.ts`, join(base, 'index.ts'), base]) if (existsSync(candidate) && statSync(candidate).isFile()) return candidate;
  return null;
}
