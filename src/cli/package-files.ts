import { fileURLToPath } from 'node:url';

/**
 * Where the CLI's own files are, from the sources or from the build. The sources run
 * through tsx or vitest (this module's URL ends in `.ts`, at src/cli/); the package runs
 * dist/cli.js, into which esbuild bundles this module (its URL is then a file directly
 * in dist/, scripts/build-package.ts). The build keeps every output file in dist/ itself,
 * so `../` from any of them is the package root.
 */
const fromSources = import.meta.url.endsWith('.ts');

/** The package root (the folder holding package.json and sample-data/), with a trailing separator. */
export const packageRoot = fileURLToPath(new URL(fromSources ? '../../' : '../', import.meta.url));

/**
 * The batch worker's entry file: dist/batch-worker.js, built as its own file; from the
 * sources, batch-worker-entry.mjs, which registers tsx in the worker thread first.
 */
export function batchWorkerEntry(): URL {
  return new URL(fromSources ? './batch/batch-worker-entry.mjs' : './batch-worker.js', import.meta.url);
}
