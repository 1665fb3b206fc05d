/**
 * The single-file page (scripts/build-single-file.ts, dist/ringfall.html) opened straight
 * from disk in real Chromium: a file:// URL, no server. Chromium blocks module scripts,
 * module workers and fetch() there, so this is the test that the page's script, its
 * fitting worker, its styles, Chart.js and the bundled sample files all travel inside the
 * one file, and that nothing else is requested.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { artifactsDir, launchBrowser, repoRoot, type BrowserSession } from './support/browser';

const scratch = mkdtempSync(join(tmpdir(), 'ringfall-single-file-'));
const pageFile = join(scratch, 'ringfall.html');
const pageUrl = pathToFileURL(pageFile).href;
let browser: BrowserSession;
let page: Page;

/** Set on the page by an init script that counts `new Worker(…)` calls. */
interface WorkerCount { workersStarted: number }

beforeAll(async () => {
  mkdirSync(artifactsDir, { recursive: true });
  const build = spawnSync(process.execPath, [join(repoRoot, 'node_modules', 'tsx', 'dist', 'cli.mjs'), join(repoRoot, 'scripts', 'build-single-file.ts'), scratch], { cwd: repoRoot, encoding: 'utf8', timeout: 170_000 });
  if (build.status !== 0) throw new Error(`build-single-file.ts failed (${build.status}):\n${build.stdout}${build.stderr}`);
  browser = await launchBrowser();
  page = await browser.newPage();
  await page.addInitScript(() => {
    const counted = window as unknown as WorkerCount;
    counted.workersStarted = 0;
    const Original = window.Worker;
    window.Worker = class extends Original {
      constructor(url: string | URL, options?: WorkerOptions) { super(url, options); counted.workersStarted += 1; }
    };
  });
  await page.goto(pageUrl);
});

afterAll(async () => {
  await browser?.close();
  rmSync(scratch, { recursive: true, force: true });
});

describe('single-file page from file://', () => {
  it('opens with the bundled sample survey fitted and its report drawn', async () => {
    await page.waitForSelector('#report-body[data-state=ready]', { timeout: 60_000 });
    expect(await page.locator('.rf-params tr[data-param=ampereTurns]').count()).toBeGreaterThan(0);
    // a fitted survey draws a falloff and a residuals chart (render/survey-section.ts)
    expect(await page.locator('#report-body canvas').count()).toBeGreaterThanOrEqual(2);
    // index.html's fallback text, shown only when the page's script never ran
    await expect(page.locator('#app').innerText()).resolves.not.toContain('needs JavaScript');
    await page.screenshot({ path: join(artifactsDir, 'single-file-report.png'), fullPage: false });
  });

  it('fits a survey the user adds in a worker started afresh from the inlined code', async () => {
    // two files dropped one right after the other: the second run supersedes the first while
    // the worker is still fitting it, which terminates that worker and starts a new one
    // (worker-client.ts); the first is the sample fleet's file twenty times over (each copy's
    // coils renamed), so the worker is surely still busy when the second arrives
    const fleetLines = readFileSync(join(repoRoot, 'sample-data', 'fleet-log-2025-2026.csv'), 'utf8').trimEnd().split('\n');
    const header = fleetLines.findIndex((line) => line.startsWith('coil,'));
    const rows = fleetLines.slice(header + 1);
    const fleetText = [...fleetLines.slice(0, header + 1), ...Array.from({ length: 20 }, (_, copy) => rows.map((row) => row.replace(/^([^,]+),/, `$1-${copy + 1},`))).flat()].join('\n') + '\n';
    const userText = readFileSync(join(repoRoot, 'sample-data', 'qa-214-2026-02-17-mislabeled.csv'), 'utf8');
    await page.evaluate(([first, second]) => {
      const drop = (file: File) => {
        const event = new Event('drop', { cancelable: true });
        Object.defineProperty(event, 'dataTransfer', { value: { files: [file] } });
        document.dispatchEvent(event);
      };
      drop(new File([first!], 'fleet-log-2025-2026.csv'));
      setTimeout(() => drop(new File([second!], 'qa-214-2026-02-17-mislabeled.csv')), 20);
    }, [fleetText, userText]);
    // QA-214: the coil id in that file's `# coil:` line
    await page.waitForFunction(() => {
      const body = document.querySelector<HTMLElement>('#report-body');
      return body?.dataset['state'] === 'ready' && body.innerText.includes('QA-214');
    }, undefined, { timeout: 60_000 });
    expect(await page.evaluate(() => (window as unknown as WorkerCount).workersStarted)).toBeGreaterThanOrEqual(2);
  });

  it('saves an HTML report carrying Chart.js, which the page holds inlined', async () => {
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Save report (HTML)' }).click()]);
    const saved = join(scratch, 'report.html');
    await download.saveAs(saved);
    // the banner at the top of node_modules/chart.js/dist/chart.umd.js
    expect(readFileSync(saved, 'utf8')).toContain('Chart.js v4.6.1');
  });

  it('requested nothing but the page file itself, data: and blob: URLs, and logged no error', () => {
    const files = browser.requests.filter((url) => url.startsWith('file:'));
    const others = browser.requests.filter((url) => !/^(file|data|blob):/.test(url));
    expect(files).toEqual([pageUrl]);
    expect(others).toEqual([]);
    // the worker comes from a blob: URL of the inlined code
    expect(browser.requests.some((url) => url.startsWith('blob:file://') || url.startsWith('blob:null/'))).toBe(true);
    expect(browser.errors).toEqual([]);
  });
});
