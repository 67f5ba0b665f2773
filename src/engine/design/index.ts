/**
 * Design files: the resolved model, the file form, loading, saving and the demo preset.
 */
export type * from './types';
export type { DesignFile, FileValue } from './file-types';
export { parseDesign, type ParseResult } from './load';
export { formatProblems, type Problem } from './problems';
export { designToFile } from './save';
export { DEMO_DESIGN_FILE, DEMO_FILE_NAME } from './demo';
