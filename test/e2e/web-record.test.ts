/**
 * The web page as a record keeper and as a user expects it to behave with their own files:
 * the user's file replaces the bundled sample (which can be kept), the newest file is shown
 * first, every report says how it was made with the files' SHA-256, a saved JSON report
 * opens again as it was saved, and a spec for another coil is said, not ignored.
 */
import { createHash } from 'node:crypto';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, outsideRequests, repoRoot, startWebServer, type BrowserSession, type WebServer } from './support/browser';
import { expectClose } from '../support/expect-close';

let server: WebServer;
let browser: BrowserSession;
let page: Page;
const scratch = mkdtempSync(join(tmpdir(), 'ringfall-web-record-'));

/** μ0·NI·R²/(2(R² + z²)^1.5) readings of a 120 A, 45 mm loop, probe 3 mm recessed, ±1 % wiggle (Jackson, Classical Electrodynamics 3rd ed. §5.5). */
function loopSurveyText(coil: string, date: string): string {
  const mu0 = 1.25663706212e-6;
  const rows = [0, 2, 5, 10, 15, 20, 25, 30, 40, 50, 60, 80, 100, 120, 150].map((mm, i) => {
    const z = (mm + 3) / 1000;
    const b = (mu0 * 120 * 0.045 ** 2) / (2 * (0.045 ** 2 + z * z) ** 1.5) * (1 + 0.01 * Math.sin(2.1 * i));
    return `${mm},${(b * 1e3).toFixed(5)}`;
  });
  return [`# coil: ${coil}`, `# date: ${date}`, '# reading: dc', 'distance (mm),B (mT)', ...rows].join('\n') + '\n';
}

function scratchFile(name: string, text: string): string {
  const path = join(scratch, name);
  writeFileSync(path, text);
  return path;
}

async function reportCount(): Promise<string | null> {
  return page.locator('#report-body').getAttribute('data-report-count');
}

async function andWaitForReport(action: () => Promise<void>): Promise<void> {
  const before = await reportCount();
  await action();
  await page.waitForFunction((count) => {
    const body = document.querySelector('#report-body');
    return body?.getAttribute('data-report-count') !== count && body?.getAttribute('data-state') !== 'running';
  }, before, { timeout: 60_000 });
}

beforeAll(async () => {
  server = await startWebServer('preview');
  browser = await launchBrowser();
  page = await browser.newPage();
  await page.goto(server.url);
  await page.waitForSelector('#report-body[data-state=ready]', { timeout: 60_000 });
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('the page follows the user and keeps a record', () => {
  it('replaces the bundled sample with the user\'s file, offers the sample back, and shows the newest file first', async () => {
    await expect(page.locator('#file-list li').allInnerTexts()).resolves.toEqual([expect.stringContaining('qa-107-2025-03-11-healthy.csv')]);
    await andWaitForReport(() => page.setInputFiles('#survey-files', scratchFile('first.csv', loopSurveyText('USER-1', '2026-03-01'))));
    await expect(page.locator('#file-list li .file-name').allInnerTexts()).resolves.toEqual(['first.csv']);
    await expect(page.locator('#set-aside').innerText()).resolves.toContain('Your files replaced the bundled sample (qa-107-2025-03-11-healthy.csv)');
    await expect(page.locator('.rf-survey h2').first().innerText()).resolves.toContain('USER-1');
    await andWaitForReport(() => page.setInputFiles('#survey-files', scratchFile('second.csv', loopSurveyText('USER-2', '2026-03-02'))));
    await expect(page.locator('#file-list li .file-name').allInnerTexts()).resolves.toEqual(['second.csv', 'first.csv']);
    await expect(page.locator('.rf-survey h2').first().innerText()).resolves.toContain('USER-2');
    await andWaitForReport(() => page.locator('#keep-sample').click());
    await expect(page.locator('#file-list li .file-name').allInnerTexts()).resolves.toEqual(['second.csv', 'first.csv', 'qa-107-2025-03-11-healthy.csv']);
    expect(await page.locator('#set-aside').isHidden()).toBe(true);
  });

  it('says how the report was made: version, time, each file with the SHA-256 of its bytes, and the settings', async () => {
    const record = await page.locator('.rf-run').innerText();
    expect(record).toContain('ringfall 0.1.0 (web page)');
    expect(record).toMatch(/time of the run\s+\d{4}-\d\d-\d\dT\d\d:\d\d:\d\dZ/);
    // SHA-256 by node:crypto (FIPS 180-4), independent of the browser's crypto.subtle
    for (const name of ['first.csv', 'second.csv']) {
      const hash = createHash('sha256').update(readFileSync(join(scratch, name))).digest('hex');
      expect(record).toContain(`${name}, ${readFileSync(join(scratch, name)).length} bytes, SHA-256 ${hash}`);
    }
    const sample = readFileSync(join(repoRoot, 'sample-data', 'qa-107-2025-03-11-healthy.csv'));
    expect(record).toContain(`sample-data/qa-107-2025-03-11-healthy.csv, ${sample.length} bytes, SHA-256 ${createHash('sha256').update(sample).digest('hex')}`);
    expect(record).toMatch(/models fitted\s+loop/);
    const spec = readFileSync(join(repoRoot, 'sample-data', 'specs', 'all-coils.spec.json'));
    expect(record).toContain(`sample-data/specs/all-coils.spec.json, ${spec.length} bytes, SHA-256 ${createHash('sha256').update(spec).digest('hex')}`);
    // the saved JSON carries the same record
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Save JSON' }).click()]);
    const saved = join(scratch, 'saved.json');
    await download.saveAs(saved);
    const json = JSON.parse(readFileSync(saved, 'utf8'));
    expect(json.run.command).toBe('web page');
    expect(json.run.inputs.map((input: { name: string }) => input.name)).toEqual(['second.csv', 'first.csv', 'sample-data/qa-107-2025-03-11-healthy.csv']);
  });

  it('opens a saved JSON report as it was saved, charts and all, naming how it was made', async () => {
    // a report the CLI saved: the page shows its numbers, not a new fit
    const cliReport = scratchFile('cli-report.json', execFileSync(process.execPath, [join(repoRoot, 'bin', 'ringfall.mjs'), 'fit', join(repoRoot, 'sample-data', 'qa-107-2026-03-10-degraded.csv'), '--json'], { cwd: repoRoot, encoding: 'utf8', env: { ...process.env, SOURCE_DATE_EPOCH: '1773480600' } }));
    const expected = JSON.parse(readFileSync(cliReport, 'utf8')).surveys[0];
    const turns = expected.fits.find((f: { model: string }) => f.model === expected.best).params.ampereTurns.value;
    await andWaitForReport(() => page.setInputFiles('#survey-files', cliReport));
    await expect(page.locator('#run-status').innerText()).resolves.toBe('Showing the saved report cli-report.json, made by ringfall 0.1.0 (fit) at 2026-03-14T09:30:00Z; it is shown as saved, not fitted again. Add survey files to fit anew.');
    await expect(page.locator('.rf-survey h2').first().innerText()).resolves.toContain('QA-107');
    expect(Number(await page.locator('.rf-params').first().locator('tr[data-param=ampereTurns]').getAttribute('data-value'))).toBe(turns);
    expect(await page.locator('#report-body canvas').count()).toBeGreaterThanOrEqual(2);
    // the files the user had stay listed, not replaced by the report
    await expect(page.locator('#file-list li .file-name').allInnerTexts()).resolves.toContain('first.csv');
  });

  it('reads a column set by hand as ruler positions as a scan through the coil, and fits its centre', async () => {
    await page.getByRole('button', { name: 'Remove all files' }).click();
    // a loop scanned through from −60 to +60 mm of a ruler whose zero is 12 mm from the winding plane (on-axis field: Jackson §5.5)
    const mu0 = 1.25663706212e-6;
    const rows = Array.from({ length: 25 }, (_, i) => {
      const position = -60 + 5 * i;
      const z = (position - 12) / 1000;
      const b = (mu0 * 120 * 0.045 ** 2) / (2 * (0.045 ** 2 + z * z) ** 1.5) * (1 + 0.005 * Math.sin(1.7 * i));
      return `${position},${(b * 1e3).toFixed(5)}`;
    });
    const file = scratchFile('rail.csv', ['# coil: RAIL-1', '# date: 2026-03-04', 'distance (mm),B (mT)', ...rows].join('\n') + '\n');
    await andWaitForReport(() => page.setInputFiles('#survey-files', file));
    // named "distance", the rows below zero are set aside
    await expect(page.locator('#file-list li', { hasText: 'rail.csv' }).innerText()).resolves.toContain('1 survey(s), 13 readings');
    const card = page.locator('details.file-columns', { hasText: 'rail.csv' });
    if (!(await card.evaluate((element) => (element as HTMLDetailsElement).open))) await card.locator('summary').click();
    await card.getByLabel('Role of column 1 "distance (mm)"').selectOption('position');
    await andWaitForReport(() => card.getByRole('button', { name: 'Use this reading and refit' }).click());
    await expect(page.locator('#file-list li', { hasText: 'rail.csv' }).innerText()).resolves.toContain('1 survey(s), 25 readings');
    const centre = page.locator('.rf-params').first().locator('tr[data-param=centre]');
    // the rows above were made with the winding plane at 12 mm on the ruler; 0.5 % ripple, so within 1 mm
    expect(Math.abs(Number(await centre.getAttribute('data-value')) - 0.012)).toBeLessThan(0.001);
  });

  it('says so when the spec is for another coil, in its own words', async () => {
    await page.getByRole('button', { name: 'Remove all files' }).click();
    await andWaitForReport(() => page.setInputFiles('#survey-files', scratchFile('other.csv', loopSurveyText('QA-107', '2026-03-03'))));
    const spec = page.locator('textarea').first();
    await andWaitForReport(async () => {
      await spec.fill(readFileSync(join(repoRoot, 'sample-data', 'specs', 'qm-03.spec.json'), 'utf8'));
      await spec.press('Tab');
    });
    const note = await page.locator('.rf-spec-not-made').innerText();
    expect(note).toContain('Spec check not made');
    expect(note).toContain('QM-03, not QA-107');
    expect(note).not.toMatch(/--spec|SPEC_/);
  });

  it('shows a survey logged in gauss and inches in G and in, its values SI underneath', async () => {
    await page.getByRole('button', { name: 'Remove all files' }).click();
    // the same loop in a gaussmeter's units: 1 mT = 10 G (1 G = 1e-4 T exactly, SI Brochure 9th ed., Table 8), 1 in = 25.4 mm exactly (1959 agreement)
    const lines = loopSurveyText('USER-G', '2026-03-04').trimEnd().split('\n');
    const converted = lines.map((line) => {
      if (line.startsWith('#')) return line;
      if (line.startsWith('distance')) return 'distance (in),B (G)';
      const [mm, mT] = line.split(',').map(Number);
      return `${(mm! / 25.4).toPrecision(10)},${(mT! * 10).toPrecision(10)}`;
    });
    await andWaitForReport(() => page.setInputFiles('#survey-files', scratchFile('gauss-inch.csv', converted.join('\n') + '\n')));
    const survey = page.locator('.rf-survey').first();
    await expect(survey.locator('.rf-facts').innerText()).resolves.toMatch(/units\s+G, in \(as in the file\)/);
    const radius = survey.locator('.rf-params').first().locator('tr[data-param=radius]');
    // the readings were made from a 45 mm loop: about 1.77 in on screen, 0.045 m underneath
    expectClose(Number(await radius.getAttribute('data-value')), 0.045, { rel: 0.02 });
    const shown = /([0-9.]+) in/.exec(await radius.locator('td').first().innerText());
    expectClose(Number(shown![1]), Number(await radius.getAttribute('data-value')) / 0.0254, { rel: 1e-3 });
    await expect(survey.locator('.rf-comparison tbody tr').first().innerText()).resolves.toMatch(/[0-9] G\b/);
  });

  it('made no request outside the machine and logged no error', () => {
    expect(browser.requests.length).toBeGreaterThan(0);
    expect(outsideRequests(browser.requests)).toEqual([]);
    expect(browser.errors).toEqual([]);
  });
});
