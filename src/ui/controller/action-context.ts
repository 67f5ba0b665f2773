/** What the controller's action groups share: the options of the render, the refs kept across renders, and a message helper. */
import type { Dispatch, MutableRefObject } from 'react';
import type { PresetInfo } from '../../store/presets';
import type { Settings } from '../../store/settings';
import type { Services, SpreadJob } from '../services';
import type { AppAction, AppState } from '../state/app-state';

/** Everything an action needs; built anew on each render from that render's state. */
export interface ActionContext {
  /** The state the key was read against. */
  s: AppState;
  dispatch: Dispatch<AppAction>;
  services: Services;
  setSettings: (s: Settings) => void;
  /** Leaves the app with an exit code. */
  exit: (code: number) => void;
  /** The path (or action) a first Enter warned about; a second Enter on it goes ahead. */
  armed: MutableRefObject<string | null>;
  /** Quit once the save in progress succeeds. */
  quitAfterSave: MutableRefObject<boolean>;
  /** The spread run in progress, if any. */
  spreadJob: MutableRefObject<SpreadJob | null>;
  /** The built-in presets, loaded once. */
  presets: MutableRefObject<PresetInfo[]>;
  /** Shows `text` on the message line. */
  say: (text: string, tone?: 'info' | 'ok' | 'error') => void;
}
