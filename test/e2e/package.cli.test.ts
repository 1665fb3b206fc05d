import { mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { npx, packAndInstall, runCommand as sh, type PackedTarball } from '../support/packed-install';

// ringfall as a user gets it: `npm pack` in a copy of the checkout (prepack
// builds dist/), the tarball installed into an empty project with its dependencies from
// the registry, then the CLI, the library and its types used from there with nothing
// else. Slow (a build and an install), so one install serves every check.
const root = join(import.meta.dirname, '..', '..');
let scratch = '';
let consumer = '';
let packed: PackedTarball = { path: '', size: 0, files: [] };

beforeAll(() => {
  scratch = mkdtempSync(join(tmpdir(), 'ringfall-package-test-'));
  ({ tarball: packed, project: consumer } = packAndInstall(root, scratch));
}, 900_000);

afterAll(() => {
  if (scratch !== '') rmSync(scratch, { recursive: true, force: true });
});

describe('the packed tarball (npm pack → npm install)', () => {
  it('is under 320 kB and holds what a user runs: no test, bench, script or source file', () => {
    // the project's own size budget for the package (no outside source): 300 kB until the
    // speed work's array kernels and engine paths took the tarball to ~301 kB; now 320 kB
    expect(statSync(packed.path).size).toBeLessThan(320_000);
    expect(packed.size).toBe(statSync(packed.path).size);
    const paths = packed.files.map((file) => file.path);
    expect(paths).toContain('bin/ringfall.mjs');
    expect(paths).toContain('dist/cli.js');
    expect(paths).toContain('dist/batch-worker.js');
    expect(paths).toContain('dist/index.js');
    expect(paths).toContain('dist/index.d.ts');
    expect(paths).toContain('schema/report.schema.json');
    expect(paths).toContain('sample-data/specs/all-coils.spec.json');
    expect(paths.filter((path) => /(^|\/)(test|tests|bench|scripts|src|examples|node_modules)\//.test(path) || /\.(test|bench)\.|\.ts$/.test(path.replace(/\.d\.ts$/, '')))).toEqual([]);
  });

  it('installs no devDependency: its dependencies are the runtime ones', () => {
    const manifest = JSON.parse(readFileSync(join(consumer, 'node_modules', 'ringfall', 'package.json'), 'utf8')) as { dependencies: Record<string, string>; devDependencies: Record<string, string> };
    // package.json's dependencies (d3-array: render's extents, and d3-contour's own dependency)
    expect(Object.keys(manifest.dependencies).sort()).toEqual(['chart.js', 'commander', 'd3-array', 'd3-contour', 'papaparse']);
    for (const dev of ['tsx', 'esbuild', 'typescript', 'simple-statistics', 'vitest']) {
      expect(() => statSync(join(consumer, 'node_modules', dev)), dev).toThrow();
    }
  });

  it('npx ringfall demo exits 0 and prints the fleet', () => {
    const demo = sh(npx, ['--no', 'ringfall', 'demo'], { cwd: consumer });
    expect(demo.stderr).not.toContain('ringfall:');
    // demo.ts: exit 0 when it ran (the fleet's failed checks are the demo's point)
    expect(demo.status).toBe(0);
    expect(demo.stdout).toContain('Fleet summary');
  });

  it('the library imports in plain Node and fits the sample survey; the schemas are importable', () => {
    const script = [
      "import { readFileSync } from 'node:fs';",
      "import { analyseSurvey, importSurveys } from 'ringfall';",
      "import schema from 'ringfall/schema/report.schema.json' with { type: 'json' };",
      "const path = 'node_modules/ringfall/sample-data/qa-107-2025-03-11-healthy.csv';",
      "const { surveys } = importSurveys(readFileSync(path, 'utf8'), { source: path });",
      "const report = analyseSurvey(surveys[0], { fit: { models: ['loop'] }, specs: [], thresholds: [] });",
      "console.log(report.fits[0].params.ampereTurns.value, schema.$schema);",
    ].join('\n');
    const run = sh(process.execPath, ['--input-type=module', '-e', script], { cwd: consumer });
    expect(run.stderr).toBe('');
    const [value, schema] = run.stdout.trim().split(' ');
    // sample-data/TRUTH.json: the healthy QA-107 survey was generated with 360 ampere-turns
    // and 1 % noise; the fit lands within 5 % (regression pin on the tolerance, not truth)
    expect(Math.abs(Number(value) / 360 - 1)).toBeLessThan(0.05);
    expect(schema).toBe('https://json-schema.org/draft/2020-12/schema');
  });

  it.each([
    ['NodeNext', { module: 'NodeNext', moduleResolution: 'NodeNext' }],
    ['Bundler', { module: 'ESNext', moduleResolution: 'Bundler' }],
  ])('a consumer TypeScript file compiles with moduleResolution %s (declarations checked too, no skipLibCheck)', (name, resolution) => {
    writeFileSync(join(consumer, 'consumer.ts'), [
      "import { analyseSurvey, importSurveys, parseThresholdLevel, toJsonReport, type JsonReport, type SurveyReport } from 'ringfall';",
      "const { surveys } = importSurveys('distance (mm),B (mT)\\n0,1.2\\n10,0.9\\n20,0.5\\n30,0.3\\n40,0.2\\n50,0.1\\n', { source: 'a.csv' });",
      'const reports: SurveyReport[] = surveys.map((survey) => analyseSurvey(survey, { fit: { models: [\'loop\'] }, specs: [], thresholds: [parseThresholdLevel(\'0.5mT\')] }));',
      'const json: JsonReport = toJsonReport({ surveys: reports });',
      "const tag: 'ringfall-report/1' = json.schema;",
      'const ci: readonly [number | null, number | null] | null | undefined = json.surveys[0]?.fits[0]?.params[\'ampereTurns\']?.ci95;',
      'export { tag, ci };',
      '',
    ].join('\n'));
    const config = { compilerOptions: { ...resolution, target: 'ES2022', lib: ['ES2022'], types: [], strict: true, noEmit: true, skipLibCheck: false }, files: ['consumer.ts'] };
    writeFileSync(join(consumer, `tsconfig.${name}.json`), JSON.stringify(config, null, 2));
    const tsc = sh(process.execPath, [join(root, 'node_modules', 'typescript', 'bin', 'tsc'), '-p', `tsconfig.${name}.json`], { cwd: consumer });
    expect(tsc.stdout + tsc.stderr).toBe('');
    expect(tsc.status).toBe(0);
  });
});
