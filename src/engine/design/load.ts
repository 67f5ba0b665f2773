/**
 * Loading a design file: JSON value in, resolved `Design` out, or every problem found, each
 * naming its JSON path, the value and the fix. Never throws.
 */
import { checkWiring } from './check-wiring';
import type { Problem } from './problems';
import { Reader } from './reader';
import { resolveDesign } from './resolve';
import { checkStructure } from './structure';
import type { Design } from './types';

export { formatProblems, type Problem } from './problems';

/** What `parseDesign` returns: the design and any warnings, or the problems that stop it. */
export type ParseResult = { ok: true; design: Design; warnings: string[] } | { ok: false; problems: Problem[] };

/**
 * Checks and resolves the parsed JSON of a `*.tapline.json` file. First its shape (fields, types,
 * allowed words) against the schema; when that holds, every value is read to SI units, defaults
 * are filled and the wiring is checked (node names, unique ids, free package slots, wired-OR ties).
 * Warnings are lines `path: message` for things that load but look wrong.
 */
export function parseDesign(json: unknown): ParseResult {
  const shape = checkStructure(json);
  if (!shape.ok) return shape;
  try {
    const reader = new Reader(shape.file.quantity.unit);
    checkWiring(shape.file, reader);
    const design = resolveDesign(shape.file, reader);
    if (reader.problems.length > 0) return { ok: false, problems: reader.problems };
    return { ok: true, design, warnings: reader.warnings };
  } catch (error) {
    return { ok: false, problems: [{ path: '', value: undefined, message: `could not read the design: ${String(error)}` }] };
  }
}
