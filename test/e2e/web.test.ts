/**
 * The web page in real Chromium (Debian's, through playwright-core): loads the built
 * page, uploads surveys, waits for the report, and checks what a user sees — the fitted
 * ampere-turns against the CLI's JSON, a broken file's message next to its name, a coil
 * id of markup shown as text with no dialog, the hand column mapping, the exported HTML
 * report, and that no request leaves the machine. Screenshots go to test-artifacts/.
 */
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ParameterEstimate } from '../../src/core/fit/fit-result';
import { formatEstimate } from '../../src/core/report/render-text';
import { expectClose } from '../support/expect-close';
import { artifactsDir, launchBrowser, outsideRequests, repoRoot, startWebServer, type BrowserSession, type WebServer } from './support/browser';

const attack = '<img src=x onerror=alert(1)>';
let server: WebServer;
let browser: BrowserSession;
let page: Page;
const dialogs: string[] = [];
const scratch = mkdtempSync(join(tmpdir(), 'ringfall-web-e2e-'));

/** A sample survey from sample-data/ (the healthy loop applicator when present). */
function sampleSurvey(): string {
  const dir = join(repoRoot, 'sample-data');
  const names = readdirSync(dir, { recursive: true }).map(String).filter((n) => n.endsWith('.csv')).sort();
  const name = names.find((n) => /healthy|applicator/i.test(n)) ?? names[0];
  if (!name) throw new Error('sample-data/ holds no CSV survey');
  return join(dir, name);
}

/** μ0·NI·R²/(2(R² + z²)^1.5) readings of a 120 A, 45 mm loop, probe 3 mm recessed, ±1 % wiggle (DOMAIN.md §1.1). */
function loopSurveyText(coil: string): string {
  const mu0 = 1.25663706212e-6;
  const rows = [0, 2, 5, 10, 15, 20, 25, 30, 40, 50, 60, 80, 100, 120, 150].map((mm, i) => {
    const z = (mm + 3) / 1000;
    const b = (mu0 * 120 * 0.045 ** 2) / (2 * (0.045 ** 2 + z * z) ** 1.5) * (1 + 0.01 * Math.sin(2.1 * i));
    return `${mm},${(b * 1e3).toFixed(5)}`;
  });
  return [`# coil: ${coil}`, '# date: 2026-03-14', '# reading: dc', 'distance (mm),B (mT)', ...rows].join('\n') + '\n';
}

function scratchFile(name: string, text: string): string {
  const path = join(scratch, name);
  writeFileSync(path, text);
  return path;
}

/** Upload files through the picker and wait for the next report. */
async function upload(paths: string[]): Promise<void> {
  const before = await page.locator('#report-body').getAttribute('data-report-count');
  await page.setInputFiles('#survey-files', paths);
  await page.waitForFunction((count) => {
    const body = document.querySelector('#report-body');
    return body && body.getAttribute('data-report-count') !== count && body.getAttribute('data-state') !== 'running';
  }, before, { timeout: 60_000 });
}

/** Run `action` and wait until the report after it has been drawn. */
async function andWaitForReport(action: () => Promise<void>): Promise<void> {
  const before = await page.locator('#report-body').getAttribute('data-report-count');
  await action();
  await page.waitForFunction((count) => {
    const body = document.querySelector('#report-body');
    return body?.getAttribute('data-report-count') !== count && body?.getAttribute('data-state') !== 'running';
  }, before, { timeout: 60_000 });
}

async function removeAllFiles(): Promise<void> {
  const button = page.getByRole('button', { name: 'Remove all files' });
  if (await button.isVisible()) await button.click();
}

beforeAll(async () => {
  mkdirSync(artifactsDir, { recursive: true });
  server = await startWebServer('preview');
  browser = await launchBrowser();
  page = await browser.newPage();
  page.on('dialog', (dialog) => { dialogs.push(dialog.message()); void dialog.dismiss(); });
  await page.goto(server.url);
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('web page', () => {
  it('opens with the bundled sample survey fitted and its report drawn', async () => {
    await page.waitForSelector('#report-body[data-state=ready]', { timeout: 60_000 });
    expect(await page.locator('.rf-params tr[data-param=ampereTurns]').count()).toBeGreaterThan(0);
    // a fitted survey draws a falloff and a residuals chart (render/survey-section.ts)
    expect(await page.locator('#report-body canvas').count()).toBeGreaterThanOrEqual(2);
  });

  it('shows the same fitted ampere-turns as `ringfall fit --json` for the same file', async () => {
    const file = sampleSurvey();
    await removeAllFiles();
    await upload([file]);
    const section = page.locator('.rf-survey').first();
    const best = section.locator('.rf-params').first();
    const model = await best.getAttribute('data-model');
    const shownValue = Number(await best.locator('tr[data-param=ampereTurns]').getAttribute('data-value'));
    const shownCells = await best.locator('tr[data-param=ampereTurns] td').allInnerTexts();
    const cli = JSON.parse(execFileSync(process.execPath, [join(repoRoot, 'bin', 'ringfall.mjs'), 'fit', file, '--json'], { cwd: repoRoot, encoding: 'utf8' }));
    const survey = cli.surveys[0];
    expect(model).toBe(survey.best);
    const estimate = survey.fits.find((f: { model: string }) => f.model === survey.best).params.ampereTurns as Omit<ParameterEstimate, 'name'>;
    const expected = estimate.value;
    // same code on the same text: the page and the CLI must agree to rounding
    expectClose(shownValue, expected, { rel: 1e-9 });
    // the value and 95 % interval cells read as the CLI's estimate formatted for people
    const shown = formatEstimate({ ...estimate, name: 'ampereTurns' });
    expect(shownCells.slice(0, 2)).toEqual([shown.value, shown.interval]);
    await page.screenshot({ path: join(artifactsDir, 'web-report.png'), fullPage: true });
    await section.locator('.rf-map').screenshot({ path: join(artifactsDir, 'web-field-map.png') });
  });

  it('fits a 3-D map (the tilted applicator sample) and a transverse scan without breaking: pose and lateral centre in the parameter table, charts drawn', async () => {
    await removeAllFiles();
    // μ0, CODATA 2018 recommended value
    const mu0 = 1.25663706212e-6;
    // a small loop (300 ampere-turns, radius 40 mm) read across it 30 mm away, the lateral ruler's zero 13.7 mm off its axis
    const across = scratchFile('across.csv', ['lateral position (mm),distance (mm),|B| (mT)', ...Array.from({ length: 25 }, (_, i) => {
      const x = -60 + 5 * i;
      const rho = Math.abs(x - 13.7) / 1000;
      // far-field dipole |B| = μ0 m/(4π r³)·√(1 + 3cos²θ) (Jackson, Classical Electrodynamics, 3rd ed., eq. 5.56), m = N I π a²
      const r = Math.hypot(0.03, rho);
      const b = (mu0 * 300 * Math.PI * 0.04 ** 2) / (4 * Math.PI * r ** 3) * Math.sqrt(1 + 3 * (0.03 / r) ** 2);
      return `${x},30,${(b * 1e3).toFixed(6)}`;
    })].join('\n') + '\n');
    await upload([join(repoRoot, 'sample-data', 'qa-512-2026-03-12-tilted-map.csv')]);
    const map = page.locator('.rf-survey', { hasText: 'QA-512' });
    for (const name of ['centreX', 'centreY', 'centreZ', 'tilt', 'azimuth']) expect(await map.locator(`.rf-params tr[data-param=${name}]`).count(), name).toBeGreaterThan(0);
    // sample-data/TRUTH.json: tilt 12°
    expect(Number(await map.locator('.rf-params tr[data-param=tilt]').first().getAttribute('data-value'))).toBeCloseTo((12 * Math.PI) / 180, 2);
    expect(await map.locator('canvas').count()).toBeGreaterThanOrEqual(2);
    await removeAllFiles();
    await upload([across]);
    const transverse = page.locator('.rf-survey', { hasText: 'across.csv' });
    expect(await transverse.locator('.rf-params tr[data-param=lateralCentre]').count()).toBeGreaterThan(0);
    expect(dialogs).toEqual([]);
  });

  it('shows a broken file’s message next to its name and keeps the other file working', async () => {
    await removeAllFiles();
    const broken = scratchFile('no-field-unit.csv', 'distance (mm),B\n1,2\n3,4\n5,6\n');
    const good = scratchFile('good-loop.csv', loopSurveyText('GOOD-1'));
    await upload([broken, good]);
    const brokenItem = page.locator('#file-list li', { hasText: 'no-field-unit.csv' });
    // the page says what to do in its own controls; the code stays in the data, not in the words
    await expect(brokenItem.locator('.file-message').innerText()).resolves.toMatch(/"B".*Write the unit in the header.*What the files said/s);
    await expect(brokenItem.locator('.file-message').innerText()).resolves.not.toMatch(/IMPORT_|--field-unit/);
    await expect(brokenItem.locator('.file-message').getAttribute('data-code')).resolves.toBe('IMPORT_FIELD_UNIT_MISSING');
    expect(await page.locator('#file-list li', { hasText: 'good-loop.csv' }).locator('.file-message').count()).toBe(0);
    await expect(page.locator('.rf-survey h2').first().innerText()).resolves.toContain('GOOD-1');
  });

  it('lets the user set a missing field unit by hand and refit', async () => {
    const card = page.locator('details.file-columns', { hasText: 'no-field-unit.csv' });
    await card.getByLabel('Unit of column 2 "B"').selectOption('mT');
    const before = await page.locator('#report-body').getAttribute('data-report-count');
    await card.getByRole('button', { name: 'Use this reading and refit' }).click();
    await page.waitForFunction((count) => document.querySelector('#report-body')?.getAttribute('data-report-count') !== count, before);
    const item = page.locator('#file-list li', { hasText: 'no-field-unit.csv' });
    expect(await item.locator('.file-message').count()).toBe(0);
    // the file written above has three data rows, all read once B has a unit
    await expect(item.innerText()).resolves.toContain('1 survey(s), 3 readings');
    await expect(card.locator('summary').innerText()).resolves.toContain('(columns set by hand)');
  });

  it('lists a file the browser cannot read, with the reason, and fits the others', async () => {
    await removeAllFiles();
    const good = scratchFile('good-loop.csv', loopSurveyText('GOOD-2'));
    await upload([good]);
    // a dropped file whose read fails, as when it was moved or deleted after being chosen
    await page.evaluate(() => {
      const gone = new File(['x'], 'moved-away.csv');
      for (const read of ['text', 'arrayBuffer']) Object.defineProperty(gone, read, { value: () => Promise.reject(new DOMException('the file changed on disk', 'NotReadableError')) });
      const drop = new Event('drop', { cancelable: true });
      Object.defineProperty(drop, 'dataTransfer', { value: { files: [gone] } });
      document.dispatchEvent(drop);
    });
    const item = page.locator('#file-list li', { hasText: 'moved-away.csv' });
    await expect(item.locator('.file-message').innerText()).resolves.toMatch(/could not read this file.*NotReadableError.*choose it again/s);
    await expect(item.locator('.file-message').getAttribute('data-code')).resolves.toBe('FILE_UNREADABLE');
    await expect(page.locator('.rf-survey h2').first().innerText()).resolves.toContain('GOOD-2');
    await removeAllFiles();
  });

  it('shows a coil id of markup as text and runs none of it', async () => {
    await removeAllFiles();
    await upload([scratchFile('attack.csv', loopSurveyText(attack))]);
    await expect(page.locator('.rf-survey .rf-coil-id').first().innerText()).resolves.toBe(attack);
    expect(await page.locator('#report-body img').count()).toBe(0);
    expect(await page.locator('.controls img').count()).toBe(0);
    await page.waitForTimeout(300);
    expect(dialogs).toEqual([]);
  });

  it('saves a self-contained HTML report that draws its charts offline', async () => {
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Save report (HTML)' }).click()]);
    const saved = join(scratch, 'report.html');
    await download.saveAs(saved);
    const text = readFileSync(saved, 'utf8');
    expect(text).toContain(`default-src 'none'`);
    expect(text).not.toContain(attack);
    const view = await browser.newPage();
    await view.goto(`file://${saved}`);
    await view.waitForFunction(() => document.querySelectorAll('canvas').length >= 2 && [...document.querySelectorAll('canvas')].every((c) => (window as unknown as { Chart: { getChart(c: HTMLCanvasElement): unknown } }).Chart.getChart(c)));
    await expect(view.locator('.rf-coil-id').first().innerText()).resolves.toBe(attack);
    await view.close();
  });

  it('holds a parameter fixed with its unit and adds an ICNIRP 2010 level, then refits', async () => {
    await removeAllFiles();
    await upload([scratchFile('fix-me.csv', loopSurveyText('FIX-1'))]);
    await page.getByRole('button', { name: 'Hold a parameter fixed' }).click();
    const row = page.locator('.fix-row').last();
    await row.locator('select').selectOption('radius');
    await andWaitForReport(async () => {
      await row.locator('input').fill('45 mm');
      await row.locator('input').press('Tab');
    });
    await page.getByLabel('Exposure group').selectOption('public');
    await page.getByLabel('at', { exact: true }).fill('50 Hz');
    await andWaitForReport(() => page.getByRole('button', { name: 'Add the ICNIRP 2010 reference level' }).click());
    const radius = page.locator('.rf-params').first().locator('tr[data-param=radius]');
    // the fixed value is reported as fixed, with no interval (DESIGN.md catalog rule);
    // 0.045 is the 45 mm typed above, in metres
    expect(Number(await radius.getAttribute('data-value'))).toBe(0.045);
    await expect(radius.innerText()).resolves.toContain('fixed');
    // ICNIRP 2010 general public, 25–400 Hz: 200 µT (DOMAIN.md §4.2)
    await expect(page.locator('.rf-thresholds').innerText()).resolves.toContain('200 µT');
    await andWaitForReport(() => page.locator('.fix-row button').last().click());
  });

  it('names a bad level or spec typed in, keeps the level out, and fits again once the spec is fixed', async () => {
    const levels = page.locator('.threshold-list li');
    const count = await levels.count();
    await page.getByLabel('A level of your own').fill('0.2 mX');
    await page.getByRole('button', { name: 'Add your level' }).click();
    const levelError = page.locator('#levels-heading ~ p.field-error');
    await expect(levelError.innerText()).resolves.toMatch(/"0\.2 mX".*Use one of/s);
    expect(await levels.count()).toBe(count);

    const spec = page.getByLabel('Spec to check against (JSON)');
    const specError = page.locator(`#${await spec.getAttribute('aria-describedby')}`);
    await spec.fill('{ "model": "loop",\n  "params": { "radius": "45 mm" ');
    await spec.press('Tab');
    await page.waitForSelector('#report-body[data-state=failed]');
    await expect(page.locator('#run-status').innerText()).resolves.toContain('Fix the settings marked on the left');
    // the spec typed above breaks off on its second line
    await expect(specError.innerText()).resolves.toMatch(/not valid JSON.*line 2.*Fix the JSON syntax/s);
    await andWaitForReport(async () => {
      await spec.fill('');
      await spec.press('Tab');
    });
    expect(await specError.isVisible()).toBe(false);
    expect(await page.locator('#report-body').getAttribute('data-state')).toBe('ready');
  });

  it('keeps the page responsive while a large survey is fitted in the worker', async () => {
    await removeAllFiles();
    const rows = Array.from({ length: 20_000 }, (_, i) => `${(i / 100).toFixed(2)},${(1 / (1 + (i / 4000) ** 2) ** 1.5).toFixed(6)}`);
    const big = scratchFile('big.csv', ['distance (mm),B (mT)', ...rows].join('\n') + '\n');
    const before = await page.locator('#report-body').getAttribute('data-report-count');
    await page.setInputFiles('#survey-files', [big]);
    await page.waitForSelector('#report-body[data-state=running]', { state: 'attached' });
    expect(await page.locator('#run-progress').isVisible()).toBe(true);
    // a frame drawn while the fit runs, and the state read in that same frame: the main thread
    // is free during the fit (no bound on how soon, which a loaded machine cannot promise)
    const frame = await page.evaluate(() => new Promise<{ time: number; state: string | null }>((resolve) => {
      requestAnimationFrame((time) => resolve({ time, state: document.querySelector('#report-body')?.getAttribute('data-state') ?? null }));
    }));
    expect(frame.time).toBeGreaterThan(0);
    expect(frame.state).toBe('running');
    await page.waitForFunction((count) => document.querySelector('#report-body')?.getAttribute('data-report-count') !== count, before, { timeout: 120_000 });
  });

  it('shows the sample fleet with its coil table and history chart', async () => {
    await andWaitForReport(() => page.getByRole('button', { name: 'Open the sample fleet' }).click());
    // sample-data/README.md: the fleet log holds QA-107, QA-330 and QA-412
    await expect(page.locator('.rf-coils-table').innerText()).resolves.toMatch(/QA-107[\s\S]*QA-330[\s\S]*QA-412/);
    expect(await page.locator('#rf-fleet-history').count()).toBe(1);
    await page.locator('.rf-fleet').first().screenshot({ path: join(artifactsDir, 'web-fleet.png') });
  });

  it('reads well on a narrow screen', async () => {
    await page.setViewportSize({ width: 390, height: 844 });
    await page.locator('.rf-survey').first().scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(artifactsDir, 'web-narrow.png'), fullPage: false });
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await page.setViewportSize({ width: 1280, height: 800 });
  });

  it('made no request that left the machine', () => {
    expect(browser.requests.length).toBeGreaterThan(0);
    expect(outsideRequests(browser.requests)).toEqual([]);
    expect(browser.errors).toEqual([]);
  });
});
