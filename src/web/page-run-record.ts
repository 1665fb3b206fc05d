import type { RunInput, RunRecord } from '../core/report/run-record';
import { fitRunSettings } from '../core/report/run-record';
import type { ParsedSettings } from './fit-settings';
import packageText from '../../package.json?raw';

/**
 * The page's half of the run record (CONTRACT.md `run`): ringfall's version (package.json,
 * inlined at build time), the time of the run from the browser's clock, and SHA-256 of
 * every file and of the spec text by the browser's own crypto.subtle. Nothing leaves the
 * machine.
 */

/** ringfall's version as built into this page. */
export const pageVersion: string = String((JSON.parse(packageText) as { version?: unknown }).version ?? 'unknown');

/** Why the browser gives no SHA-256: crypto.subtle exists only in a secure context (https, localhost, a file). */
const noDigest = 'this page is not in a secure context, so the browser offers no SHA-256';

/** Lower-case hex SHA-256 of bytes, or null when the browser offers no crypto.subtle here. */
export async function sha256Hex(bytes: Uint8Array): Promise<string | null> {
  const subtle = globalThis.crypto?.subtle;
  if (subtle === undefined) return null;
  const digest = new Uint8Array(await subtle.digest('SHA-256', bytes as Uint8Array<ArrayBuffer>));
  return [...digest].map((b) => b.toString(16).padStart(2, '0')).join('');
}

/** A file as the run record lists it: name, size and SHA-256 of its bytes. */
export async function describePageBytes(name: string, bytes: Uint8Array): Promise<RunInput> {
  const sha256 = await sha256Hex(bytes);
  return sha256 === null ? { name, sha256: null, bytes: bytes.byteLength, note: noDigest } : { name, sha256, bytes: bytes.byteLength };
}

/** A text (a bundled sample, the spec box) as the run record lists it: its UTF-8 bytes hashed. */
export function describePageText(name: string, text: string): Promise<RunInput> {
  return describePageBytes(name, new TextEncoder().encode(text));
}

/** ISO 8601 UTC to the second, from the browser's clock. */
export function pageTime(now: Date = new Date()): string {
  return now.toISOString().replace(/\.\d{3}Z$/, 'Z');
}

/** The run record of one fit of the page: its files, the settings as parsed, the spec and the hand-set columns. */
export function pageRunRecord(time: string, inputs: readonly RunInput[], parsed: ParsedSettings, spec: RunInput | null, columnsSetByHand: readonly string[]): RunRecord {
  return {
    tool: 'ringfall', version: pageVersion, command: 'web page', time, inputs,
    settings: fitRunSettings({
      fit: {
        models: parsed.models, fixed: parsed.fixed,
        ...(parsed.uncertainty ? { instrumentUncertainty: parsed.uncertainty } : {}),
        ...(parsed.positionUncertainty !== null ? { positionUncertainty: parsed.positionUncertainty } : {}),
      },
      thresholds: parsed.thresholds,
      spec,
      extra: { columnsSetByHand: [...columnsSetByHand] },
    }),
  };
}
