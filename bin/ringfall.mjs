#!/usr/bin/env node
// Entry point installed as the package's bin.
// - From the package (no src/ beside dist/): dist/cli.js, built at `npm pack`
//   (scripts/build-package.ts); its batch workers start dist/batch-worker.js.
// - From a checkout (src/ present): the current sources through tsx (a devDependency),
//   unless dist/cli.js was built after the last change to any source file (mtimes; after
//   `npm run build:package`), so `npx ringfall` never runs stale code.
//   RINGFALL_LOADER=tsx always takes the sources. --debug says which one ran, and why.
import { existsSync, mkdtempSync, readdirSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const built = join(root, 'dist', 'cli.js');
const sources = join(root, 'src');
const debug = process.argv.includes('--debug');

/** The newest non-test source file under `folder`: [path, mtime in ms]. */
function newestSource(folder) {
  let newest = ['', 0];
  for (const entry of readdirSync(folder, { withFileTypes: true })) {
    const path = join(folder, entry.name);
    const candidate = entry.isDirectory()
      ? newestSource(path)
      : /\.(ts|mjs|css)$/.test(entry.name) && !entry.name.endsWith('.test.ts') ? [path, statSync(path).mtimeMs] : newest;
    if (candidate[1] > newest[1]) newest = candidate;
  }
  return newest;
}

/** Why the sources run instead of dist/cli.js, or null to run dist/cli.js. */
function reasonForSources() {
  if (!existsSync(sources)) return null;
  if (process.env.RINGFALL_LOADER === 'tsx') return 'RINGFALL_LOADER=tsx';
  if (!existsSync(built)) return 'no dist/cli.js in this checkout';
  const [path, time] = newestSource(sources);
  return time > statSync(built).mtimeMs ? `${relative(root, path)} is newer than dist/cli.js` : null;
}

/** True when a folder can be made (and removed) in the system's temporary folder. */
function temporaryFolderWritable() {
  try {
    rmSync(mkdtempSync(join(tmpdir(), 'ringfall-probe-')), { recursive: true, force: true });
    return true;
  } catch {
    return false;
  }
}

async function loadMain() {
  const reason = reasonForSources();
  if (reason === null) {
    if (debug) process.stderr.write(`ringfall: running ${built}\n`);
    return import(pathToFileURL(built).href);
  }
  if (debug) process.stderr.write(`ringfall: running the sources through tsx (${reason})\n`);
  let register;
  try {
    ({ register } = await import('tsx/esm/api'));
  } catch {
    process.stderr.write(`ringfall: ${reason}, and tsx is not installed to run the sources. Run npm install in ${root}, or npm run build:package.\n`);
    process.exit(2);
  }
  // tsx caches compiled sources in the temporary folder and spins when it cannot write
  // there (a read-only or missing TMPDIR): then it runs without its cache
  if (!temporaryFolderWritable()) process.env.TSX_DISABLE_CACHE = '1';
  register();
  return import('../src/cli/main.ts');
}

if (debug) process.setSourceMapsEnabled(true);
const { main } = await loadMain();
process.exitCode = await main(process.argv);
