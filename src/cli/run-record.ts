import { createHash } from 'node:crypto';
import { createReadStream, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { RingfallError } from '../core/errors';
import type { RunInput, RunRecord, RunValue } from '../core/report/run-record';
import { packageRoot } from './package-files';

/**
 * The CLI's half of the run record (CONTRACT.md `run`): the version from package.json,
 * the time of the run, and each input file's SHA-256 (node:crypto). Core only assembles
 * and renders what these give it.
 */

let version: string | null = null;

/** ringfall's version, from the package.json of the package root (sources or built dist/). */
export function ringfallVersion(): string {
  if (version === null) {
    const text = readFileSync(join(packageRoot, 'package.json'), 'utf8');
    version = String((JSON.parse(text) as { version?: unknown }).version ?? 'unknown');
  }
  return version;
}

/**
 * The time of the run as ISO 8601 UTC to the second ("2026-03-14T09:30:00Z"). When the
 * environment sets SOURCE_DATE_EPOCH (seconds since 1970-01-01 UTC, the reproducible-builds
 * convention, reproducible-builds.org/specs/source-date-epoch), that time is used instead
 * of the clock, so two runs on the same files print the same bytes.
 * @throws RingfallError `OPTION_VALUE` when SOURCE_DATE_EPOCH is set but is not a whole number of seconds
 * @example runTime({ SOURCE_DATE_EPOCH: '0' }) // '1970-01-01T00:00:00Z'
 */
export function runTime(env: NodeJS.ProcessEnv = process.env, now: () => Date = () => new Date()): string {
  const epoch = env['SOURCE_DATE_EPOCH'];
  if (epoch !== undefined && epoch !== '') {
    const seconds = Number(epoch);
    if (!/^\d+$/.test(epoch.trim()) || !Number.isSafeInteger(seconds) || seconds > 8.64e12) {
      throw new RingfallError('OPTION_VALUE', `SOURCE_DATE_EPOCH: "${epoch}" is not a whole number of seconds since 1970-01-01 UTC. Unset it, or give one like 1773480600.`, { value: epoch, where: 'SOURCE_DATE_EPOCH' });
    }
    return isoSeconds(new Date(seconds * 1000));
  }
  return isoSeconds(now());
}

function isoSeconds(date: Date): string {
  return date.toISOString().replace(/\.\d{3}Z$/, 'Z');
}

/** SHA-256 (hex) and size of bytes already read. */
export function describeBytes(name: string, bytes: Uint8Array): RunInput {
  return { name, sha256: createHash('sha256').update(bytes).digest('hex'), bytes: bytes.byteLength };
}

/** A file named in the run that could not be read: listed, with no hash and the reason. */
export function unreadableInput(name: string, reason: string): RunInput {
  return { name, sha256: null, bytes: null, note: reason };
}

/**
 * SHA-256 and size of each file, streamed (a large fleet is not held in memory); a file
 * that cannot be read is listed with no hash and the reason. Same order as `paths`.
 */
export async function describeFiles(paths: readonly string[]): Promise<RunInput[]> {
  const inputs: RunInput[] = [];
  for (const path of paths) inputs.push(await describeFile(path));
  return inputs;
}

function describeFile(path: string): Promise<RunInput> {
  return new Promise((resolve) => {
    const hash = createHash('sha256');
    let bytes = 0;
    const stream = createReadStream(path);
    stream.on('data', (chunk: Buffer | string) => { hash.update(chunk); bytes += typeof chunk === 'string' ? Buffer.byteLength(chunk) : chunk.byteLength; });
    stream.on('error', (error: NodeJS.ErrnoException) => resolve(unreadableInput(path, `could not be read: ${error.code ?? error.message}`)));
    stream.on('end', () => resolve({ name: path, sha256: hash.digest('hex'), bytes }));
  });
}

/** A spec file as the run record lists it, or null when none was given. */
export function describeSpecFile(path: string | null): RunInput | null {
  if (path === null) return null;
  try {
    return describeBytes(path, readFileSync(path));
  } catch (error) {
    return unreadableInput(path, `could not be read: ${(error as NodeJS.ErrnoException).code ?? (error as Error).message}`);
  }
}

/** A run record of one CLI command, with ringfall's version; `time` is runTime() taken when the command started. */
export function cliRunRecord(command: string, time: string, inputs: readonly RunInput[], settings: Readonly<Record<string, RunValue>>): RunRecord {
  return { tool: 'ringfall', version: ringfallVersion(), command, time, inputs, settings };
}
