import { Command } from 'commander';
import { describe, expect, it } from 'vitest';
import { expectClose } from '../../test/support/expect-close';
import { addFitOptions, readFitFlags, type FitFlags } from './fit-options';

/** Parse a command line the way `ringfall fit` does and read the typed options. */
function parse(...args: string[]) {
  let flags: FitFlags = {};
  const command = addFitOptions(new Command('fit').argument('[files...]').exitOverride()).action((_files: string[], parsed: FitFlags) => {
    flags = parsed;
  });
  command.parse(['node', 'fit', 'a.csv', ...args]);
  return readFitFlags(flags);
}

describe('readFitFlags(flags)', () => {
  it('readFitFlags() defaults to the five CONTRACT.md models, seed 1, no uncertainty, text output', () => {
    const options = parse();
    expect(options.fit.models).toEqual(['loop', 'dipole', 'power-law', 'inverse-square', 'inverse-cube']);
    expect(options.fit).toMatchObject({ fixed: {}, instrumentUncertainty: null, positionUncertainty: null, robust: null, seed: 1 });
    expect(options).toMatchObject({ json: false, spec: null, thresholds: [], html: null, csv: null, import: {} });
    expect(options.fit.exhaustiveStarts).toBeUndefined();
  });

  it('readFitFlags() turns --all-starts into exhaustiveStarts (every seeded start, no early stop)', () => {
    expect(parse('--all-starts').fit.exhaustiveStarts).toBe(true);
  });

  it('readFitFlags() reads --model lists, comma-separated or repeated, once each', () => {
    expect(parse('--model', 'loop, dipole', '--model', 'loop,solenoid').fit.models).toEqual(['loop', 'dipole', 'solenoid']);
  });

  it('readFitFlags() refuses a --model with no id in it rather than fitting the defaults silently (OPTION_VALUE)', () => {
    expect(() => parse('--model', ' , ')).toThrow(/--model: " , " is not usable\. Give model ids, e\.g\. loop,dipole, or leave --model out/);
    expect(() => parse('--model', '')).toThrow(expect.objectContaining({ code: 'OPTION_VALUE', where: '--model' }));
  });

  it('readFitFlags() reads --fix NAME=QTY into SI in the unit kind of the parameter (mm, G, A)', () => {
    const fixed = parse('--model', 'loop', '--fix', 'radius=45mm', '--fix', 'background=0.2 G', '--fix', 'ampereTurns=360A').fit.fixed!;
    // 1 G = 1e-4 T exactly (DOMAIN.md §6)
    expectClose(fixed['radius']!, 0.045, { rel: 1e-15 });
    expectClose(fixed['background']!, 2e-5, { rel: 1e-15 });
    expect(fixed['ampereTurns']).toBe(360);
  });

  it('readFitFlags() takes a --fix name from any chosen model (moment of the dipole) and refuses one no chosen model has', () => {
    expect(parse('--model', 'loop,dipole', '--fix', 'moment=2.5A·m²').fit.fixed).toEqual({ moment: 2.5 });
    expect(() => parse('--model', 'loop', '--fix', 'moment=2.5A·m²')).toThrow(expect.objectContaining({ code: 'FIT_UNKNOWN_PARAMETER' }));
  });

  it('readFitFlags() refuses a parameter fixed twice (OPTION_TWICE) and a length given as a current (QUANTITY_KIND)', () => {
    expect(() => parse('--fix', 'radius=45mm', '--fix', 'radius=46mm')).toThrow(expect.objectContaining({ code: 'OPTION_TWICE' }));
    expect(() => parse('--fix', 'radius=45A')).toThrow(expect.objectContaining({ code: 'QUANTITY_KIND' }));
  });

  it('readFitFlags() reads --uncertainty 1.5%+2uT, --position-uncertainty 0.5mm and --threshold 0.5mT in SI', () => {
    const options = parse('--uncertainty', '1.5%+2uT', '--position-uncertainty', '0.5mm', '--threshold', '0.5mT', '--threshold', '5 G');
    expectClose(options.fit.instrumentUncertainty!.relative, 0.015, { rel: 1e-15 });
    expectClose(options.fit.instrumentUncertainty!.absolute, 2e-6, { rel: 1e-15 });
    expectClose(options.fit.positionUncertainty!, 5e-4, { rel: 1e-15 });
    // 5 G = 0.5 mT (DOMAIN.md §6)
    expect(options.thresholds.map((t) => Number(t.value.toPrecision(12)))).toEqual([5e-4, 5e-4]);
  });

  it('readFitFlags() accepts a threshold preset by name (implant-static = 0.5 mT)', () => {
    // ICNIRP 2009 implant screening line, DOMAIN.md §4.3 / §9 row 58
    expect(parse('--threshold', 'implant-static').thresholds[0]?.value).toBe(5e-4);
  });

  it('readFitFlags() reads --robust, --seed, --json, unit options and the file paths of --spec, --html, --csv', () => {
    const options = parse('--robust', 'soft-l1', '--seed', '42', '--json', '--field-unit', 'mT', '--distance-unit', 'cm', '--spec', 's.json', '--html', 'r.html', '--csv', 'r.csv');
    expect(options.fit).toMatchObject({ robust: 'soft-l1', seed: 42 });
    expect(options).toMatchObject({ json: true, import: { fieldUnit: 'mT', distanceUnit: 'cm' }, spec: 's.json', html: 'r.html', csv: 'r.csv' });
  });

  it('readFitFlags() refuses an unknown robust loss, a negative seed and a negative position uncertainty (OPTION_VALUE)', () => {
    expect(() => parse('--robust', 'tukey')).toThrow(/--robust: "tukey" is not usable\. Give huber or soft-l1/);
    expect(() => parse('--seed', '-3')).toThrow(expect.objectContaining({ code: 'OPTION_VALUE' }));
    expect(() => parse('--position-uncertainty', '-1mm')).toThrow(expect.objectContaining({ code: 'OPTION_VALUE' }));
  });

  it('readFitFlags() refuses a --field-unit or --distance-unit that is not a unit of that kind before any file is read (OPTION_VALUE)', () => {
    expect(() => parse('--field-unit', 'furlong')).toThrow(/--field-unit: "furlong" is not usable\. Give a field unit: T, mT, µT, nT, kG, G, mG\./);
    expect(() => parse('--distance-unit', 'mT')).toThrow(/--distance-unit: "mT" is not usable\. Give a length unit: m, cm, mm, µm, in\./);
    expect(() => parse('--field-unit', 'mm')).toThrow(expect.objectContaining({ code: 'OPTION_VALUE', value: 'mm' }));
    expect(parse('--field-unit', 'G', '--distance-unit', 'in').import).toEqual({ fieldUnit: 'G', distanceUnit: 'in' });
  });
});
