import { spawnSync, type SpawnSyncOptions } from 'node:child_process';
import { cpSync, mkdirSync, symlinkSync, writeFileSync } from 'node:fs';
import { join, relative, sep } from 'node:path';

/** What `npm pack --json` says of the tarball. */
export interface PackedTarball {
  readonly path: string;
  readonly size: number;
  readonly files: readonly { readonly path: string }[];
}

/** A finished command: status, output, and the spawn error if it could not start. */
export interface CommandRun {
  readonly status: number | null;
  readonly stdout: string;
  readonly stderr: string;
  readonly error: Error | undefined;
}

/** `npm`/`npx` by the name this platform runs. */
export const npm = process.platform === 'win32' ? 'npm.cmd' : 'npm';
export const npx = process.platform === 'win32' ? 'npx.cmd' : 'npx';

/**
 * Run a command with the environment minus npm_* variables (an `npm test` run sets
 * npm_config_* ones that would steer an inner npm: prefix, workspace, …).
 */
export function runCommand(command: string, args: readonly string[], options: SpawnSyncOptions & { cwd: string }): CommandRun {
  const env = Object.fromEntries(Object.entries(process.env).filter(([key]) => !key.toLowerCase().startsWith('npm_')));
  const result = spawnSync(command, args, { encoding: 'utf8', timeout: 600_000, maxBuffer: 1 << 26, ...options, env: { ...env, NO_UPDATE_NOTIFIER: '1', ...options.env }, stdio: 'pipe' });
  return { status: result.status, stdout: String(result.stdout), stderr: String(result.stderr), error: result.error };
}

/** The command's stdout; throws with its output when it failed. */
export function succeeded(run: CommandRun, what: string): string {
  if (run.status !== 0) throw new Error(`${what} failed (status ${run.status}${run.error ? `, ${run.error.message}` : ''}):\n${run.stderr}\n${run.stdout}`);
  return run.stdout;
}

/**
 * ringfall as a user gets it: `npm pack` in a copy of the checkout at `root` (without its
 * build, VCS data or install; node_modules linked in for the build tools, so nothing is
 * written into the checkout; prepack builds dist/), then the tarball installed into an
 * empty project, its dependencies from the registry. Returns the tarball and the project.
 */
export function packAndInstall(root: string, scratch: string): { tarball: PackedTarball; project: string } {
  const source = join(scratch, 'source');
  const skip = new Set(['dist', '.git', 'test-artifacts', join('bench', 'out')]);
  cpSync(root, source, { recursive: true, filter: (path) => !skip.has(relative(root, path)) && !relative(root, path).split(sep).includes('node_modules') });
  symlinkSync(join(root, 'node_modules'), join(source, 'node_modules'), 'dir');
  const listing = succeeded(runCommand(npm, ['pack', '--json', '--pack-destination', scratch], { cwd: source }), 'npm pack');
  const [packed] = JSON.parse(listing.slice(listing.indexOf('['))) as { filename: string; size: number; files: { path: string }[] }[];
  const tarball = { path: join(scratch, packed!.filename), size: packed!.size, files: packed!.files };
  const project = join(scratch, 'consumer');
  mkdirSync(project);
  writeFileSync(join(project, 'package.json'), `${JSON.stringify({ name: 'ringfall-consumer', version: '1.0.0', private: true, type: 'module' }, null, 2)}\n`);
  succeeded(runCommand(npm, ['install', '--no-audit', '--no-fund', tarball.path], { cwd: project }), 'npm install of the tarball');
  return { tarball, project };
}
