/**
 * `npm run build`, after `vite build`: writes site/ringfall.html, the web page as one
 * self-contained file that opens from disk (file://) with no server. Chromium refuses
 * module scripts, module workers and fetch() on file:// URLs, so here:
 * - the page (src/web/main.ts) is bundled by esbuild as one classic IIFE script, Chart.js,
 *   the bundled sample files and the Chart.js text the saved HTML report carries included;
 * - the fitting worker (src/web/worker.ts) is bundled the same way and carried as a string
 *   in `ringfallFitWorkerSource`, from which worker-client.ts starts it through a blob: URL;
 * - the styles go into a <style> element, and the page's Content-Security-Policy allows
 *   exactly the one inline script, by its SHA-256.
 * The Vite-only imports the page uses are resolved here the way Vite does: `?raw` imports
 * as the file's text, and `import.meta.glob` of `?raw` files (eager, default import) as an
 * object of path → text. Any other form, or any esbuild warning, fails the build.
 * The multi-file build in site/ (index.html, assets/) is Vite's and is left as it is.
 *
 * `npx tsx scripts/build-single-file.ts [OUTDIR]` writes OUTDIR/ringfall.html (tests).
 */
import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, readdirSync, renameSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build, type Plugin } from 'esbuild';
import { chartLibraryPath, chartLibrarySpecifier } from '../src/cli/chart-library';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const outDir = resolve(process.argv[2] ?? join(root, 'site'));
const fileName = 'ringfall.html';

/** `import x from './file?raw'`: the file's text, as Vite gives it (the Chart.js UMD bundle by name, as vite.config.ts maps it). */
const rawText: Plugin = {
  name: 'raw-text',
  setup(builder) {
    builder.onResolve({ filter: /\?raw$/ }, (args) => {
      const file = args.path.slice(0, -'?raw'.length);
      return { path: file === chartLibrarySpecifier ? chartLibraryPath() : resolve(args.resolveDir, file), namespace: 'raw-text' };
    });
    builder.onLoad({ filter: /.*/, namespace: 'raw-text' }, (args) => ({ contents: readFileSync(args.path, 'utf8'), loader: 'text' }));
  },
};

const globCall = /import\.meta\.glob<string>\(\s*'([^']+)',\s*\{\s*query:\s*'\?raw',\s*import:\s*'default',\s*eager:\s*true,?\s*\}\s*\)/g;

/** `import.meta.glob<string>('dir/*.ext', { query: '?raw', import: 'default', eager: true })`: an object of path (as written) → text. */
const eagerRawGlob: Plugin = {
  name: 'eager-raw-glob',
  setup(builder) {
    builder.onLoad({ filter: /\.ts$/ }, (args) => {
      const source = readFileSync(args.path, 'utf8');
      if (!source.includes('import.meta.glob')) return undefined;
      const contents = source.replace(globCall, (_call, pattern: string) => JSON.stringify(globTexts(dirname(args.path), pattern)));
      if (contents.includes('import.meta.glob')) {
        throw new Error(`${args.path}: an import.meta.glob call this build cannot inline; only import.meta.glob<string>('dir/*.ext', { query: '?raw', import: 'default', eager: true }) is supported. Add the form to scripts/build-single-file.ts.`);
      }
      return { contents, loader: 'ts' };
    });
  },
};

/** Files matching `pattern` (a folder, then a name with `*` wildcards), relative to `from`, keyed as Vite keys them. */
function globTexts(from: string, pattern: string): Record<string, string> {
  const folder = dirname(pattern);
  if (folder.includes('*')) throw new Error(`glob "${pattern}": wildcards in folder names are not supported by the single-file build`);
  const escaped = basename(pattern).replace(/[.+?^${}()|[\]\\]/g, '\\$&').replace(/\*/g, '[^/]*');
  const matches = new RegExp(`^${escaped}$`);
  const names = readdirSync(resolve(from, folder), { withFileTypes: true }).filter((entry) => entry.isFile() && matches.test(entry.name)).map((entry) => entry.name).sort();
  return Object.fromEntries(names.map((name) => [`${folder}/${name}`, readFileSync(resolve(from, folder, name), 'utf8')]));
}

/** One entry bundled as a classic script: its JavaScript and the CSS it imports. */
async function bundle(entry: string): Promise<{ js: string; css: string }> {
  const result = await build({
    absWorkingDir: root,
    entryPoints: [entry],
    outdir: 'single-file',
    write: false,
    bundle: true,
    format: 'iife',
    platform: 'browser',
    // as vite.config.ts
    target: 'es2022',
    minify: true,
    // Chart.js's MIT notice travels with its code
    legalComments: 'eof',
    // import.meta.url appears only where worker-client.ts starts the module worker, a
    // branch the single-file page never takes (it sets ringfallFitWorkerSource)
    define: { 'import.meta.url': '"about:invalid"' },
    plugins: [rawText, eagerRawGlob],
    logLevel: 'silent',
  });
  if (result.warnings.length > 0) {
    throw new Error(`esbuild warned while bundling ${entry}:\n${result.warnings.map((w) => `${w.location?.file ?? ''}:${w.location?.line ?? ''} ${w.text}`).join('\n')}`);
  }
  const text = (extension: string) => result.outputFiles.filter((file) => file.path.endsWith(extension)).map((file) => file.text).join('\n');
  return { js: text('.js'), css: text('.css') };
}

/** Text for inside a <script> element: no `</script` can end it early. */
function scriptText(code: string): string {
  const safe = code.replace(/<\/(script)/gi, '<\\/$1');
  // `<!--` then `<script` would switch the HTML parser to a state where `</script>` does not close the element
  if (safe.includes('<!--')) throw new Error('the bundled page contains "<!--", which cannot be inlined safely in a <script> element');
  return safe;
}

/** A JavaScript string literal of `text` with no `<`, so it cannot close or confuse the <script> element around it. */
function stringLiteral(text: string): string {
  return JSON.stringify(text).replace(/</g, '\\u003c');
}

/** `text` with `search` replaced by `replacement` exactly once (no `$` patterns, unlike String.replace). */
function replaceOnce(text: string, search: string, replacement: string, what: string): string {
  const at = text.indexOf(search);
  if (at < 0 || text.indexOf(search, at + search.length) >= 0) throw new Error(`index.html: expected exactly one ${what} (${search})`);
  return text.slice(0, at) + replacement + text.slice(at + search.length);
}

const worker = await bundle('src/web/worker.ts');
const page = await bundle('src/web/main.ts');
const script = scriptText(`var ringfallFitWorkerSource=${stringLiteral(worker.js)};\n${page.js}`);
const scriptHash = createHash('sha256').update(script, 'utf8').digest('base64');

let html = readFileSync(join(root, 'index.html'), 'utf8');
html = replaceOnce(html, `script-src 'self'`, `script-src 'sha256-${scriptHash}'`, 'Content-Security-Policy script-src');
html = replaceOnce(html, '</head>', `<style>${page.css.replace(/<\/(style)/gi, '<\\/$1')}</style>\n  </head>`, 'end of head');
// last: the script's own text holds `</head>` and the like
html = replaceOnce(html, '<script type="module" src="/src/web/main.ts"></script>', `<script>${script}</script>`, 'page script');

mkdirSync(outDir, { recursive: true });
const target = join(outDir, fileName);
const partial = `${target}.partial-${process.pid}`;
writeFileSync(partial, html);
renameSync(partial, target);
process.stderr.write(`built ${target} (${Math.round(html.length / 1024)} KiB, opens from disk)\n`);
