import { readdirSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { join, relative } from 'node:path';
import type { Command } from 'commander';
import { parseThresholdLevel } from '../../core/analysis/thresholds/threshold-level';
import { defaultModels } from '../../core/fit/fit-survey-options';
import { renderRunText, renderTextReport, wrap } from '../../core/report/render-text';
import { fitRunSettings } from '../../core/report/run-record';
import { toJsonReport } from '../../core/report/to-json-report';
import { readSpecFile } from '../../io/spec';
import type { BatchSettings } from '../batch/batch-settings';
import { renderFleetSummary } from '../batch/render-fleet-summary';
import { runBatch } from '../batch/run-batch';
import type { CommandContext } from './command-context';
import { packageRoot } from '../package-files';
import { cliRunRecord, describeFiles, describeSpecFile, runTime } from '../run-record';

/** The bundled sample data (invented: sample-data/README.md), in the package root. */
const sampleFolder = join(packageRoot, 'sample-data');

/** The survey shown in full: the applicator that lost amplitude (sample-data/TRUTH.json). */
const featured = 'qa-107-2026-03-10-degraded.csv';

const introduction =
  'ringfall demo: the invented Quillfield Coil Bench fleet in sample-data/ (surveys of therapy ' +
  'applicators, a mat and a thick coil, none of them real), fitted with the default models and ' +
  'checked against sample-data/specs/all-coils.spec.json, with the 0.5 mT implant screening line. ' +
  'The meter is taken as ±(1.5 % + 2 µT). First one survey in full, then the fleet.';

/**
 * What demo's exit status means, for its help and the end of its output: unlike `fit` and
 * `batch`, the sample fleet's failed and inconclusive checks are what it demonstrates.
 */
export const demoExitRule =
  'Exit status of demo: 0 when the demo ran, whatever the sample verdicts (its failed and inconclusive checks ' +
  'are the demonstration); 2 when the bundled sample files cannot be read; 70 on an internal error. ' +
  'fit and batch exit 1 when a check fails and 3 when none fails but one is inconclusive.';

/**
 * `ringfall demo [--json]`: fit the bundled sample fleet and print the report (one survey
 * in full, then the fleet summary), so a new user sees the whole tool in one command.
 * Exit status: demoExitRule (0 when it ran).
 */
export function registerDemo(program: Command, _context: CommandContext): void {
  program
    .command('demo')
    .description('fit the bundled sample fleet and print the report')
    .addHelpText('after', `\n${wrap(demoExitRule, 0).join('\n')}`)
    .option('--json', 'print the JSON report instead of text')
    .action(async (flags: { json?: boolean }) => {
      const time = runTime();
      // paths as seen from where the user stands, like paths they typed (never the install folder)
      const asSeen = (path: string) => relative(process.cwd(), path) || path;
      const files = readdirSync(sampleFolder).filter((name) => name.endsWith('.csv')).sort().map((name) => asSeen(join(sampleFolder, name)));
      const specPath = asSeen(join(sampleFolder, 'specs', 'all-coils.spec.json'));
      const settings: BatchSettings = {
        fit: { models: defaultModels, instrumentUncertainty: { relative: 0.015, absolute: 2e-6 }, seed: 1 },
        import: {},
        specs: await readSpecFile(specPath),
        thresholds: [parseThresholdLevel('implant-static')],
        keepPoints: false,
      };
      const hashing = describeFiles(files);
      const result = await runBatch(files, settings, { workers: availableParallelism(), progress: process.stderr });
      const run = cliRunRecord('demo', time, await hashing, fitRunSettings({ fit: settings.fit, thresholds: settings.thresholds, spec: describeSpecFile(specPath) }));
      if (flags.json === true) {
        process.stdout.write(`${JSON.stringify(toJsonReport({ ...result.report, run }), null, 2)}\n`);
        return;
      }
      const shown = result.report.surveys.filter((survey) => survey.source.endsWith(featured));
      process.stdout.write(`${wrap(introduction, 0).join('\n')}\n\n`);
      process.stdout.write(renderTextReport({ surveys: shown }));
      process.stdout.write(`\n${'═'.repeat(78)}\n\n`);
      process.stdout.write(renderFleetSummary(result.report, { filesDone: result.filesDone, filesTotal: result.filesTotal, interrupted: result.interrupted }));
      process.stdout.write(`\n${renderRunText(run)}`);
      process.stdout.write(`\n${wrap(demoExitRule, 0).join('\n')}\n`);
      process.stdout.write('\nNext: npx ringfall fit FILE --html report.html, or npm start for the web page.\n');
    });
}
