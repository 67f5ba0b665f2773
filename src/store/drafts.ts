import { createHash } from 'node:crypto';
import { resolve } from 'node:path';
import Conf from 'conf';
import type { Design } from '../engine/design/types';
import { configDir } from './config-dir';

/** Unsaved work kept aside so a crash or a dropped session loses nothing. */
export interface Draft {
  /** The file the draft belongs to (absolute path), or null for the built-in demo. */
  file: string | null;
  /** When it was written (ms since the epoch, from the caller's clock). */
  savedAt: number;
  /** The design as it was being edited. */
  design: Design;
}

/** Reading and writing drafts, one per design file. */
export interface DraftStore {
  /** The draft for `file` (absolute path, null = demo), or null when none (or it is unreadable). */
  load(file: string | null): Draft | null;
  /** Writes the draft for `file`, replacing any older one. `now` is ms since the epoch. */
  save(file: string | null, design: Design, now: number): void;
  /** Forgets the draft for `file` (after a save, or when the user discards it). */
  clear(file: string | null): void;
  /** Where the drafts file lives. */
  readonly path: string;
}

/** The absolute path a FILE argument names, resolved against `cwd`; undefined stays null (demo). */
export function draftFile(file: string | undefined, cwd: string): string | null {
  return file === undefined ? null : resolve(cwd, file);
}

/** Store key of a file: a hash, because conf reads dots in keys as nesting. */
function keyOf(file: string | null): string {
  return `d${createHash('sha256').update(file ?? '(demo)').digest('hex').slice(0, 24)}`;
}

function isDraft(raw: unknown): raw is Draft {
  if (!raw || typeof raw !== 'object') return false;
  const r = raw as Record<string, unknown>;
  const d = r.design as Record<string, unknown> | undefined;
  return typeof r.savedAt === 'number' && !!d && d.format === 1 && Array.isArray(d.string) && Array.isArray(d.channels);
}

/**
 * Opens the drafts store (conf, file `drafts.json`, separate from settings so frequent writes never
 * touch them) in `$XDG_CONFIG_HOME/tapline` when set. conf writes atomically.
 */
export function openDrafts(env: Record<string, string | undefined>): DraftStore {
  const conf = new Conf<Record<string, unknown>>({
    projectName: 'tapline', projectSuffix: '', cwd: configDir(env), configName: 'drafts', clearInvalidConfig: true,
  });
  return {
    load(file) {
      const raw = conf.get(keyOf(file));
      return isDraft(raw) && (raw.file ?? null) === file ? raw : null;
    },
    save(file, design, now) {
      conf.set(keyOf(file), { file, savedAt: now, design } satisfies Draft);
    },
    clear(file) {
      conf.delete(keyOf(file));
    },
    path: conf.path,
  };
}
