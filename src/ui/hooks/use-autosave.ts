import { useEffect, useRef } from 'react';
import type { Design } from '../../engine/design/types';
import type { DraftStore } from '../../store/drafts';

/** How long after an edit the draft is written (ms); well inside the one-second promise. */
export const AUTOSAVE_DELAY_MS = 250;

/** Options of useAutosave. */
export interface AutosaveOptions {
  design: Design;
  /** True while the design differs from the file. */
  isModified: boolean;
  /** Absolute path of the file, null for the demo. */
  file: string | null;
  drafts: DraftStore;
  now: () => number;
}

/** Result of useAutosave. */
export interface Autosave {
  /** Writes any pending draft at once (before quitting or on a hang-up). */
  flush(): void;
}

/**
 * Keeps a draft of unsaved work: each edit schedules a write AUTOSAVE_DELAY_MS later (a burst of
 * edits still writes within that delay of the first one, never postponed indefinitely); returning to
 * the saved state drops the draft. The first render writes nothing, so a draft found at start-up
 * survives until the user decides about it or edits.
 */
export function useAutosave({ design, isModified, file, drafts, now }: AutosaveOptions): Autosave {
  const latest = useRef({ design, isModified, file });
  latest.current = { design, isModified, file };
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const first = useRef(true);
  const write = () => {
    timer.current = null;
    const l = latest.current;
    if (l.isModified) drafts.save(l.file, l.design, now());
    else drafts.clear(l.file);
  };
  useEffect(() => {
    if (first.current) {
      first.current = false;
      return;
    }
    if (!timer.current) timer.current = setTimeout(write, AUTOSAVE_DELAY_MS);
  }, [design, isModified]);
  useEffect(() => () => {
    if (timer.current) clearTimeout(timer.current);
  }, []);
  return {
    flush() {
      if (timer.current) {
        clearTimeout(timer.current);
        write();
      }
    },
  };
}
