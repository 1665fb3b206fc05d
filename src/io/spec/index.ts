/** Spec files (CONTRACT.md "Spec file"): read and parse into core Spec objects. */
export { readSpecFile } from './read-spec-file';
export { parseSpecs, catalogParameters } from './parse-specs';
export { parseSpecText } from './parse-spec-text';
export type { SpecErrorCode } from './spec-error';
