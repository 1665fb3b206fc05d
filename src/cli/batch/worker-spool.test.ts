import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { spoolLine } from './survey-spool';
import { WorkerSpools } from './worker-spool';

const folder = mkdtempSync(join(tmpdir(), 'ringfall-worker-spool-test-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

describe('WorkerSpools', () => {
  it('WorkerSpools.at() gives back each spooled value as it was: non-finite numbers, a string that starts with NUL, text beyond one write block', () => {
    const spools = new WorkerSpools(folder);
    try {
      const writer = spools.writer();
      // values JSON cannot hold as they are (spoolLine tags them), and plain ones that need no tag
      const values: unknown[] = [
        { aicc: Infinity, rss: -Infinity, chi: NaN, name: '\u0000n:1', coil: 'QA-107' },
        { coil: 'Ω-7 µT', date: null, fits: [{ model: 'loop', stats: { n: 30 } }] },
        // longer than the writer's 1 MB buffer: written on its own
        { text: 'x'.repeat((1 << 20) + 10) },
        'é'.repeat(100_000),
      ];
      const places = values.map((value) => writer.append(spoolLine(value)));
      // reference: the values themselves (a round trip)
      expect(places.map((place) => spools.at(place))).toEqual(values);
      // the main thread's reads see what its own writer gathered, in order, one after another
      expect(places.slice(1).map((place, i) => place.offset - places[i]!.offset - places[i]!.length)).toEqual([0, 0, 0]);
    } finally {
      spools.close();
    }
  });

  it('WorkerSpools.readUpTo() stops at the end of a spool and says how many bytes it read', () => {
    const own = join(folder, 'read-up-to');
    mkdirSync(own);
    const spools = new WorkerSpools(own);
    try {
      const { place, lengths } = spools.writer().appendParts(['abc', 'déf']);
      // RFC 3629 (UTF-8): U+00E9 "é" takes 2 bytes
      expect(lengths).toEqual([3, 4]);
      const into = Buffer.alloc(100);
      expect(spools.readUpTo(place.spool, into, place.offset)).toBe(7);
      expect(into.toString('utf8', 0, 7)).toBe('abcdéf');
    } finally {
      spools.close();
    }
  });
});
