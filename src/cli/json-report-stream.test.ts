import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { jsonPieces } from './json-pieces';
import { JsonReportStream, reportSurveyText } from './json-report-stream';
import type { Report } from '../core/report/report';

/** A value JSON.stringify must write, with large arrays (opened up by jsonPieces) and values it leaves out or turns to null. */
const jsonish = fc.letrec((tie) => ({
  value: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    fc.constantFrom<unknown>(null, true, false, 0, -0, 1e21, 5e-324, Number.NaN, Number.POSITIVE_INFINITY, undefined, () => 1, Symbol('s')),
    fc.double(),
    fc.string({ unit: 'binary' }),
    fc.date({ noInvalidDate: true }),
    tie('array'),
    tie('object'),
  ),
  array: fc.oneof(fc.array(tie('value'), { maxLength: 4 }), fc.array(fc.oneof(fc.integer(), fc.string(), fc.constant(undefined)), { minLength: 300, maxLength: 600 })),
  object: fc.dictionary(fc.string({ unit: 'binary' }), tie('value'), { maxKeys: 5 }),
}));

describe('JSON in pieces', () => {
  // reference: JSON.stringify itself (ECMA-262 JSON.stringify with an indent of 2)
  it('joins to the bytes of JSON.stringify(value, null, 2) at any indent', () => {
    fc.assert(fc.property(fc.oneof(jsonish.array, jsonish.object), fc.constantFrom('', '  ', '    '), (value, pad) => {
      const expected = JSON.stringify(value, null, 2).replace(/\n/g, `\n${pad}`);
      expect([...jsonPieces(value, pad)].join('')).toBe(expected);
    }), { numRuns: 300, seed: 16 });
  });

  it('writes a large value as many small pieces, not one string', () => {
    const fleet = { coils: Array.from({ length: 20_000 }, (_, i) => ({ coil: `C-${i}`, history: [{ date: null, ampereTurns: { value: i, ci95: [i - 1, i + 1] } }] })) };
    const pieces = [...jsonPieces(fleet, '  ')];
    // reference: JSON.stringify of the same value
    expect(pieces.join('')).toBe(JSON.stringify(fleet, null, 2).replace(/\n/g, '\n  '));
    expect(Math.max(...pieces.map((piece) => piece.length))).toBeLessThan(10_000);
  });

  it('leaves out, or writes as null, what JSON cannot hold in a large value as JSON.stringify does', () => {
    const left = Object.fromEntries(Array.from({ length: 400 }, (_, i) => [`k${i}`, i % 2 === 0 ? undefined : () => i]));
    const value = { left, nulls: Array.from({ length: 400 }, (_, i) => (i % 2 === 0 ? undefined : Symbol('s'))), empty: [], none: {} };
    // reference: JSON.stringify of the same value
    expect([...jsonPieces(value)].join('')).toBe(JSON.stringify(value, null, 2));
  });
});

describe('a survey\'s text at the report\'s indentation', () => {
  // reference: JSON.stringify(value, null, 2) with every line after the first indented by four spaces, and four before the first
  it('reportSurveyText(value) is "    " + JSON.stringify(value, null, 2) indented by four spaces', () => {
    fc.assert(fc.property(jsonish.object, (value) => {
      expect(reportSurveyText(value)).toBe(`    ${JSON.stringify(value, null, 2).replace(/\n/g, '\n    ')}`);
    }), { numRuns: 300, seed: 17 });
  });
});

describe('the streamed JSON report', () => {
  const report = {
    schema: 'test/1',
    run: { inputs: Array.from({ length: 3000 }, (_, i) => ({ name: `f${i}.csv`, sha256: 'ab'.repeat(32) })) },
    surveys: [{ source: 'a.csv', n: 1 }, { source: 'b.csv', n: [1, 2] }],
    skipped: undefined,
    fleet: { coils: Array.from({ length: 3000 }, (_, i) => ({ coil: `C-${i}` })) },
  };
  const toJson = (part: Report) => ({ ...report, surveys: part.surveys });

  // reference: JSON.stringify of the whole report, the bytes the stream must give
  it('gives the bytes of one JSON.stringify of the whole report, in writes of bounded size, waiting when asked', async () => {
    const writes: string[] = [];
    let waits = 0;
    const stream = new JsonReportStream({ write: (text) => writes.push(text) }, toJson, () => (writes.length % 3 === 0 ? new Promise((resolve) => { waits += 1; setImmediate(resolve); }) : null));
    for (const survey of report.surveys) await stream.surveyText(JSON.stringify(survey, null, 2));
    await stream.finish({}, { partial: { signal: 'SIGTERM' } });
    expect(writes.join('')).toBe(`${JSON.stringify({ ...report, partial: { signal: 'SIGTERM' } }, null, 2)}\n`);
    expect(Math.max(...writes.map((text) => text.length))).toBeLessThan(80_000);
    expect(waits).toBeGreaterThan(0);
  });

  // reference: JSON.stringify of the whole report, encoded as UTF-8 by Buffer.from
  it('gives the same bytes into a byte sink, in buffers of about 1 MB (a survey larger than that in one of its own)', async () => {
    const surveys = [
      ...Array.from({ length: 400 }, (_, i) => ({ source: `s${i}.csv`, stopReason: 'relative reduction of χ² below 1e-10', note: '😀'.repeat(i % 7), values: Array.from({ length: 40 }, (_, j) => i * j * 1e-7) })),
      // one survey larger than a buffer on its own
      { source: 'big.csv', text: 'ρ µ'.repeat(400_000) },
    ];
    const whole = { ...report, surveys };
    const pieces: Uint8Array[] = [];
    const stream = new JsonReportStream({ write: (bytes: Uint8Array) => pieces.push(bytes) }, (part: Report) => ({ ...report, surveys: part.surveys }), undefined, { bytes: true });
    for (const survey of surveys) await stream.surveyJson(reportSurveyText(survey));
    await stream.finish();
    expect(Buffer.concat(pieces).equals(Buffer.from(`${JSON.stringify(whole, null, 2)}\n`, 'utf8'))).toBe(true);
    // regression pin, not truth: the stream's own 1 MB buffers (the small surveys, then the 2 MB one of its own: "ρ µ" is 5 bytes in UTF-8, RFC 3629) give at least 3 writes, none near 4 MB
    expect(pieces.length).toBeGreaterThanOrEqual(3);
    expect(Math.max(...pieces.map((piece) => piece.length))).toBeLessThan(4_000_000);
  });

  // reference: JSON.stringify of the whole report, encoded as UTF-8 by Buffer.from
  it('with reuse, writes into a buffer again only after the sink said it was done with it, and the bytes stay the same', async () => {
    const surveys = Array.from({ length: 3000 }, (_, i) => ({ source: `s${i}.csv`, stopReason: 'relative reduction of χ² below 1e-10', values: Array.from({ length: 40 }, (_, j) => i * j * 1e-7) }));
    const copies: Buffer[] = [];
    const held = new Set<ArrayBufferLike>();
    const seen = new Set<ArrayBufferLike>();
    // as a Writable: the bytes are taken (copied here) later, then `done` is called; a buffer written into while held would corrupt the copy
    const sink = {
      write: (bytes: Uint8Array, done?: (error?: Error | null) => void) => {
        expect(held.has(bytes.buffer)).toBe(false);
        held.add(bytes.buffer);
        seen.add(bytes.buffer);
        setImmediate(() => {
          copies.push(Buffer.from(bytes));
          held.delete(bytes.buffer);
          done?.();
        });
      },
    };
    const stream = new JsonReportStream(sink, (part: Report) => ({ ...report, surveys: part.surveys }), undefined, { bytes: true, reuse: true });
    for (const [i, survey] of surveys.entries()) {
      await stream.surveyJson(reportSurveyText(survey));
      // let the sink take what it was given now and then, as stdout does between files
      if (i % 50 === 0) await new Promise((resolve) => setImmediate(resolve));
    }
    await stream.finish();
    await new Promise((resolve) => setImmediate(resolve));
    expect(Buffer.concat(copies).equals(Buffer.from(`${JSON.stringify({ ...report, surveys }, null, 2)}\n`, 'utf8'))).toBe(true);
    // more writes than buffers: buffers were written into again
    expect(seen.size).toBeLessThan(copies.length);
  });

  it('gives an empty survey list when no survey came', async () => {
    const writes: string[] = [];
    const stream = new JsonReportStream({ write: (text) => writes.push(text) }, (part: Report) => ({ schema: 'test/1', surveys: part.surveys }));
    await stream.finish();
    // reference: JSON.stringify
    expect(writes.join('')).toBe(`${JSON.stringify({ schema: 'test/1', surveys: [] }, null, 2)}\n`);
  });
});
