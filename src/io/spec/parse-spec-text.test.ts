import { describe, it, expect } from 'vitest';
import { modelIds } from '../../core/models';
import { catalogParameters } from './parse-specs';
import { readSpecFile } from './read-spec-file';
import { readdirSync } from 'node:fs';
import { RingfallError } from '../../core/errors';
import { parseSpecText } from './parse-spec-text';
import { jsonLineIndex } from './json-line-index';
import { selectSpec } from '../../core/analysis/spec/select-spec';
import { expectClose } from '../../../test/support/expect-close';

// the real fit-model catalog (core/models)
const catalog = catalogParameters;
const ids = modelIds;
const parse = (text: string) => parseSpecText(text, 'specs.json', catalog, ids);

function thrown(text: string): RingfallError {
  try {
    parse(text);
  } catch (error) {
    expect(error).toBeInstanceOf(RingfallError);
    return error as RingfallError;
  }
  throw new Error('expected a RingfallError');
}

// CONTRACT.md "Spec file" example, verbatim
const contractExample = `{
  "coil": "HX-2",
  "model": "loop",
  "params": { "ampereTurns": "120 A", "radius": "45 mm" },
  "tolerance": "10%",
  "claims": [ { "distance": "0 mm", "datum": "surface", "field": "1.7 mT", "tolerance": "15%" } ],
  "readingType": "dc"
}`;

describe('parseSpecText()', () => {
  it('parseSpecText() reads the CONTRACT.md example into SI', () => {
    const [spec] = parse(contractExample);
    expect(spec!.coils).toEqual(['HX-2']);
    expect(spec!.model).toBe('loop');
    expect(spec!.params.map((p) => p.name)).toEqual(['ampereTurns', 'radius']);
    expect(spec!.params[0]!.value).toBe(120);
    expectClose(spec!.params[1]!.value, 0.045, { rel: 1e-15 });
    expect(spec!.params[1]!.tolerance).toEqual({ relative: 0.1, absolute: 0 });
    expectClose(spec!.claims[0]!.field, 1.7e-3, { rel: 1e-15 });
    expect(spec!.claims[0]!.tolerance.relative).toBeCloseTo(0.15, 15);
    expect(spec!.claims[0]!.text).toBe('1.7 mT at 0 mm from the surface');
    expect(spec!.claims[0]!.datum).toBe('surface');
    expect(spec!.readingType).toBe('dc');
    expect(spec!.crestFactor).toBeNull();
  });

  it('parseSpecText() reads an array, per-parameter tolerances, coil lists and a sine waveform', () => {
    const specs = parse(`[
      {"coil": ["A1", "A2"], "model": "loop", "params": {"radius": "45 mm"}, "tolerances": {"radius": "1.5 mm"}},
      {"model": "dipole", "params": {"moment": "0.76 A m2"}, "tolerance": "5%", "readingType": "peak", "waveform": "sine"}
    ]`);
    expect(specs).toHaveLength(2);
    expect(specs[0]!.source).toBe('specs.json, spec 1');
    expectClose(specs[0]!.params[0]!.tolerance.absolute, 1.5e-3, { rel: 1e-15 });
    // DOMAIN.md §3.6 / §9 row 46: sine peak = √2 × rms
    expectClose(specs[1]!.crestFactor!, 1.4142135624, { rel: 1e-10 });
    expect(selectSpec(specs, 'A2')).toBe(specs[0]);
    expect(selectSpec(specs, 'ZZ')).toBe(specs[1]);
    expect(selectSpec(specs, null)).toBe(specs[1]);
  });

  it('parseSpecText() names the line and column of a JSON syntax error (SPEC_JSON)', () => {
    const error = thrown('{\n  "model": "loop",\n  "params": {"radius": "45 mm",}\n}');
    expect(error.code).toBe('SPEC_JSON');
    expect(error.message).toContain('specs.json line 3');
  });

  it('parseSpecText() names the line and field of an unknown parameter and lists the known ones (SPEC_PARAM)', () => {
    const error = thrown('{\n  "model": "loop",\n  "tolerance": "5%",\n  "params": {\n    "ampereTurns": "120 A",\n    "radious": "45 mm"\n  }\n}');
    expect(error.code).toBe('SPEC_PARAM');
    expect(error.message).toContain('line 6, field params.radious');
    expect(error.message).toContain('ampereTurns, radius, probeOffset, background');
  });

  it('parseSpecText() rejects a quantity of the wrong kind with its place (SPEC_QUANTITY)', () => {
    const error = thrown('[{"model": "loop", "tolerance": "5%", "params": {"ampereTurns": "120 A"}},\n {"model": "loop", "coil": "B", "tolerance": "5%", "params": {"radius": "45 mT"}}]');
    expect(error.code).toBe('SPEC_QUANTITY');
    expect(error.message).toContain('line 2, field spec 2 params.radius');
    expect(error.message).toContain('length');
  });

  it('parseSpecText() requires a tolerance for every parameter and claim (SPEC_TOLERANCE)', () => {
    expect(thrown('{"model": "loop", "params": {"radius": "45 mm"}}').code).toBe('SPEC_TOLERANCE');
    // an absolute spec-level tolerance cannot serve a current and a length at once
    const error = thrown('{"model": "loop", "params": {"ampereTurns": "120 A", "radius": "45 mm"}, "tolerance": "2 mm"}');
    expect(error.code).toBe('SPEC_TOLERANCE');
    expect(error.message).toContain('"tolerances"');
  });

  it('parseSpecText() rejects unknown keys, models, reading types and waveforms with their codes', () => {
    expect(thrown('{"model": "loop", "params": {"radius": "45 mm"}, "tolerence": "5%"}').code).toBe('SPEC_KEY');
    const model = thrown('{"model": "helix", "params": {}}');
    expect(model.code).toBe('SPEC_MODEL');
    expect(model.message).toContain('loop, thick-coil, solenoid, coil-pair, rectangle, dipole, power-law');
    expect(thrown('{"model": "loop", "params": {"radius": "45 mm"}, "tolerance": "5%", "readingType": "ac"}').code).toBe('SPEC_READING_TYPE');
    expect(thrown('{"model": "loop", "params": {"radius": "45 mm"}, "tolerance": "5%", "waveform": "triangle"}').code).toBe('SPEC_WAVEFORM');
    expect(thrown('{"model": "loop", "params": {"radius": "45 mm"}, "tolerance": "5%", "waveform": "sine", "crestFactor": 3}').code).toBe('SPEC_WAVEFORM');
    expect(thrown('{"model": "power-law", "params": {"amplitude": "1 T"}, "tolerance": "5%"}').code).toBe('SPEC_PARAM');
  });

  it('parseSpecText() reads a claim\'s datum, defaulting to the device surface as a label means it (SPEC_DATUM otherwise)', () => {
    const claims = (datum: string) => `{"model": "loop", "tolerance": "5%", "claims": [{"distance": "50 mm", "field": "1 mT"${datum}}]}`;
    // a label's "field at 50 mm" is measured from the device surface (common practice)
    expect(parse(claims(''))[0]!.claims[0]!.datum).toBe('surface');
    expect(parse(claims(', "datum": "winding"'))[0]!.claims[0]!.datum).toBe('winding');
    expect(parse(claims(', "datum": "winding"'))[0]!.claims[0]!.text).toBe('1 mT at 50 mm from the winding');
    const wrong = thrown(claims(', "datum": "tip"'));
    expect(wrong.code).toBe('SPEC_DATUM');
    expect(wrong.message).toContain('field claims[0].datum');
  });

  it('parseSpecText() rejects empty specs, bad claims and duplicate coils', () => {
    expect(thrown('[]').code).toBe('SPEC_EMPTY');
    expect(thrown('{"model": "loop"}').code).toBe('SPEC_EMPTY');
    expect(thrown('{"model": "loop", "tolerance": "5%", "claims": [{"distance": "5 mm"}]}').code).toBe('SPEC_SHAPE');
    expect(thrown('{"model": "loop", "tolerance": "5%", "claims": [{"distance": "5 mm", "field": "-1 mT"}]}').code).toBe('SPEC_QUANTITY');
    expect(thrown('{"model": "loop", "tolerance": "5%", "params": {"radius": 45}}').code).toBe('SPEC_QUANTITY');
    const duplicate = thrown('[{"coil": "A", "model": "loop", "tolerance": "5%", "params": {"radius": "4 cm"}},\n{"coil": ["B", "A"], "model": "loop", "tolerance": "5%", "params": {"radius": "4 cm"}}]');
    expect(duplicate.code).toBe('SPEC_DUPLICATE');
    expect(duplicate.message).toContain('coil "A"');
  });

  it('parseSpecText() refuses an empty file with SPEC_EMPTY rather than a bare JSON error', () => {
    for (const text of ['', '\uFEFF', ' \n\t\n']) {
      const error = thrown(text);
      expect(error.code, JSON.stringify(text)).toBe('SPEC_EMPTY');
      expect(error.message).toMatch(/the file (is empty|holds only white space) \(specs\.json\)\. Write one spec object/u);
    }
  });

  it('parseSpecText() refuses a key given twice in one object, naming the line of the repeat (SPEC_KEY)', () => {
    // JSON.parse would keep "50 mm" and drop "45 mm" without a word (ECMA-262 JSON.parse)
    const single = thrown('{\n  "model": "loop",\n  "tolerance": "5%",\n  "params": {\n    "radius": "45 mm",\n    "radius": "50 mm"\n  }\n}');
    expect(single.code).toBe('SPEC_KEY');
    expect(single.message).toContain('"radius" appears twice');
    expect(single.message).toContain('specs.json line 6, field params.radius');
    const inList = thrown('[{"model": "loop", "tolerance": "5%", "params": {"radius": "4 cm"}},\n {"model": "loop", "coil": "B", "coil": "C", "tolerance": "5%", "params": {"radius": "4 cm"}}]');
    expect(inList.message).toContain('line 2, field spec 2 coil');
    // the same key in two different objects is not a repeat
    expect(parse('[{"model": "loop", "tolerance": "5%", "params": {"radius": "4 cm"}, "coil": "A"},\n {"model": "loop", "coil": "B", "tolerance": "5%", "params": {"radius": "4 cm"}}]')).toHaveLength(2);
  });

  it('parseSpecText() refuses a label value outside the model parameter\'s range (SPEC_QUANTITY)', () => {
    // DESIGN.md catalog: lengths (radius) are bounded below by 0
    const error = thrown('{\n  "model": "loop",\n  "params": {"radius": "-45 mm"},\n  "tolerance": "5%"\n}');
    expect(error.code).toBe('SPEC_QUANTITY');
    expect(error.message).toContain('radius -45 mm is outside what the model allows (at least 0 m)');
    expect(error.message).toContain('specs.json line 3, field params.radius');
  });

  it('parseSpecText() points a claim with no tolerance anywhere at the claim\'s own line', () => {
    const error = thrown('{\n  "model": "loop",\n  "params": {"radius": "45 mm"},\n  "tolerances": {"radius": "5%"},\n  "claims": [\n    {"distance": "0 mm", "field": "1 mT"}\n  ]\n}');
    expect(error.code).toBe('SPEC_TOLERANCE');
    expect(error.message).toContain('no tolerance for claim 1 (specs.json line 6, field claims[0])');
  });

  it('parseSpecText() reads a dimensionless exponent as a plain number', () => {
    const [spec] = parse('{"model": "power-law", "params": {"exponent": "2.5"}, "tolerances": {"exponent": "0.2"}}');
    expect(spec!.params[0]!.value).toBe(2.5);
    expect(spec!.params[0]!.tolerance).toEqual({ relative: 0, absolute: 0.2 });
  });
});

describe('readSpecFile()', () => {
  it('readSpecFile() reads every bundled sample spec against the catalog', async () => {
    const files = readdirSync('sample-data/specs').filter((f) => f.endsWith('.json'));
    expect(files.length).toBeGreaterThan(0);
    for (const file of files) {
      const specs = await readSpecFile(`sample-data/specs/${file}`);
      expect(specs.length).toBeGreaterThan(0);
      for (const spec of specs) expect(spec.params.length + spec.claims.length).toBeGreaterThan(0);
    }
    const all = await readSpecFile('sample-data/specs/all-coils.spec.json');
    // sample-data/specs/all-coils.spec.json: QA-107 is labeled 360 A, 45 mm, ±10 %
    const qa107 = all.find((s) => s.coils?.includes('QA-107'))!;
    expect(qa107.params.map((p) => [p.name, p.value])).toEqual([['ampereTurns', 360], ['radius', 0.045]]);
  });

  it('readSpecFile() names a missing file with SPEC_READ', async () => {
    await expect(readSpecFile('no/such/spec.json')).rejects.toMatchObject({ code: 'SPEC_READ' });
  });
});

describe('jsonLineIndex()', () => {
  it('jsonLineIndex() maps nested keys and array items to their lines', () => {
    const index = jsonLineIndex('[\n {"a": {"b": 1},\n  "c": [2,\n   3, {"d": "x,y"}]}\n]');
    expect(index.get('0')).toBe(2);
    expect(index.get('0.a.b')).toBe(2);
    expect(index.get('0.c')).toBe(3);
    expect(index.get('0.c.1')).toBe(4);
    expect(index.get('0.c.2.d')).toBe(4);
  });
});
