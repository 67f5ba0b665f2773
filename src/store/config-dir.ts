import { join } from 'node:path';

/**
 * The folder conf keeps tapline's stores in: `$XDG_CONFIG_HOME/tapline` when that variable is set,
 * otherwise undefined so conf picks the platform's usual config folder (on Linux
 * `~/.config/tapline`, which is the same rule).
 */
export function configDir(env: Record<string, string | undefined>): string | undefined {
  const xdg = env.XDG_CONFIG_HOME;
  return xdg && xdg.trim() !== '' ? join(xdg, 'tapline') : undefined;
}
