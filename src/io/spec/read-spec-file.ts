import { readFile } from 'node:fs/promises';
import type { Spec } from '../../core/analysis/spec/spec';
import { parseSpecs } from './parse-specs';
import { specError } from './spec-error';

/**
 * Read and parse a spec file (CONTRACT.md "Spec file") against the model catalog.
 * @throws RingfallError SPEC_READ when the file cannot be read; the parseSpecText codes otherwise
 * @example (await readSpecFile('sample-data/specs/qa-107.spec.json'))[0].coils // ['QA-107']
 */
export async function readSpecFile(path: string): Promise<Spec[]> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (cause) {
    throw specError('SPEC_READ', 'Spec file', `cannot be read: ${(cause as NodeJS.ErrnoException).code ?? (cause as Error).message}`, { source: path, line: null, field: '' },
      'Check the path given to --spec.', path, cause);
  }
  return parseSpecs(text, path);
}
