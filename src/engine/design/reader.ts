/**
 * Reads the values of a structurally valid design file into SI numbers, collecting one problem
 * per value that does not parse or falls outside its allowed range. A failed value reads as NaN so
 * reading can go on and report every problem at once.
 */
import { parseValue, type ValueUnit } from '../values';
import type { FileValue } from './file-types';
import type { Problem } from './problems';

/** Units of x that `parseValue` knows; any other unit is read as a bare number. */
const X_UNITS: Record<string, ValueUnit> = { V: 'V', A: 'A', W: 'W', F: 'F' };

/** Collects problems and warnings while reading a design file. */
export class Reader {
  /** Problems found so far, in file order. */
  readonly problems: Problem[] = [];
  /** Warnings found so far, each "path: message". */
  readonly warnings: string[] = [];

  /** @param xUnit Unit of the measured quantity, e.g. "V" or "%". */
  constructor(private readonly xUnit: string) {}

  /** Records a problem at `path` for `value`. */
  problem(path: string, value: unknown, message: string): void {
    this.problems.push({ path, value, message });
  }

  /** Records a warning at `path`. */
  warn(path: string, message: string): void {
    this.warnings.push(path ? `${path}: ${message}` : message);
  }

  /**
   * The SI value of `raw` read as `unit`, or NaN (with a problem recorded) when it does not parse
   * or breaks `rule` (a check returning the message, or undefined when the value is fine).
   */
  value(raw: FileValue, path: string, unit: ValueUnit, rule?: (v: number) => string | undefined): number {
    const read = parseValue(raw, unit);
    return this.checked(raw, path, read.ok ? read.value : null, read.ok ? '' : trimEcho(read.message, raw), rule);
  }

  /** `value` once read (null with `message` when it did not parse), checked against `rule`. */
  private checked(raw: FileValue, path: string, value: number | null, message: string, rule?: (v: number) => string | undefined): number {
    if (value === null) {
      this.problem(path, raw, message);
      return Number.NaN;
    }
    const broken = rule?.(value);
    if (broken) {
      this.problem(path, raw, broken);
      return Number.NaN;
    }
    return value;
  }

  /** Like `value`, but `raw` is absent and `fallback` (SI) is used instead when so. */
  optional(raw: FileValue | undefined, fallback: number, path: string, unit: ValueUnit, rule?: (v: number) => string | undefined): number {
    return raw === undefined ? fallback : this.value(raw, path, unit, rule);
  }

  /**
   * A value in the unit of x. Known units (V, A, W, F) go through the unit parser; for any other
   * unit a trailing unit symbol ("50 %", "25 °C") is dropped and the rest read as a number.
   */
  x(raw: FileValue, path: string, rule?: (v: number) => string | undefined): number {
    const known = X_UNITS[this.xUnit];
    if (known) return this.value(raw, path, known, rule);
    const text = typeof raw === 'string' && raw.trimEnd().endsWith(this.xUnit) ? raw.trimEnd().slice(0, -this.xUnit.length) : raw;
    const read = parseValue(text, 'none');
    return this.checked(raw, path, read.ok ? read.value : null, `not a number of ${this.xUnit}: write e.g. 12 or "12 ${this.xUnit}"`, rule);
  }
}

/** Drops the leading `"<value>" is ` that the value parser puts in its messages: the line shows the value already. */
function trimEcho(message: string, raw: FileValue): string {
  const echo = `"${String(raw)}" is `;
  return message.startsWith(echo) ? message.slice(echo.length) : message;
}

/** Rule: strictly positive. */
export const positive = (what: string) => (v: number) => (v > 0 ? undefined : `${what} must be greater than 0`);

/** Rule: zero or more. */
export const nonNegative = (what: string) => (v: number) => (v >= 0 ? undefined : `${what} must not be negative`);

/** Rule: a fraction from 0 up to (not including) 1, as a tolerance is. */
export const fraction = (what: string) => (v: number) =>
  v >= 0 && v < 1 ? undefined : `${what} must be from 0 up to 100 %, e.g. "1 %"`;
