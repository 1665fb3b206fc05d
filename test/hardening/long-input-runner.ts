/**
 * Child-process side of long-inputs.test.ts: runs every long-input case and prints one
 * line per case ("start NAME", then "ok NAME" or "fail NAME: why") so the parent can name
 * the case a watchdog stopped. Exits 1 when a case threw something other than a
 * RingfallError (a crash rather than a message).
 */
import { RingfallError } from '../../src/core/errors';
import { longInputCases } from './long-input-cases';

/** RINGFALL_LONG_CASE=text runs only the cases whose name contains it (for a look at one case). */
const only = process.env['RINGFALL_LONG_CASE'] ?? '';
let failed = false;
for (const { name, run } of longInputCases.filter((c) => c.name.includes(only))) {
  process.stdout.write(`start ${name}\n`);
  try {
    run();
    process.stdout.write(`ok ${name}\n`);
  } catch (error) {
    if (error instanceof RingfallError) {
      const oneLine = !/[\r\n]/.test(error.message);
      process.stdout.write(oneLine ? `ok ${name}\n` : `fail ${name}: the message is not one line\n`);
      if (!oneLine) failed = true;
    } else {
      failed = true;
      process.stdout.write(`fail ${name}: ${String(error).slice(0, 200)}\n`);
    }
  }
}
process.exit(failed ? 1 : 0);
