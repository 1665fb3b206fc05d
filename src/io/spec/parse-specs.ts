import type { Spec } from '../../core/analysis/spec/spec';
import { getModel, isModelId, modelIds } from '../../core/models';
import { parseSpecText } from './parse-spec-text';
import type { ParameterCatalog } from './read-spec-entry';

/** The fit-model catalog's parameters, for spec parsing. */
export const catalogParameters: ParameterCatalog = (id) => (isModelId(id) ? getModel(id).parameters : undefined);

/**
 * Parse spec text against the model catalog (no file access: usable in the web page).
 * @throws RingfallError with the parseSpecText codes
 * @example parseSpecs('{"model":"loop","params":{"radius":"45 mm"},"tolerance":"5%"}', 'pasted')[0].params[0].value // 0.045
 */
export function parseSpecs(text: string, source: string): Spec[] {
  return parseSpecText(text, source, catalogParameters, modelIds);
}
