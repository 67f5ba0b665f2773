import { readFileSync, writeFileSync } from 'node:fs';
import Ajv from 'ajv';
import { expect, test } from 'vitest';
import { DEMO_DESIGN_FILE } from '../../../src/engine/design/demo';
import { validate } from '../../../src/engine/design/schema-validator.generated.js';
import schema from '../../../src/engine/design/tapline.schema.json';
import { generateValidatorSource, VALIDATOR_OPTIONS } from '../../helpers/schema-codegen';

const FILE = 'src/engine/design/schema-validator.generated.js';

test('the precompiled validator is up to date with the schema', () => {
  const fresh = generateValidatorSource();
  if (process.env.TAPLINE_REGENERATE) writeFileSync(FILE, fresh);
  expect(readFileSync(FILE, 'utf8')).toBe(fresh);
});

test('the precompiled validator reports what runtime-compiled ajv reports (ajv as the reference)', () => {
  const reference = new Ajv({ ...VALIDATOR_OPTIONS }).compile(schema);
  const broken = { ...DEMO_DESIGN_FILE, format: 2, channels: [{ id: 5 }], string: 'x' } as unknown;
  for (const doc of [DEMO_DESIGN_FILE, broken, null, 42, {}]) {
    const ok = validate(doc);
    expect(ok).toBe(reference(doc));
    const ours = (validate as unknown as { errors: unknown[] | null }).errors ?? [];
    expect(ours.map((e) => JSON.stringify(e))).toEqual((reference.errors ?? []).map((e) => JSON.stringify(e)));
  }
});
