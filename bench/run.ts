/**
 * `npm run bench`: runs every bench/*.bench.ts in its own Node process (so one
 * benchmark's memory and JIT state do not colour another's) and prints their figures.
 * Pass names to run a subset: `npm run bench -- physics fit`.
 */
import { spawnSync } from 'node:child_process';
import { readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const wanted = process.argv.slice(2);
const files = readdirSync(here)
  .filter((f) => f.endsWith('.bench.ts'))
  .filter((f) => wanted.length === 0 || wanted.some((w) => f.includes(w)))
  .sort();
const tsx = join(here, '..', 'node_modules', '.bin', 'tsx');
let failed = 0;
for (const file of files) {
  process.stdout.write(`\n== ${file} ==\n`);
  const result = spawnSync(tsx, [join(here, file)], { stdio: 'inherit' });
  if (result.status !== 0) failed += 1;
}
if (failed > 0) {
  process.stderr.write(`${failed} benchmark(s) failed\n`);
  process.exitCode = 1;
}
