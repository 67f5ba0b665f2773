import { Line, type Seg } from '../common/line';
import { type Binding, type KeyContext, KEYMAP, keyName, type Scope, whyDisabled } from '../keymap';
import type { Theme } from '../theme';

/** Props of HintBar. */
export interface HintBarProps {
  scope: Scope;
  ctx: KeyContext;
  width: number;
  theme: Theme;
}

/**
 * The hints of `scope` as [keys, word, enabled], from the key table: help and quit first so they
 * always fit, then table order; actions that are off right now are left to the help overlay.
 */
export function hints(scope: Scope, ctx: KeyContext, ascii: boolean): { keys: string; word: string; isEnabled: boolean }[] {
  const first = (b: Binding) => (b.action === 'help' || b.action === 'quit' ? 0 : 1);
  const rows = KEYMAP.filter((b: Binding) => b.scope === scope && b.hint && !whyDisabled(b, ctx));
  return [...rows].sort((a, b) => first(a) - first(b)).map((b) => {
    const pair = b.pairedWith ? KEYMAP.find((o) => o.scope === scope && o.action === b.pairedWith) : undefined;
    const keys = pair ? `${keyName(b.keys[0], ascii)}${keyName(pair.keys[0], ascii)}` : keyName(b.keys[0], ascii);
    return { keys, word: b.hint ?? '', isEnabled: scope !== 'main' || !whyDisabled(b, ctx) };
  });
}

/** The bottom line: as many key hints of the active scope as fit, disabled ones dimmed. */
export function HintBar({ scope, ctx, width, theme }: HintBarProps) {
  const segs: Seg[] = [];
  let used = 0;
  for (const h of hints(scope, ctx, theme.isAscii)) {
    const len = h.keys.length + h.word.length + 3;
    if (used + len > width) break;
    segs.push({ text: h.keys, style: theme.key(h.isEnabled) }, { text: ` ${h.word}  `, style: h.isEnabled ? theme.muted() : theme.key(false) });
    used += len;
  }
  return <Line width={width} segs={segs} />;
}
