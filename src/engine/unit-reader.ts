/**
 * The unit reader: the one module that imports mathjs. `values.ts` loads it on first need (a
 * dynamic import), so start-up never pays for mathjs when every value is a plain number, an RKM
 * code or carries only an SI prefix and its unit symbol.
 */
import { create, unitDependencies, type Unit } from 'mathjs';

/** What the value parser asks of mathjs: text such as "3 volts" read as a unit-bearing quantity. */
export interface UnitReader {
  unit(text: string): Unit;
}

/** A mathjs instance with units only (creating it with every function would cost several times more). */
export function createUnitReader(): UnitReader {
  return create({ unitDependencies });
}
