/** The help overlay's text, drawn from the key table so it always matches what the keys do. */
import { type ActionName, type Binding, type KeyContext, KEYMAP, keysLabel, SCOPE_TITLES, type Scope, whyDisabled } from '../keymap';

/** One line of the help: a scope heading, or a binding with its keys, description and why it is off. */
export type HelpLine = { kind: 'heading'; text: string } | { kind: 'binding'; keys: string; text: string; why: string | null };

const ORDER: Scope[] = ['main', 'prompt', 'export', 'quit', 'draft', 'settings', 'help'];

/** Every binding, grouped by scope; `ctx` marks those disabled right now and why. */
export function helpLines(ctx: KeyContext, ascii: boolean): HelpLine[] {
  const out: HelpLine[] = [];
  for (const scope of ORDER) {
    out.push({ kind: 'heading', text: SCOPE_TITLES[scope] });
    const seen = new Set<ActionName>();
    for (const b of KEYMAP.filter((k: Binding) => k.scope === scope)) {
      if (seen.has(b.action)) continue;
      seen.add(b.action);
      out.push({ kind: 'binding', keys: keysLabel(b, ascii), text: b.description, why: scope === 'main' ? whyDisabled(b, ctx) : null });
    }
  }
  out.push({ kind: 'heading', text: 'Typing values' });
  out.push({ kind: 'binding', keys: '', text: 'resistors: 4k7, 4.7k, 4700, 4.7 kohm; volts: 2.5, 2V5, 2500 mV; percent: 1 %', why: null });
  out.push({ kind: 'binding', keys: '', text: 'the value offered on opening is shown selected: typing replaces it, Backspace edits it', why: null });
  out.push({ kind: 'binding', keys: '', text: 'any other key while typing is text; Enter checks it and names what is wrong', why: null });
  return out;
}
