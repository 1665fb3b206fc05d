/**
 * `npm run build:package`, and npm's `prepack` (so `npm pack` and `npm publish` ship a
 * fresh build): writes dist/, what the package runs. The checkout itself needs no build
 * (bin/ringfall.mjs runs the sources through tsx when dist/ is missing or older).
 * - dist/cli.js (the `ringfall` command), dist/batch-worker.js (a batch worker thread's
 *   entry file) and dist/index.js (the library): ES modules bundled by esbuild with the
 *   npm packages left as imports (they are the package's dependencies), code they share
 *   split into dist/chunk-*.js. Every output sits directly in dist/, which
 *   src/cli/package-files.ts relies on to find the package root and the worker.
 * - dist/index.d.ts and the declarations it imports, by tsc (tsconfig.build.json), with
 *   `.js` written onto relative imports so that a consumer's TypeScript resolves them
 *   under `moduleResolution` NodeNext as well as Bundler.
 * Built into a scratch folder, then renamed over dist/, so a CLI started meanwhile never
 * sees half a build.
 *
 * `npx tsx scripts/build-package.ts [OUTDIR]` builds elsewhere (tests).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const target = resolve(process.argv[2] ?? join(root, 'dist'));
const staging = `${target}.partial-${process.pid}`;

rmSync(staging, { recursive: true, force: true });
try {
  await build({
    absWorkingDir: root,
    entryPoints: { cli: 'src/cli/main.ts', 'batch-worker': 'src/cli/batch/batch-worker.ts', index: 'src/index.ts' },
    outdir: staging,
    bundle: true,
    splitting: true,
    chunkNames: 'chunk-[hash]',
    format: 'esm',
    platform: 'node',
    target: 'node20',
    packages: 'external',
    logLevel: 'warning',
  });
  const tsc = spawnSync(process.execPath, [join(root, 'node_modules', 'typescript', 'bin', 'tsc'), '-p', join(root, 'tsconfig.build.json'), '--outDir', staging], { cwd: root, encoding: 'utf8' });
  if (tsc.status !== 0) throw new Error(`tsc could not write the declarations:\n${tsc.stdout}${tsc.stderr}`);
  for (const file of declarationFiles(staging)) writeFileSync(file, withJsExtensions(file, readFileSync(file, 'utf8')));
  rmSync(target, { recursive: true, force: true });
  renameSync(staging, target);
} catch (error) {
  rmSync(staging, { recursive: true, force: true });
  throw error;
}
// stderr: `npm pack --json` prints its JSON on stdout, after prepack
process.stderr.write(`built ${target}\n`);

function declarationFiles(folder: string): string[] {
  return readdirSync(folder, { withFileTypes: true }).flatMap((entry) => {
    const path = join(folder, entry.name);
    if (entry.isDirectory()) return declarationFiles(path);
    return entry.name.endsWith('.d.ts') ? [path] : [];
  });
}

/**
 * The declaration text with each relative specifier (`from './x'`, `import('./x')`)
 * naming its file as Node's ESM resolution wants it: `./x.js` or `./x/index.js`.
 */
function withJsExtensions(file: string, text: string): string {
  return text.replace(/(\bfrom\s+|\bimport\s*\(\s*|\bimport\s+)(['"])(\.{1,2}\/[^'"]*)\2/g, (_match, before: string, quote: string, specifier: string) => {
    const base = resolve(dirname(file), specifier);
    const resolved = existsSync(`${base}.d.ts`) ? `${specifier}.js` : existsSync(join(base, 'index.d.ts')) ? `${specifier}/index.js` : null;
    if (resolved === null) throw new Error(`${file}: cannot find the declarations of "${specifier}"`);
    return `${before}${quote}${resolved}${quote}`;
  });
}
