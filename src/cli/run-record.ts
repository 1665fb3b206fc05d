import * as crypto from 'node:crypto';
import { closeSync, constants, fstatSync, openSync, readFileSync, readSync } from 'node:fs';
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
  return { name, sha256: sha256(bytes).toString('hex'), bytes: bytes.byteLength };
}

/** Node's one-shot hash (Node 20.12 on), where this Node has it. */
const oneShotHash = (crypto as { hash?: (algorithm: string, data: Uint8Array, encoding: 'buffer') => Buffer }).hash;

/**
 * The SHA-256 digest of bytes in hand: by Node's one-shot crypto.hash where there is one
 * (no Hash object per file: 10,000 half-kilobyte files hashed in ~12 ms against ~25 ms,
 * 2 cores), else by createHash; the same digest (FIPS 180-4) either way.
 */
export function sha256(bytes: Uint8Array): Buffer {
  return oneShotHash === undefined ? crypto.createHash('sha256').update(bytes).digest() : oneShotHash('sha256', bytes, 'buffer');
}

/** A file named in the run that could not be read: listed, with no hash and the reason. */
export function unreadableInput(name: string, reason: string): RunInput {
  return { name, sha256: null, bytes: null, note: reason };
}

/**
 * SHA-256 and size of each file, read in 64 kB pieces into one reused buffer (a large fleet
 * is neither held in memory nor made into garbage); a file that cannot be read, or is not a
 * regular file, is listed with no hash and the reason. Same order as `paths`.
 */
export async function describeFiles(paths: readonly string[]): Promise<RunInput[]> {
  const inputs: RunInput[] = [];
  const buffer = Buffer.allocUnsafe(hashChunk);
  for (const [i, path] of paths.entries()) {
    inputs.push(describeFile(path, buffer));
    // a pause for events now and then: the workers' results and signals wait for no long run of hashing
    if (i % 100 === 99) await new Promise((resolve) => setImmediate(resolve));
  }
  return inputs;
}

/** Bytes read at a time when hashing a file: one buffer reused for every file, so a fleet's hashing allocates nothing per file. */
const hashChunk = 1 << 16;

function describeFile(path: string, buffer: Buffer): RunInput {
  let fd: number;
  try {
    fd = openSync(path, constants.O_RDONLY | constants.O_NONBLOCK);
  } catch (error) {
    return unreadableInput(path, `could not be read: ${(error as NodeJS.ErrnoException).code ?? (error as Error).message}`);
  }
  try {
    if (!fstatSync(fd).isFile()) return unreadableInput(path, 'not a regular file');
    const hash = crypto.createHash('sha256');
    let bytes = 0;
    for (let got = readSync(fd, buffer, 0, buffer.length, null); got > 0; got = readSync(fd, buffer, 0, buffer.length, null)) {
      hash.update(buffer.subarray(0, got));
      bytes += got;
    }
    return { name: path, sha256: hash.digest('hex'), bytes };
  } catch (error) {
    return unreadableInput(path, `could not be read: ${(error as NodeJS.ErrnoException).code ?? (error as Error).message}`);
  } finally {
    closeSync(fd);
  }
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
