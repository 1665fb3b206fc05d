/**
 * The bundled sample data (sample-data/, invented surveys of our own scenario), inlined
 * into the page at build time through Vite `?raw` imports so the page needs no server
 * and no network to show them.
 */
const csvFiles = import.meta.glob<string>('../../sample-data/*.csv', { query: '?raw', import: 'default', eager: true });
const specFiles = import.meta.glob<string>('../../sample-data/specs/*.json', { query: '?raw', import: 'default', eager: true });

/** A bundled file: its name (path under sample-data/) and text. */
export interface SampleFile {
  readonly name: string;
  readonly text: string;
}

const toSample = ([path, text]: [string, string]): SampleFile => ({ name: path.replace(/^.*sample-data\//, ''), text });

/** The sample surveys (top level of sample-data/; the deliberately flawed files are left out), sorted by name. */
export const sampleSurveys: readonly SampleFile[] = Object.entries(csvFiles).map(toSample).sort((a, b) => a.name.localeCompare(b.name));

/** Every sample spec JSON, sorted by name. */
export const sampleSpecs: readonly SampleFile[] = Object.entries(specFiles).map(toSample).sort((a, b) => a.name.localeCompare(b.name));

/** The survey a new visitor sees first: the healthy loop applicator when present, else the first sample. */
export function firstSample(): SampleFile | null {
  return sampleSurveys.find((s) => /healthy/i.test(s.name)) ?? sampleSurveys[0] ?? null;
}

/** The spec covering every sample coil (`all-coils`), if bundled. */
export function fleetSpec(): SampleFile | null {
  return sampleSpecs.find((s) => /all-coils/i.test(s.name)) ?? null;
}
