/**
 * `npm run sample-data`: writes sample-data/ (invented surveys, spec files, TRUTH.json)
 * from scripts/sample-data/build-sample-data.ts. Seeded: running it again gives the same
 * bytes, and test/import/sample-data.test.ts checks that the committed files match.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildSampleData } from './sample-data/build-sample-data';

const folder = join(dirname(fileURLToPath(import.meta.url)), '..', 'sample-data');
const { files } = buildSampleData();
for (const [path, text] of files) {
  mkdirSync(dirname(join(folder, path)), { recursive: true });
  writeFileSync(join(folder, path), text);
}
process.stdout.write(`wrote ${files.size} files to ${folder}\n`);
