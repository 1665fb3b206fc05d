/**
 * Child-process side of fuzz.test.ts: checks every fuzz property with a fixed seed and
 * prints one JSON line per property ({ name, ok, message }), after a "start NAME" line,
 * so the parent can name a property its watchdog stopped.
 */
import fc from 'fast-check';
import { fuzzProperties } from './fuzz-properties';

/** Fixed seed: the same cases on every run (DEVELOPERS.md: seeded randomness everywhere). */
const seed = Number(process.env['RINGFALL_FUZZ_SEED'] ?? 16);
const only = process.env['RINGFALL_FUZZ_ONLY'] ?? '';

for (const { name, numRuns, property } of fuzzProperties.filter((p) => p.name.includes(only))) {
  process.stdout.write(`start ${name}\n`);
  const details = fc.check(property(), { numRuns, seed }) as fc.RunDetails<unknown[]>;
  const message = details.failed ? fc.defaultReportMessage(details) ?? 'failed' : '';
  process.stdout.write(`${JSON.stringify({ name, ok: !details.failed, message: message.slice(0, 4000) })}\n`);
}
