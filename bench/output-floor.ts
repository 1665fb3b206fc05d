/**
 * What `fit --json` cannot avoid however fast its fits are, measured on this machine: a
 * Node process's start, reading and hashing the files for the run record, and making the
 * report's JSON text — its numbers are printed as JavaScript's shortest round-trip
 * decimals (ECMA-262 Number::toString), in JSON.stringify's native code. Each survey of a
 * report ringfall wrote is parsed back and stringified again the way the report writes it
 * (one JSON.stringify per survey at the report's indentation), then encoded as UTF-8.
 * A bench figure, not a test: it says how low a whole-process ratio can go.
 */
import { hash } from 'node:crypto';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { measureProcess } from './measure-process';

export interface OutputFloor {
  /** Wall seconds of `node -e 0`. */
  readonly startSeconds: number;
  /** Seconds to read and SHA-256 every file of the folder. */
  readonly readSeconds: number;
  /** Seconds to stringify and encode every survey of the report. */
  readonly textSeconds: number;
  readonly totalSeconds: number;
}

export async function outputFloor(folder: string, reportFile: string): Promise<OutputFloor> {
  // the faster of two starts: the first may find Node's files out of the page cache
  const starts = [await measureProcess(process.execPath, ['-e', '0']), await measureProcess(process.execPath, ['-e', '0'])];
  const startSeconds = Math.min(...starts.map((m) => m.seconds));

  let began = performance.now();
  for (const name of readdirSync(folder)) hash('sha256', readFileSync(join(folder, name)), 'buffer');
  const readSeconds = (performance.now() - began) / 1000;

  const surveys = (JSON.parse(readFileSync(reportFile, 'utf8')) as { surveys: unknown[] }).surveys;
  const buffer = Buffer.allocUnsafe(1 << 20);
  began = performance.now();
  for (const survey of surveys) {
    const text = JSON.stringify([[survey]], null, 2).slice(6, -6);
    if (3 * text.length <= buffer.length) buffer.write(text, 0, 'utf8');
    else Buffer.from(text, 'utf8');
  }
  const textSeconds = (performance.now() - began) / 1000;
  return { startSeconds, readSeconds, textSeconds, totalSeconds: startSeconds + readSeconds + textSeconds };
}
