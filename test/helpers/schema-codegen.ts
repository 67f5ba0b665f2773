import Ajv from 'ajv';
import standaloneCode from 'ajv/dist/standalone';
import schema from '../../src/engine/design/tapline.schema.json';

/** Options the design validator is compiled with; structure.ts relies on these (allErrors, verbose). */
export const VALIDATOR_OPTIONS = { allErrors: true, verbose: true, discriminator: true, strict: true, allowUnionTypes: true } as const;

/**
 * Source of `src/engine/design/schema-validator.generated.js`: the design schema compiled by ajv
 * ahead of time (compiling at start-up costs about 90 ms), as an ES module without `require`.
 */
export function generateValidatorSource(): string {
  const ajv = new Ajv({ ...VALIDATOR_OPTIONS, code: { source: true, esm: true } });
  const code = standaloneCode(ajv, ajv.compile(schema));
  const body = code
    .replace('"use strict";', '')
    .replace(/require\("ajv\/dist\/runtime\/ucs2length"\)\.default/g, 'ucs2length');
  return [
    '// Generated from tapline.schema.json by test/engine/design/schema-validator.test.ts',
    '// (TAPLINE_REGENERATE=1 npx vitest run test/engine/design/schema-validator.test.ts). Do not edit.',
    '/* eslint-disable */',
    'import ucs2lengthModule from "ajv/dist/runtime/ucs2length.js";',
    'const ucs2length = ucs2lengthModule.default ?? ucs2lengthModule;',
    body.trim(),
    '',
  ].join('\n');
}
