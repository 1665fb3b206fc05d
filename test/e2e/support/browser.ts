/**
 * Shared Chromium launcher for end-to-end tests and benchmarks: Debian's
 * /usr/bin/chromium driven by playwright-core (never a downloaded browser), a fresh
 * temporary profile per launch, and a log of every network request so a test can
 * assert that nothing leaves the machine. Also starts and stops a Vite server for the
 * web page, spawned from node_modules/.bin/vite and stopped by its own PID.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

/** Repository root (two levels above test/e2e/support). */
export const repoRoot = join(dirname(fileURLToPath(import.meta.url)), '..', '..', '..');

/** Where tests put screenshots and other artifacts (git-ignored). */
export const artifactsDir = join(repoRoot, 'test-artifacts');

const chromiumPath = '/usr/bin/chromium';
const chromiumArgs = [
  '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync',
];

/** A running browser: its context, every request URL it made, and a way to close it. */
export interface BrowserSession {
  readonly context: BrowserContext;
  /** Every request URL any page of the context made, in order (data: and blob: included). */
  readonly requests: string[];
  /** Console messages of type error and uncaught page errors, as text. */
  readonly errors: string[];
  newPage(): Promise<Page>;
  /** Close the browser and delete its temporary profile. */
  close(): Promise<void>;
}

/**
 * Launch headless Chromium with a fresh temporary profile (launchPersistentContext with
 * a profile directory, not --user-data-dir) and record every network request.
 */
export async function launchBrowser(options: { viewport?: { width: number; height: number } } = {}): Promise<BrowserSession> {
  const profileDir = mkdtempSync(join(tmpdir(), 'ringfall-chromium-'));
  const context = await chromium.launchPersistentContext(profileDir, {
    executablePath: chromiumPath,
    headless: true,
    args: chromiumArgs,
    viewport: options.viewport ?? { width: 1280, height: 800 },
  });
  const requests: string[] = [];
  const errors: string[] = [];
  context.on('request', (request) => { requests.push(request.url()); });
  const watch = (page: Page) => {
    page.on('console', (message) => { if (message.type() === 'error') errors.push(message.text()); });
    page.on('pageerror', (error) => { errors.push(String(error)); });
  };
  context.pages().forEach(watch);
  context.on('page', watch);
  return {
    context,
    requests,
    errors,
    newPage: () => context.newPage(),
    close: async () => {
      await context.close();
      rmSync(profileDir, { recursive: true, force: true });
    },
  };
}

/**
 * Requests that left the machine: anything that is not http(s) on 127.0.0.1/localhost,
 * nor a data:, blob: or about: URL.
 */
export function outsideRequests(requests: readonly string[]): string[] {
  return requests.filter((url) => {
    if (url.startsWith('data:') || url.startsWith('blob:') || url.startsWith('about:')) return false;
    try {
      const parsed = new URL(url);
      if (parsed.protocol === 'file:') return false;
      return !['127.0.0.1', 'localhost', '[::1]'].includes(parsed.hostname);
    } catch {
      return true;
    }
  });
}

/** A Vite server serving the web page. */
export interface WebServer {
  readonly url: string;
  stop(): Promise<void>;
}

/**
 * Serve the web page: `preview` builds it into a temporary folder first and serves the
 * production bundle (what users get); `dev` runs the dev server. The server is spawned
 * from node_modules/.bin/vite and stopped by its PID.
 */
export async function startWebServer(mode: 'preview' | 'dev' = 'preview'): Promise<WebServer> {
  const vite = join(repoRoot, 'node_modules', '.bin', 'vite');
  let outDir: string | null = null;
  if (mode === 'preview') {
    outDir = mkdtempSync(join(tmpdir(), 'ringfall-web-build-'));
    await runToEnd(vite, ['build', '--outDir', outDir, '--emptyOutDir', '--logLevel', 'warn']);
  }
  const port = await freePort();
  const args = mode === 'preview'
    ? ['preview', '--outDir', outDir!, '--port', String(port), '--strictPort', '--host', '127.0.0.1']
    : ['--port', String(port), '--strictPort', '--host', '127.0.0.1'];
  const child = spawn(vite, args, { cwd: repoRoot, stdio: ['ignore', 'pipe', 'pipe'], env: { ...process.env, BROWSER: 'none' } });
  const url = `http://127.0.0.1:${port}/`;
  await waitForOutput(child, String(port));
  return {
    url,
    stop: async () => {
      await stopProcess(child);
      if (outDir) rmSync(outDir, { recursive: true, force: true });
    },
  };
}

function runToEnd(command: string, args: string[]): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { cwd: repoRoot, stdio: ['ignore', 'pipe', 'pipe'] });
    let output = '';
    child.stdout?.on('data', (chunk: Buffer) => { output += chunk.toString(); });
    child.stderr?.on('data', (chunk: Buffer) => { output += chunk.toString(); });
    child.on('error', reject);
    child.on('exit', (code) => {
      if (code === 0) resolve();
      else reject(new Error(`${command} ${args.join(' ')} exited with ${code}:\n${output}`));
    });
  });
}

function waitForOutput(child: ChildProcess, marker: string, timeoutMs = 60_000): Promise<void> {
  return new Promise((resolve, reject) => {
    let output = '';
    const timer = setTimeout(() => {
      void stopProcess(child);
      reject(new Error(`vite did not start within ${timeoutMs} ms:\n${output}`));
    }, timeoutMs);
    const onData = (chunk: Buffer) => {
      output += chunk.toString();
      if (output.includes(marker)) {
        clearTimeout(timer);
        resolve();
      }
    };
    child.stdout?.on('data', onData);
    child.stderr?.on('data', onData);
    child.on('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`vite exited with ${code} before serving:\n${output}`));
    });
  });
}

/** Stop a child by its PID: SIGTERM, then SIGKILL after 5 s. */
function stopProcess(child: ChildProcess): Promise<void> {
  return new Promise((resolve) => {
    if (child.exitCode !== null || child.pid === undefined) { resolve(); return; }
    const pid = child.pid;
    const timer = setTimeout(() => { try { process.kill(pid, 'SIGKILL'); } catch { /* already gone */ } }, 5000);
    child.once('exit', () => { clearTimeout(timer); resolve(); });
    try { process.kill(pid, 'SIGTERM'); } catch { clearTimeout(timer); resolve(); }
  });
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      server.close(() => resolve(port));
    });
  });
}
