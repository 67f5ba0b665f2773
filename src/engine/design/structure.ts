/**
 * Structural check of a design file against `tapline.schema.json`, with each schema error turned
 * into one plain-language problem. The validator is the schema compiled ahead of time by ajv
 * (schema-validator.generated.js, kept in step by its test), so start-up does not pay for compiling.
 */
import type { ErrorObject, ValidateFunction } from 'ajv';
import { validate as compiledValidator } from './schema-validator.generated.js';
import schema from './tapline.schema.json';
import type { DesignFile } from './file-types';
import { joinPath, pointerToPath, showValue, type Problem } from './problems';

function getValidator(): ValidateFunction {
  return compiledValidator;
}

type Schema = {
  description?: string;
  properties?: Record<string, Schema>;
  oneOf?: Schema[];
  const?: unknown;
  $ref?: string;
};

/** The description of a property, looked up through a local `$ref` when needed. */
function describe(parent: Schema | undefined, key: string): string | undefined {
  const own = parent?.properties?.[key];
  if (!own) return undefined;
  if (own.description) return own.description;
  const ref = own.$ref?.replace('#/definitions/', '');
  return ref ? (schema.definitions as unknown as Record<string, Schema>)[ref]?.description : undefined;
}

const TYPE_WORDS: Record<string, string> = {
  string: 'text in quotes',
  number: 'a number',
  integer: 'a whole number',
  object: 'an object { ... }',
  array: 'a list [ ... ]',
  boolean: 'true or false',
};

function typeWords(type: unknown): string {
  const list = Array.isArray(type) ? type : [type];
  if (list.includes('string') && list.includes('number')) return 'a number or text such as "4k7" or "2.5 V"';
  return list.map((t) => TYPE_WORDS[String(t)] ?? String(t)).join(' or ');
}

function withHint(message: string, hint: string | undefined): string {
  return hint ? `${message} (${hint})` : message;
}

/** One schema error as a problem, or undefined for errors that only repeat another. */
function toProblem(error: ErrorObject): Problem | undefined {
  const path = pointerToPath(error.instancePath);
  const parent = error.parentSchema as Schema | undefined;
  const params = error.params as Record<string, unknown>;
  switch (error.keyword) {
    case 'required': {
      const key = String(params.missingProperty);
      return { path: joinPath(path, key), value: undefined, message: withHint('required field is missing', describe(parent, key)) };
    }
    case 'additionalProperties': {
      const key = String(params.additionalProperty);
      const allowed = Object.keys(parent?.properties ?? {}).join(', ');
      const data = error.data as Record<string, unknown>;
      return { path: joinPath(path, key), value: data[key], message: `unknown field; allowed here: ${allowed}` };
    }
    case 'type':
      if (!path) return { path, value: undefined, message: `the file must hold one JSON object { "format": 1, ... }, not ${showValue(error.data)}` };
      // The generic value description would only repeat what typeWords says.
      return { path, value: error.data, message: withHint(`must be ${typeWords(params.type)}`, Array.isArray(params.type) ? undefined : parent?.description) };
    case 'const':
      return { path, value: error.data, message: `must be ${showValue(params.allowedValue)}` };
    case 'enum':
      return { path, value: error.data, message: `must be one of ${(params.allowedValues as unknown[]).map(showValue).join(', ')}` };
    case 'minimum':
    case 'maximum': {
      const word = error.keyword === 'minimum' ? 'at least' : 'at most';
      return { path, value: error.data, message: withHint(`must be ${word} ${String(params.limit)}`, parent?.description) };
    }
    case 'minItems':
      return { path, value: undefined, message: withHint(`needs at least ${String(params.limit)} entries`, parent?.description) };
    case 'minLength':
      return { path, value: error.data, message: withHint('must not be empty', parent?.description) };
    case 'pattern':
      return { path, value: error.data, message: `not allowed; write ${parent?.description ?? `text matching ${String(params.pattern)}`}` };
    case 'discriminator': {
      const kinds = (parent?.oneOf ?? []).map((s) => showValue(s.properties?.kind?.const)).join(', ');
      const kindPath = joinPath(path, 'kind');
      if (params.error === 'mapping') return { path: kindPath, value: params.tagValue, message: `no such kind; use one of ${kinds}` };
      return { path: kindPath, value: params.tagValue, message: `must be text, one of ${kinds}` };
    }
    case 'oneOf':
      return undefined;
    default:
      return { path, value: error.data, message: error.message ?? 'not allowed here' };
  }
}

/**
 * Checks the shape of a parsed JSON value against the file schema. Never throws: any surprise in
 * the validator itself comes back as a problem on the whole file.
 */
export function checkStructure(json: unknown): { ok: true; file: DesignFile } | { ok: false; problems: Problem[] } {
  try {
    const validate = getValidator();
    if (validate(json)) return { ok: true, file: json as DesignFile };
    const seen = new Set<string>();
    const problems: Problem[] = [];
    for (const error of validate.errors ?? []) {
      const problem = toProblem(error);
      const key = problem && `${problem.path}\u0000${problem.message}`;
      if (problem && key && !seen.has(key)) {
        seen.add(key);
        problems.push(problem);
      }
    }
    return { ok: false, problems };
  } catch (error) {
    return { ok: false, problems: [{ path: '', value: undefined, message: `could not check the file: ${String(error)}` }] };
  }
}
