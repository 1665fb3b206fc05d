import { spawn, spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeFleet } from '../../bench/make-fleet';
import { launchBrowser, outsideRequests } from './support/browser';

const root = join(import.meta.dirname, '..', '..');
const spec = 'sample-data/specs/all-coils.spec.json';

interface Run {
  readonly status: number | null;
  readonly stdout: string;
  readonly stderr: string;
}

// a fixed time of the run (SOURCE_DATE_EPOCH), so two runs can be compared byte for byte
function ringfall(...args: string[]): Run {
  const result = spawnSync(process.execPath, ['bin/ringfall.mjs', ...args], { cwd: root, encoding: 'utf8', timeout: 120_000, maxBuffer: 1 << 28, env: { ...process.env, SOURCE_DATE_EPOCH: '1773480600' } });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

interface TruthEntry {
  readonly file: string;
  readonly coil: string;
  readonly expected?: { readonly errorCode?: string };
  readonly surveys?: readonly { readonly coil: string }[];
}
const truth = (JSON.parse(readFileSync(join(root, 'sample-data', 'TRUTH.json'), 'utf8')) as { surveys: TruthEntry[] }).surveys;

interface FleetCoilJson {
  coil: string;
  surveys: number;
  latest: string | null;
  flags: string[];
  trend: { ampereTurnsPerYear: { value: number; unit: string; ci95: [number, number] } | null; status: string; moreSurveys: number | null };
}
interface ReportJson {
  schema: string;
  surveys: { source: string; coil: string | null; date: string | null; verdict: { status: string; findings: string[] } | null }[];
  fleet: { coils: FleetCoilJson[]; unreadable: { source: string; reason: string; code: string }[] };
  skipped?: { list: string; patterns: string[]; files: string[] }[];
}

const temporary: string[] = [];
function temporaryFolder(): string {
  const folder = mkdtempSync(join(tmpdir(), 'ringfall-batch-test-'));
  temporary.push(folder);
  return folder;
}
afterAll(() => {
  for (const folder of temporary) rmSync(folder, { recursive: true, force: true });
});

describe('ringfall batch over sample-data/ (CONTRACT.md batch, fleet section, exit status)', () => {
  let json: Run;
  let text: Run;
  let out: string;
  beforeAll(() => {
    out = join(temporaryFolder(), 'html');
    json = ringfall('batch', 'sample-data', '--spec', spec, '--json', '--workers', '2');
    text = ringfall('batch', 'sample-data', '--spec', spec, '--workers', '2', '--out', out);
  });

  it('batch --json prints the CONTRACT report: every readable survey of TRUTH.json plus a fleet section with coils[] and unreadable[]', () => {
    const report = JSON.parse(json.stdout) as ReportJson;
    expect(report.schema).toBe('ringfall-report/1');
    // TRUTH.json: one survey per file, the fleet log's own list of surveys, minus the flawed/
    // files that sample-data/.ringfall-skip marks as not surveys (listed in `skipped` instead)
    const readable = truth.filter((entry) => !entry.file.startsWith('flawed/'));
    expect(report.skipped).toEqual([{ list: 'sample-data/.ringfall-skip', patterns: ['flawed/'], files: truth.filter((entry) => entry.file.startsWith('flawed/')).map((entry) => `sample-data/${entry.file}`).sort() }]);
    expect(report.fleet.unreadable).toEqual([]);
    const surveysPerCoil = new Map<string, number>();
    for (const entry of readable) for (const s of entry.surveys ?? [entry]) surveysPerCoil.set(s.coil, (surveysPerCoil.get(s.coil) ?? 0) + 1);
    expect(report.surveys).toHaveLength([...surveysPerCoil.values()].reduce((a, b) => a + b, 0));
    expect(Object.fromEntries(report.fleet.coils.map((c) => [c.coil, c.surveys]))).toEqual(Object.fromEntries(surveysPerCoil));
    for (const coil of report.fleet.coils) {
      expect(Object.keys(coil)).toEqual(expect.arrayContaining(['coil', 'surveys', 'latest', 'flags', 'trend']));
    }
    // surveys ordered by file (sorted paths), then by their order inside the file
    const sources = report.surveys.map((s) => s.source);
    expect(sources).toEqual([...sources].sort());
  });

  it('with --no-skip, batch lists the file TRUTH.json says cannot be imported in fleet.unreadable with its error code and what to do, and exits 2 (an input error)', () => {
    const all = ringfall('batch', 'sample-data', '--spec', spec, '--json', '--workers', '2', '--no-skip');
    const report = JSON.parse(all.stdout) as ReportJson;
    expect(report.skipped).toBeUndefined();
    const refused = truth.filter((entry) => entry.expected?.errorCode !== undefined);
    expect(report.fleet.unreadable.map((u) => [u.source, u.code])).toEqual(refused.map((entry) => [`sample-data/${entry.file}`, entry.expected!.errorCode]));
    expect(report.fleet.unreadable[0]!.reason).toContain('--field-unit');
    expect(all.status).toBe(2);
  });

  it('batch flags the degraded coil QA-107 (TRUTH.json: 360 A → 306 A, radius unchanged) as degrading with a negative trend, and the steady QA-330 not', () => {
    const report = JSON.parse(json.stdout) as ReportJson;
    const qa107 = report.fleet.coils.find((c) => c.coil === 'QA-107')!;
    expect(qa107.flags).toContain('degrading');
    expect(qa107.trend.ampereTurnsPerYear!.unit).toBe('A/yr');
    expect(qa107.trend.ampereTurnsPerYear!.ci95[1]).toBeLessThan(0);
    expect(qa107.latest).toBe('2026-03-10');
    // TRUTH.json: QA-330 steady (400 ± 1 A over the year)
    expect(report.fleet.coils.find((c) => c.coil === 'QA-330')!.flags).not.toContain('degrading');
    // sample-data/README.md "What ringfall makes of them": the trend words of the three logged coils
    const status = (coil: string) => report.fleet.coils.find((c) => c.coil === coil)!.trend.status;
    expect([status('QA-107'), status('QA-330'), status('QA-412')]).toEqual(['declining', 'steady', 'undetermined']);
    expect(report.fleet.coils.find((c) => c.coil === 'QA-412')!.trend.moreSurveys).toBeGreaterThan(0);
    // the spec check of the latest QA-107 survey finds the amplitude loss (DOMAIN.md §5)
    const latest = report.surveys.find((s) => s.coil === 'QA-107' && s.date === '2026-03-10' && s.source.endsWith('degraded.csv'))!;
    expect(latest.verdict).toMatchObject({ status: 'fail' });
    expect(latest.verdict!.findings).toContain('degraded');
  });

  it('batch prints the fleet summary on stdout (one entry per coil, then what needs attention first, the failed and degrading coil first) and progress only on stderr', () => {
    // a spec failed and QA-107 is degrading: exit 1 (CONTRACT.md exit status)
    expect(text.status).toBe(1);
    // the skip list's one line, on stderr and in the summary
    expect(text.stderr).toContain('ringfall batch: left out 3 files that sample-data/.ringfall-skip lists as not surveys (flawed/); --no-skip fits them too\n');
    expect(text.stdout).toMatch(/^ {2}3 files left out: sample-data\/\.ringfall-skip lists flawed\/ as not surveys/m);
    // the coils of TRUTH.json (QA-412 only in the fleet log)
    const coils = ['QA-107', 'QA-214', 'QA-330', 'QA-412', 'QA-512', 'QH-70', 'QM-03', 'QT-9'];
    for (const coil of coils) expect(text.stdout).toMatch(new RegExp(`^${coil}: \\d+ surveys?, latest `, 'm'));
    // TRUTH.json: QA-107's latest survey at 306 A and 45 mm (the estimate printing exactly 306 is a regression pin, not truth)
    // each row names the model it reads the coil with, and why (here the spec's)
    expect(text.stdout).toMatch(/^ {4}model loop \(spec's model\): ampere-turns 306 A \(\d+–\d+\) ·\s+radius 45\.\d mm/m);
    const attention = text.stdout.slice(text.stdout.indexOf('What needs attention first'));
    expect(attention).toMatch(/^ {2}1\. QA-107: failed its spec \(degraded[^)]*\); degrading -\d+ A\/yr/m);
    expect(attention.indexOf('QA-214')).toBeGreaterThan(0);
    expect(text.stdout).not.toContain('ringfall batch:');
    // TRUTH.json lists the 12 survey files of sample-data/, 3 of them in flawed/; --workers 2
    expect(text.stderr).toMatch(/^ringfall batch: 9 survey files on 2 workers$/m);
    expect(text.stderr).toMatch(/^ringfall batch: 9 files in [\d.]+ s/m);
  });

  it('batch --out DIR writes index.html and one self-contained report per coil, linked from the index', () => {
    const index = readFileSync(join(out, 'index.html'), 'utf8');
    for (const page of ['qa-107.html', 'qa-214.html', 'qa-330.html', 'qa-412.html', 'qm-03.html', 'qt-9.html']) {
      expect(index).toContain(`href="${page}"`);
      const html = readFileSync(join(out, page), 'utf8');
      expect(html).toContain("default-src 'none'");
      // the one script a page loads is the folder's shared copy of Chart.js, by a relative path
      expect([...html.matchAll(/<script[^>]+src="([^"]*)"/g)].map((m) => m[1])).toEqual(['ringfall-charts.js']);
      expect(html).not.toMatch(/<link[^>]+href="http/);
    }
    // a coil page's run record names its own files only (a fleet's pages would otherwise each list every file)
    const qa214 = readFileSync(join(out, 'qa-214.html'), 'utf8');
    expect(qa214.match(/<th scope="row" class="rf-nowrap">input file<\/th>/g)).toHaveLength(1);
    expect(qa214).toContain('sample-data/qa-214-2026-02-17-mislabeled.csv, ');
    // Chart.js once for the folder, not once per page (the banner of node_modules/chart.js/dist/chart.umd.js)
    expect(readFileSync(join(out, 'ringfall-charts.js'), 'utf8')).toContain('Chart.js v4.6.1');
    // the skip list's line is on the index too, so the page says what was left out
    expect(index).toContain('3 files left out: sample-data/.ringfall-skip lists flawed/ as not surveys');
  });

  it('batch --out pages open offline in Chromium: the index links to a coil page that draws its charts, with no console error and no outside request', async () => {
    const browser = await launchBrowser();
    try {
      const page = await browser.newPage();
      await page.goto(`file://${join(out, 'index.html')}`);
      await expect(page.locator('h1').innerText()).resolves.toBe('Fleet summary');
      await page.getByRole('link', { name: 'QA-107' }).click();
      await page.waitForURL(/qa-107\.html$/);
      await page.waitForFunction(() => document.querySelectorAll('canvas').length >= 2 && [...document.querySelectorAll('canvas')].every((c) => (window as unknown as { Chart: { getChart(c: HTMLCanvasElement): unknown } }).Chart.getChart(c)));
      expect(browser.errors).toEqual([]);
      expect(outsideRequests(browser.requests)).toEqual([]);
    } finally {
      await browser.close();
    }
  });

  it('batch fits a survey exactly as ringfall fit does (same seed and options, whatever file or worker it lands in)', () => {
    const file = 'sample-data/qa-107-2026-03-10-degraded.csv';
    const alone = (JSON.parse(ringfall('fit', file, '--json').stdout) as { surveys: Record<string, unknown>[] }).surveys[0]!;
    const inBatch = (JSON.parse(json.stdout) as { surveys: Record<string, unknown>[] }).surveys.find((s) => s['source'] === file)!;
    // the spec of QA-107 names the loop, one of the default models, so the same models are fitted
    for (const key of ['best', 'comparison', 'readings', 'notes']) expect(JSON.stringify(inBatch[key]), key).toBe(JSON.stringify(alone[key]));
    // a fleet report leaves out the per-reading columns (CONTRACT.md); everything else of each fit is the same
    const withoutPoints = (fits: unknown) => (fits as Record<string, unknown>[]).map(({ points, ...rest }) => ({ rest, readings: (points as { line: number[] }).line.length }));
    expect(withoutPoints(inBatch['fits']).map((fit) => fit.readings)).toEqual(withoutPoints(inBatch['fits']).map(() => 0));
    expect(JSON.stringify(withoutPoints(inBatch['fits']).map((fit) => fit.rest))).toBe(JSON.stringify(withoutPoints(alone['fits']).map((fit) => fit.rest)));
  });

  it('batch output is the same byte for byte with 1 worker as with 2 (JSON and text)', () => {
    const one = ringfall('batch', 'sample-data', '--spec', spec, '--json', '--workers', '1');
    expect(one.stdout).toBe(json.stdout);
    const oneText = ringfall('batch', 'sample-data', '--spec', spec, '--workers', '1');
    expect(oneText.stdout).toBe(text.stdout);
  });
});

describe('ringfall batch with broken files and hostile coil ids', () => {
  it('a broken file does not stop the batch: it is listed with its error, the other files are fitted, exit 2; coil ids are escaped in the HTML', () => {
    const folder = temporaryFolder();
    copyFileSync(join(root, 'sample-data', 'qa-107-2025-03-11-healthy.csv'), join(folder, 'a-healthy.csv'));
    const healthy = readFileSync(join(root, 'sample-data', 'qa-107-2025-03-11-healthy.csv'), 'utf8');
    writeFileSync(join(folder, 'c-hostile.csv'), healthy.replace('# coil: QA-107', '# coil: <img src=x onerror=alert(1)>'));
    writeFileSync(join(folder, 'b-broken.csv'), Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00, 0xff, 0xfe, 0x00, 0x01, 0x02]));
    writeFileSync(join(folder, 'd-empty.csv'), '');
    const out = join(folder, 'html');
    const run = ringfall('batch', folder, '--json', '--out', out);
    expect(run.status).toBe(2);
    const report = JSON.parse(run.stdout) as ReportJson;
    expect(report.surveys.map((s) => s.coil)).toEqual(['QA-107', '<img src=x onerror=alert(1)>']);
    expect(report.fleet.unreadable.map((u) => u.source)).toEqual([join(folder, 'b-broken.csv'), join(folder, 'd-empty.csv')]);
    for (const entry of report.fleet.unreadable) expect(entry.reason.length).toBeGreaterThan(20);
    const index = readFileSync(join(out, 'index.html'), 'utf8');
    expect(index).toContain('&lt;img src=x onerror=alert(1)&gt;');
    expect(index).not.toContain('<img');
    // the hostile id becomes a safe file name
    expect(existsSync(join(out, 'img-src-x-onerror-alert-1.html'))).toBe(true);
    expect(readFileSync(join(out, 'img-src-x-onerror-alert-1.html'), 'utf8')).not.toContain('<img src=x');
  });

  it('batch usage errors exit 2 with one line on stderr saying what to do', () => {
    const workers = ringfall('batch', 'sample-data', '--workers', '0');
    expect(workers.status).toBe(2);
    expect(workers.stderr).toBe('ringfall: --workers: "0" is not usable. Give a whole number from 1 to 256.\n');
    const html = ringfall('batch', 'sample-data', '--html', 'x.html');
    expect(html.status).toBe(2);
    expect(html.stderr).toContain('--out DIR');
    // a unit option of the wrong kind is refused once, before any file is fitted (not as every file unreadable, exit 1)
    const unit = ringfall('batch', 'sample-data', '--distance-unit', 'mT');
    expect(unit.status).toBe(2);
    expect(unit.stderr).toBe('ringfall: --distance-unit: "mT" is not usable. Give a length unit: m, cm, mm, µm, in.\n');
    expect(unit.stdout).toBe('');
    // an --out that is a file is refused before any file is fitted (no progress line), not after the whole run
    const file = join(temporaryFolder(), 'taken');
    writeFileSync(file, '');
    const out = ringfall('batch', 'sample-data', '--out', file);
    expect(out.status).toBe(2);
    expect(out.stderr).toBe(`ringfall: --out: cannot write "${file}" (EEXIST). Choose a folder you can write to.\n`);
    expect(out.stdout).toBe('');
    const every = ringfall('batch', 'sample-data', '--progress-every', '0');
    expect(every.status).toBe(2);
    expect(every.stderr).toBe('ringfall: --progress-every: "0" is not usable. Give seconds from 0.1 to 3600, e.g. 10.\n');
    const missing = ringfall('batch', 'no-such-folder');
    expect(missing.status).toBe(2);
    expect(missing.stdout).toBe('');
  });
});

describe('ringfall batch stopped with Ctrl-C', () => {
  it('SIGINT after the first progress line terminates the workers, prints a summary marked partial and exits 130', async () => {
    const folder = temporaryFolder();
    const files = makeFleet(folder, { files: 3000, readings: 30 });
    const child = spawn(process.execPath, ['bin/ringfall.mjs', 'batch', folder, '--workers', '2', '--progress-every', '0.1'], { cwd: root });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (chunk: Buffer) => { stdout += chunk.toString(); });
    const status = await new Promise<number | null>((resolve) => {
      child.stderr.on('data', (chunk: Buffer) => {
        stderr += chunk.toString();
        // the first periodic line ("… of N files …") comes once a chunk has finished, 0.1 s
        // after the start, long before 3000 files are done on any machine
        if (/ of \d+ files/.test(stderr) && !child.killed) child.kill('SIGINT');
      });
      child.on('exit', (code) => resolve(code));
    });
    expect(status).toBe(130);
    const done = Number(/stopped after (\d+) of (\d+) files/.exec(stdout)?.[1]);
    expect(stdout).toContain(`PARTIAL SUMMARY: stopped after ${done} of ${files.length} files`);
    expect(done).toBeGreaterThan(0);
    expect(done).toBeLessThan(files.length);
    expect(stdout).toMatch(/^Fleet summary: \d+ coils, \d+ surveys from \d+ files$/m);
    expect(stderr).toMatch(/ringfall batch: stopped after \d+ of 3000 files/);
  });
});
