import { randomBytes } from 'node:crypto';
import { readFile, rename, unlink, writeFile } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import { formatProblems, parseDesign } from '../engine/design/load';
import { withUnitReader } from '../engine/values';
import type { Design } from '../engine/design/types';

/** Outcome of reading a design file: the design, or one readable message (several lines). */
export type ReadResult = { ok: true; design: Design; warnings: string[] } | { ok: false; message: string };

/** Reads and validates a `*.tapline.json` file. Never throws. */
export async function readDesignFile(path: string): Promise<ReadResult> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'it is a folder' : code === 'EACCES' ? 'permission denied' : (e as Error).message;
    return { ok: false, message: `${path}: cannot read the design file: ${why}.` };
  }
  return parseDesignText(text, basename(path));
}

/** Parses design JSON text; `name` labels messages. Never throws (the promise never rejects). */
export async function parseDesignText(text: string, name: string): Promise<ReadResult> {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    return { ok: false, message: `${name}: not valid JSON: ${(e as Error).message}. Fix the syntax (a trailing comma or a missing quote is the usual cause).` };
  }
  const parsed = await withUnitReader(() => parseDesign(json));
  if (!parsed.ok) return { ok: false, message: formatProblems(parsed.problems, name) };
  return { ok: true, design: parsed.design, warnings: parsed.warnings };
}

/**
 * Writes `text` to `path` atomically: a temporary file in the same folder, flushed, then renamed
 * over the target, so a crash never leaves a truncated file.
 */
export async function writeFileAtomic(path: string, text: string): Promise<void> {
  const tmp = join(dirname(path), `.${basename(path)}.${randomBytes(6).toString('hex')}.tmp`);
  try {
    await writeFile(tmp, text, { encoding: 'utf8', flush: true });
    await rename(tmp, path);
  } catch (e) {
    await unlink(tmp).catch(() => undefined);
    throw e;
  }
}
