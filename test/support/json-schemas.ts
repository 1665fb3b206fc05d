import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { Ajv2020 } from 'ajv/dist/2020.js';

/** The JSON Schemas the package ships (schema/*.schema.json), by name. */
export type SchemaName = 'report' | 'plan' | 'predict' | 'spec';

const root = join(import.meta.dirname, '..', '..');
// ajv: an independent validator of JSON Schema draft 2020-12; strict mode also refuses
// schema mistakes (unknown keywords, ill-formed tuples)
const ajv = new Ajv2020({ strict: true, allErrors: true });

export function readSchema(name: SchemaName): Record<string, unknown> {
  return JSON.parse(readFileSync(join(root, 'schema', `${name}.schema.json`), 'utf8')) as Record<string, unknown>;
}

const compiled = new Map<SchemaName, ReturnType<typeof ajv.compile>>();

/** The schema's errors for `value` as lines ("/surveys/0/fits/1/stats/n must be integer"), empty when valid. */
export function schemaErrors(name: SchemaName, value: unknown): string[] {
  let validate = compiled.get(name);
  if (validate === undefined) {
    validate = ajv.compile(readSchema(name));
    compiled.set(name, validate);
  }
  return validate(value) ? [] : (validate.errors ?? []).map((error) => `${error.instancePath || '/'} ${error.message ?? ''} ${JSON.stringify(error.params)}`);
}
