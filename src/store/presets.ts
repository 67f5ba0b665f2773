/**
 * The built-in preset designs: `presets/*.tapline.json` beside the package root. The folder is found
 * by walking up from this module, so it works from the sources (src/store/) and from the bundle
 * (dist/tapline.js or a chunk under dist/), where presets/ sits beside dist/.
 */
import { readdirSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Design } from '../engine/design/types';
import { parseDesignText } from './files';
import { fileExists } from './paths';

/** File name ending of a design file. */
const SUFFIX = '.tapline.json';

/** One preset as listed. */
export interface PresetInfo {
  /** File name without `.tapline.json`, e.g. "lead-acid-12v-gauge"; what `tapline presets` prints. */
  id: string;
  /** The design's name. */
  name: string;
  /** First sentence of the design's notes. */
  description: string;
  /** Absolute path of the file. */
  path: string;
}

/**
 * The presets folder: the first `presets/` beside a `package.json` found walking up from `from`
 * (default: this module's folder), or null when there is none.
 */
export function presetsDir(from: string = dirname(fileURLToPath(import.meta.url))): string | null {
  let dir = from;
  for (;;) {
    if (fileExists(join(dir, 'package.json')) && fileExists(join(dir, 'presets'))) return join(dir, 'presets');
    const up = dirname(dir);
    if (up === dir) return null;
    dir = up;
  }
}

/** First sentence of `text` (up to the first ". "), or the whole text. */
export function firstSentence(text: string): string {
  const end = text.search(/[.!?](\s|$)/);
  return end < 0 ? text.trim() : text.slice(0, end + 1).trim();
}

/**
 * Every preset, sorted by id, read and validated. A preset that fails to load is left out and its
 * message returned in `problems`. Never throws.
 */
export async function listPresets(dir: string | null = presetsDir()): Promise<{ presets: PresetInfo[]; problems: string[] }> {
  if (!dir) return { presets: [], problems: ['The presets folder was not found beside the program; reinstall tapline.'] };
  let names: string[];
  try {
    names = readdirSync(dir).filter((n) => n.endsWith(SUFFIX)).sort();
  } catch (e) {
    return { presets: [], problems: [`${dir}: cannot list the presets: ${(e as Error).message}.`] };
  }
  const presets: PresetInfo[] = [];
  const problems: string[] = [];
  for (const file of names) {
    const path = join(dir, file);
    const read = await readPreset(path);
    if (!read.ok) problems.push(read.message);
    else presets.push({ id: file.slice(0, -SUFFIX.length), name: read.design.name, description: firstSentence(read.design.notes), path });
  }
  return { presets, problems };
}

/** Reads one preset file by path. Never throws. */
export async function readPreset(path: string): Promise<{ ok: true; design: Design } | { ok: false; message: string }> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (e) {
    return { ok: false, message: `${path}: cannot read the preset: ${(e as Error).message}.` };
  }
  const parsed = await parseDesignText(text, path);
  return parsed.ok ? { ok: true, design: parsed.design } : { ok: false, message: parsed.message };
}
