import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { copyFileSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { RunInput, RunRecord } from '../../core/report/run-record';
import { toJsonReport } from '../../core/report/to-json-report';
import { readFitFlags } from '../fit-options';
import { fitJsonOnThread, fitJsonOnWorkers, FitJsonOutput } from '../fit-json-run';
import { changedProblem, hashRunFiles } from '../hash-run-files';
import type { StopSignalName } from '../stop-signals';
import { fitFiles, fitWorkers, printJsonReport } from './fit';

const root = join(import.meta.dirname, '..', '..', '..');
const scratch = mkdtempSync(join(tmpdir(), 'ringfall-fit-json-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));
// a named pipe: refused unread (readSurveyBytes), listed in inputs with no hash
const pipe = join(scratch, 'pipe.csv');
execFileSync('mkfifo', [pipe]);
const files = [
  ...['qa-107-2025-03-11-healthy.csv', 'fleet-log-2025-2026.csv', 'flawed/bad-rows.csv', 'flawed/no-field-unit.csv', 'flawed/reversed-probe.csv', 'no-such-file.csv'].map((name) => join(root, 'sample-data', name)),
  pipe,
  join(root, 'sample-data', 'qa-214-2026-02-17-mislabeled.csv'),
];
const options = readFitFlags({ model: ['loop,dipole'] });
const runFor = (inputs: readonly RunInput[]): RunRecord => ({ tool: 'ringfall', version: 'test', command: 'fit', time: '1970-01-01T00:00:00Z', inputs, settings: {} });
const noStop = { signal: null, onStop: () => undefined };
const stderr = { write: () => true };

/** A ByteSink that keeps every buffer handed to it; `text` decodes them joined. */
function byteSink(): { write(bytes: Uint8Array): void; text(): string; writes: number } {
  const pieces: Uint8Array[] = [];
  return {
    write: (bytes) => void pieces.push(bytes),
    text: () => Buffer.concat(pieces).toString('utf8'),
    get writes() {
      return pieces.length;
    },
  };
}

describe('fit --json in two passes (printJsonReport)', () => {
  // the reference: the whole report built in memory with the loop --html/--csv use (fitFiles), then one JSON.stringify
  const whole = fitFiles(files, options);
  const expected = `${JSON.stringify(toJsonReport({ surveys: whole.reports, rejected: whole.rejected, run: runFor(whole.inputs) }), null, 2)}\n`;

  for (const [label, setting] of [
    ['on this thread, bytes kept from the first pass', {}],
    ['on this thread, every file read again (no bytes kept)', { keepBytes: 0 }],
    ['on this thread, the first files kept and the rest read again', { keepBytes: 4000 }],
    ['on two workers', { workers: 2 }],
  ] as const) {
    it(`prints ${label} the bytes of one JSON.stringify of the whole report, with the same problems in the same order`, async () => {
      const sink = byteSink();
      const statuses: number[] = [];
      const out = await printJsonReport(files, options, [], { stop: noStop, context: { setExitCode: (code) => void statuses.push(code) }, runFor, skipped: [], sink, stderr, ...setting });
      expect(sink.text()).toBe(expected);
      expect(out.problems).toEqual(whole.problems);
      // no-field-unit.csv, no-such-file.csv, the pipe
      expect(out.problems).toHaveLength(3);
      expect(out.filesDone).toBe(files.length);
      expect(statuses).toContain(2);
    }, 120_000);
  }

  it('prints nothing when no file gave a survey (as the report built whole)', async () => {
    const sink = byteSink();
    const out = await printJsonReport([join(root, 'sample-data', 'no-such-file.csv')], options, [], { stop: noStop, context: { setExitCode: () => undefined }, runFor, skipped: [], sink, stderr });
    expect(sink.writes).toBe(0);
    expect(out.problems).toHaveLength(1);
  });
});

describe('a file that changes between the two passes', () => {
  const changing = join(scratch, 'changing.csv');
  const healthy = join(root, 'sample-data', 'qa-107-2025-03-11-healthy.csv');

  it('is not fitted when read again on this thread: a problem line names it and says to run again', async () => {
    copyFileSync(healthy, changing);
    const first = await hashRunFiles([changing, healthy], noStop, 0);
    writeFileSync(changing, '# coil: X\ndistance (mm),B (mT)\n0,1\n');
    expect(first.files.take(0)).toEqual({ problem: changedProblem(changing) });
    expect(changedProblem(changing)).toMatch(/changing\.csv" changed while ringfall ran: .*Run again/);
    const sink = byteSink();
    const out = new FitJsonOutput(runFor(first.files.inputs()), [], sink);
    await fitJsonOnThread([changing, healthy], first.files, options, [], noStop, out);
    expect(out.problems).toEqual([changedProblem(changing)]);
    expect(out.surveyCount).toBe(1);
  });

  it('is not fitted on workers either (the worker\'s hash differs from the first pass\'s)', async () => {
    copyFileSync(healthy, changing);
    const first = await hashRunFiles([changing, healthy], noStop, 0);
    writeFileSync(changing, '# coil: X\ndistance (mm),B (mT)\n0,1\n');
    const out = new FitJsonOutput(runFor(first.files.inputs()), [], byteSink());
    await fitJsonOnWorkers([changing, healthy], first.files, options, [], noStop, out, 2);
    expect(out.problems).toEqual([changedProblem(changing)]);
    expect(out.surveyCount).toBe(1);
  }, 120_000);

  it('a kept file is fitted from the bytes hashed, whatever happens to it on disk', async () => {
    copyFileSync(healthy, changing);
    const first = await hashRunFiles([changing], noStop);
    rmSync(changing);
    const read = first.files.take(0);
    // reference: the file's bytes as copied, and its entry in the run record
    expect('bytes' in read && read.bytes.equals(readFileSync(healthy))).toBe(true);
    expect(first.files.input(0).bytes).toBe(readFileSync(healthy).byteLength);
  });

  it('a file that cannot be read again is not fitted: its problem line says it was hashed earlier and to run again', async () => {
    copyFileSync(healthy, changing);
    const first = await hashRunFiles([changing], noStop, 0);
    rmSync(changing);
    expect(first.files.take(0)).toEqual({ problem: expect.stringMatching(/^Cannot read ".*changing\.csv": no such file \(ENOENT\)\..* hashed earlier in this run .*Run again\.$/) });
  });
});

describe('the first pass (hashRunFiles)', () => {
  it('gives back each kept file\'s bytes as read, across 1 MB buffers and in one of its own when larger, and hashes them as node:crypto does', async () => {
    // sizes chosen around the 1 MB buffers the bytes are copied into
    const sizes = [600_000, 600_000, 1_500_000, 10, 0];
    const paths = sizes.map((size, i) => {
      const path = join(scratch, `bytes-${i}.bin`);
      writeFileSync(path, Buffer.from(Array.from({ length: size }, (_, j) => (j * 7 + i) % 256)));
      return path;
    });
    const first = await hashRunFiles(paths, noStop);
    for (const [i, path] of paths.entries()) {
      const bytes = readFileSync(path);
      // reference: node:crypto's SHA-256 of the file read whole
      expect(first.files.input(i)).toEqual({ name: path, sha256: createHash('sha256').update(bytes).digest('hex'), bytes: bytes.byteLength });
      const read = first.files.take(i);
      expect('bytes' in read && read.bytes.equals(bytes)).toBe(true);
    }
  });
});

describe('a stop signal during fit --json', () => {
  /** A stop request that arrives after `checks` looks at it. */
  const stopAfter = (checks: number) => {
    let seen = 0;
    return { get signal(): StopSignalName | null { return ++seen > checks ? 'SIGTERM' : null; }, onStop: () => undefined };
  };
  const fleet = files.slice(0, 3);

  it('during the first pass stops it at once: no file is fitted and no report printed', async () => {
    const first = await hashRunFiles(fleet, stopAfter(1));
    expect(first.stopped).toBe(true);
    expect(first.files.count).toBe(1);
    const sink = byteSink();
    const out = await printJsonReport(fleet, options, [], { stop: stopAfter(0), context: { setExitCode: () => undefined }, runFor, skipped: [], sink, stderr });
    expect(out.filesDone).toBe(0);
    expect(sink.writes).toBe(0);
  });

  it('during the second pass ends it after the file in hand: a valid report of the files fitted whose inputs list every file hashed', async () => {
    const first = await hashRunFiles(fleet, noStop);
    const sink = byteSink();
    const out = new FitJsonOutput(runFor(first.files.inputs()), [], sink);
    await fitJsonOnThread(fleet, first.files, options, [], stopAfter(2), out);
    expect(out.filesDone).toBe(2);
    await out.finish({ partial: { filesDone: out.filesDone, filesTotal: fleet.length, signal: 'SIGTERM' } });
    const report = JSON.parse(sink.text()) as { run: RunRecord; surveys: { source: string }[]; partial: { filesDone: number } };
    expect(report.run.inputs.map((input) => input.name)).toEqual(fleet);
    expect([...new Set(report.surveys.map((survey) => survey.source))]).toEqual(fleet.slice(0, 2));
    expect(report.partial.filesDone).toBe(2);
  });
});

describe('fitWorkers', () => {
  it('fits on one thread below 200 files and on two cores, on every core above two from 200 files (the rule DEVELOPERS.md states)', () => {
    // regression pin, not truth: the rule was chosen from the measurements in fitWorkers' comment
    expect([fitWorkers(199, 8), fitWorkers(200, 8), fitWorkers(10_000, 2), fitWorkers(10_000, 1), fitWorkers(200, 3)]).toEqual([1, 8, 1, 1, 3]);
  });
});
