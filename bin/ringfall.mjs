#!/usr/bin/env node
// Entry point installed as the package's bin. Runs the TypeScript CLI with no build step:
// - fast path: src/cli/main.ts bundled by esbuild into one ES module, cached in
//   node_modules/.cache/ringfall/ under a hash of every source file under src/, of this
//   file and of esbuild's version, so it is rebuilt (~0.2 s) only after a change; a cached start takes
//   ~0.25 s against ~0.75 s through tsx. `import.meta.url` keeps each file's own URL.
// - fallback: tsx's loader, when the bundle cannot be made or loaded, or when
//   RINGFALL_LOADER=tsx is set.
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, readdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const source = join(root, 'src');

/** Every .ts file under src/ except tests, sorted, for the cache key. */
function sourceFiles(folder) {
  const found = [];
  for (const entry of readdirSync(folder, { withFileTypes: true })) {
    const path = join(folder, entry.name);
    if (entry.isDirectory()) found.push(...sourceFiles(path));
    else if (entry.name.endsWith('.ts') && !entry.name.endsWith('.test.ts')) found.push(path);
  }
  return found.sort();
}

/** The cached bundle's path, building it first when the sources changed. */
async function cachedBundle() {
  // esbuild's version from its package.json: loading esbuild itself costs more than a cached start
  const { version } = JSON.parse(readFileSync(join(root, 'node_modules', 'esbuild', 'package.json'), 'utf8'));
  // this file too: a change to the build options below makes a new bundle
  const hash = createHash('sha256').update(`esbuild ${version}\n`).update(readFileSync(fileURLToPath(import.meta.url)));
  for (const file of sourceFiles(source)) hash.update(`${file}\n`).update(readFileSync(file));
  const folder = join(root, 'node_modules', '.cache', 'ringfall');
  const bundle = join(folder, `cli-${hash.digest('hex').slice(0, 20)}.mjs`);
  if (existsSync(bundle)) return bundle;
  const { default: esbuild } = await import('esbuild');
  const keepFileUrls = {
    name: 'keep-import-meta-url',
    setup(build) {
      build.onLoad({ filter: /\.ts$/ }, (args) => ({
        contents: readFileSync(args.path, 'utf8').replaceAll('import.meta.url', JSON.stringify(pathToFileURL(args.path).href)),
        loader: 'ts',
      }));
    },
  };
  const result = await esbuild.build({
    entryPoints: [join(source, 'cli', 'main.ts')],
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    packages: 'external',
    sourcemap: 'linked',
    outfile: bundle,
    write: false,
    logLevel: 'silent',
    plugins: [keepFileUrls],
  });
  mkdirSync(folder, { recursive: true });
  // the source map (read only under --debug) first, then the module; each written then
  // renamed, so processes started together never read a half-written file
  const ordered = [...result.outputFiles].sort((a, b) => Number(b.path.endsWith('.map')) - Number(a.path.endsWith('.map')));
  for (const output of ordered) {
    const partial = `${output.path}.${process.pid}.partial`;
    writeFileSync(partial, output.text);
    renameSync(partial, output.path);
  }
  // bundles of earlier sources are not needed again (files still being written are left alone)
  for (const name of readdirSync(folder)) {
    if (name.startsWith('cli-') && !name.endsWith('.partial') && !bundle.endsWith(name.replace(/\.map$/, ''))) rmSync(join(folder, name), { force: true });
  }
  return bundle;
}

async function loadMain() {
  if (process.env.RINGFALL_LOADER !== 'tsx') {
    try {
      return await import(pathToFileURL(await cachedBundle()).href);
    } catch (error) {
      // fall through to tsx (~0.5 s slower per start); --debug says why
      if (process.argv.includes('--debug')) process.stderr.write(`ringfall: not using the cached CLI bundle (${error?.message ?? error}); loading through tsx\n`);
    }
  }
  const { register } = await import('tsx/esm/api');
  register();
  return import('../src/cli/main.ts');
}

if (process.argv.includes('--debug')) process.setSourceMapsEnabled(true);
const { main } = await loadMain();
process.exitCode = await main(process.argv);
