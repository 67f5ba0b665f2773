/** Where an export goes unless the user types another path. */
import { basename, dirname, isAbsolute, join, relative } from 'node:path';
import { EXPORT_SUFFIX, type ExportFormat } from '../../engine/export/export-text';

/** The design's base name without its file ending or the "(demo)" / "(preset)" mark. */
export function designBaseName(file: string | null, name: string): string {
  const shown = file ? basename(file) : name.replace(/ \((demo|preset)\)$/, '');
  return shown.replace(/\.tapline\.json$/i, '').replace(/\.json$/i, '') || 'design';
}

/**
 * The suggested export path: `<name><suffix>` beside the design file (in `cwd` for a design without
 * a file), written relative to `cwd` when it lies below it. Never the design file itself.
 */
export function exportPathSuggestion(file: string | null, name: string, cwd: string, format: ExportFormat): string {
  const base = designBaseName(file, name);
  let full = join(file ? dirname(file) : cwd, `${base}${EXPORT_SUFFIX[format]}`);
  if (full === file) full = join(dirname(full), `${base}.export${EXPORT_SUFFIX[format]}`);
  const rel = relative(cwd, full);
  return rel === '' || rel.startsWith('..') || isAbsolute(rel) ? full : rel;
}
