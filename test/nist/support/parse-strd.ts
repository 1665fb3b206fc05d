/**
 * A small parser for the NIST StRD nonlinear-regression files (test/nist/data): the two
 * starting points, the certified parameters and residual sum of squares, and the data
 * columns (y first, then one or two predictors). Throws on anything it cannot read, so
 * a damaged file fails the test instead of fitting nothing.
 */
export interface StrdProblem {
  readonly name: string;
  readonly starts: readonly [readonly number[], readonly number[]];
  readonly certified: readonly number[];
  readonly certifiedStandardDeviation: readonly number[];
  readonly certifiedRss: number;
  readonly y: Float64Array;
  /** Predictor columns x (Nelson has x1, x2). */
  readonly x: readonly Float64Array[];
}

/** Parse one StRD file's text (CRLF or LF). */
export function parseStrd(name: string, text: string): StrdProblem {
  const lines = text.replace(/\r/g, '').split('\n');
  const start1: number[] = [];
  const start2: number[] = [];
  const certified: number[] = [];
  const deviation: number[] = [];
  let certifiedRss = NaN;
  let observations = NaN;
  let dataStart = -1;
  lines.forEach((line, index) => {
    const parameter = /^\s*b(\d+)\s*=\s*(\S+)\s+(\S+)\s+(\S+)\s+(\S+)\s*$/.exec(line);
    if (parameter !== null) {
      if (Number(parameter[1]) !== start1.length + 1) throw new Error(`${name}: parameter out of order at line ${index + 1}`);
      start1.push(number(parameter[2], name, index));
      start2.push(number(parameter[3], name, index));
      certified.push(number(parameter[4], name, index));
      deviation.push(number(parameter[5], name, index));
    }
    const rss = /^Residual Sum of Squares:\s+(\S+)/.exec(line);
    if (rss !== null) certifiedRss = number(rss[1], name, index);
    const count = /^Number of Observations:\s+(\d+)/.exec(line);
    if (count !== null) observations = Number(count[1]);
    if (/^Data:\s+y\s/.test(line)) dataStart = index + 1;
  });
  if (start1.length === 0 || Number.isNaN(certifiedRss) || dataStart < 0) throw new Error(`${name}: not a StRD file`);
  const rows = lines
    .slice(dataStart)
    .filter((line) => line.trim() !== '')
    .map((line, row) => line.trim().split(/\s+/).map((cell) => number(cell, name, dataStart + row)));
  if (rows.length !== observations) throw new Error(`${name}: ${rows.length} data rows, header says ${observations}`);
  const columns = rows[0]!.length;
  const column = (c: number): Float64Array => Float64Array.from(rows, (row) => row[c]!);
  return {
    name,
    starts: [start1, start2],
    certified,
    certifiedStandardDeviation: deviation,
    certifiedRss,
    y: column(0),
    x: Array.from({ length: columns - 1 }, (_, c) => column(c + 1)),
  };
}

function number(text: string | undefined, name: string, index: number): number {
  const value = Number(text);
  if (text === undefined || !Number.isFinite(value)) throw new Error(`${name}: "${text}" is not a number (line ${index + 1})`);
  return value;
}
