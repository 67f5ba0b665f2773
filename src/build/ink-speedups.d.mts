/** Characters that take exactly one terminal cell, as the inside of a regular-expression class. */
export const ONE_CELL_CLASS: string;
/** Entries per cache map before the shared Output cache is renewed. */
export const CACHE_LIMIT: number;
/** One build-time patch of a dependency file. */
export interface Patch {
  name: string;
  file: RegExp;
  /** The replacement text of the file at `path`, or null when its expected text is missing. */
  apply(text: string, path?: string): string | null;
  /** For a replacement that loads the original on demand: the original's text, as loaded. */
  original?(text: string): string | null;
}
export const PATCHES: Patch[];
/** The esbuild plugin applying PATCHES. */
export function inkSpeedups(): { name: string; setup(build: unknown): void };
