/**
 * Problems found in a design file, and how they are shown: one line per problem naming the
 * field by its JSON path, the value found and what to write instead.
 */

/** One thing wrong with a design file. */
export interface Problem {
  /** Where: a JSON path such as `channels[2].plus`; empty for the whole file. */
  path: string;
  /** The value found there (`undefined` when the field is missing). */
  value: unknown;
  /** What is wrong and what is allowed, e.g. `no such node; taps are T1..T4, or use in, ref, supply, gnd`. */
  message: string;
}

const IDENTIFIER = /^[A-Za-z_$][A-Za-z0-9_$]*$/;

/** Joins a JSON path and one more key or index: `join('channels', 2)` is `channels[2]`. */
export function joinPath(base: string, key: string | number): string {
  if (typeof key === 'number') return `${base}[${key}]`;
  if (!IDENTIFIER.test(key)) return `${base}[${JSON.stringify(key)}]`;
  return base ? `${base}.${key}` : key;
}

/** Joins several keys onto a path: `pathOf('channels[0]', 'led', 'knee')` is `channels[0].led.knee`. */
export function pathOf(base: string, ...keys: (string | number)[]): string {
  return keys.reduce<string>(joinPath, base);
}

/** Turns a JSON pointer (`/channels/2/plus`) into a JSON path (`channels[2].plus`). */
export function pointerToPath(pointer: string): string {
  if (!pointer) return '';
  return pointer
    .slice(1)
    .split('/')
    .map((part) => part.replace(/~1/g, '/').replace(/~0/g, '~'))
    .reduce<string>((path, part) => joinPath(path, /^\d+$/.test(part) ? Number(part) : part), '');
}

const MAX_SHOWN = 60;

/** A value as shown in a message: JSON, cut short when long. */
export function showValue(value: unknown): string {
  let text: string;
  try {
    text = JSON.stringify(value) ?? String(value);
  } catch {
    text = String(value);
  }
  return text.length > MAX_SHOWN ? `${text.slice(0, MAX_SHOWN - 1)}…` : text;
}

/**
 * One line per problem: `demo.tapline.json: channels[2].plus = "T9": no such node; taps are
 * T1..T4, or use in, ref, supply, gnd`. The value is left out when the field is missing.
 */
export function formatProblems(problems: Problem[], fileName: string): string {
  return problems
    .map((p) => {
      const where = p.path ? `${p.path}${p.value === undefined ? '' : ` = ${showValue(p.value)}`}: ` : '';
      return `${fileName}: ${where}${p.message}`;
    })
    .join('\n');
}
