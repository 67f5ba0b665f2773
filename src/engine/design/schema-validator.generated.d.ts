import type { ValidateFunction } from 'ajv';

/** The design-file schema validator, compiled ahead of time (see the generated .js beside this). */
export declare const validate: ValidateFunction;
export default validate;
