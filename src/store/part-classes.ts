/**
 * User part classes, kept with conf in the user's config folder (`$XDG_CONFIG_HOME/tapline/
 * part-classes.json`, or the platform config folder). Built-in classes are read-only and cannot be
 * shadowed. Every class is checked field by field before it is stored.
 */
import { join } from 'node:path';
import Conf from 'conf';
import type { PartClass } from '../engine/design/types';
import { BUILTIN_PARTS } from '../engine/parts';

/** Where the store lives. */
export interface PartClassStoreOptions {
  /** Folder of the store file; wins over everything else (tests pass a temporary folder). */
  cwd?: string;
  /** Project name for the platform config folder; default "tapline". */
  projectName?: string;
  /** Environment to read XDG_CONFIG_HOME from; default none (conf then reads the process's). */
  env?: Record<string, string | undefined>;
}

/** Outcome of saving a class: ok, or the problems, each naming the field, the value and the fix. */
export type SaveResult = { ok: true } | { ok: false; problems: string[] };

/** The user part classes. */
export interface PartClassStore {
  /** Full path of the store file. */
  readonly path: string;
  /** User classes, sorted by id. */
  list(): PartClass[];
  /** Built-in and user classes by id (built-ins win). */
  all(): Record<string, PartClass>;
  /** Stores (or replaces) a user class after checking it. */
  save(part: PartClass): SaveResult;
  /** Removes a user class; false when there was none with that id. */
  remove(id: string): boolean;
}

type Shape = { classes: Record<string, PartClass> };

const NUMBER_FIELDS = [
  'supplyMin',
  'supplyMax',
  'absMaxSupply',
  'iqPerPackage',
  'vosTyp',
  'vosMax',
  'ibTyp',
  'ibMax',
  'cmMin',
  'cmHeadroom',
  'vsat0',
  'rsat',
  'sinkMax',
  'vohDrop',
  'rout',
] as const satisfies readonly (keyof PartClass)[];

const NON_NEGATIVE = new Set<string>(['iqPerPackage', 'vosTyp', 'vosMax', 'ibTyp', 'ibMax', 'vsat0', 'sinkMax', 'vohDrop']);

/** Opens (creating on first write) the user part-class store. */
export function openPartClassStore(options: PartClassStoreOptions = {}): PartClassStore {
  const xdg = options.env?.XDG_CONFIG_HOME;
  const cwd = options.cwd ?? (xdg ? join(xdg, options.projectName ?? 'tapline') : undefined);
  const conf = new Conf<Shape>({
    projectName: options.projectName ?? 'tapline',
    projectSuffix: '',
    configName: 'part-classes',
    accessPropertiesByDotNotation: false,
    defaults: { classes: {} },
    ...(cwd ? { cwd } : {}),
  });
  const read = (): Record<string, PartClass> => ({ ...conf.get('classes') });
  return {
    path: conf.path,
    list: () => Object.values(read()).sort((a, b) => a.id.localeCompare(b.id)),
    all: () => ({ ...read(), ...BUILTIN_PARTS }),
    save(part) {
      const problems = checkPartClass(part);
      if (problems.length) return { ok: false, problems };
      conf.set('classes', { ...read(), [part.id]: { ...part } });
      return { ok: true };
    },
    remove(id) {
      const classes = read();
      if (!Object.hasOwn(classes, id)) return false;
      delete classes[id];
      conf.set('classes', classes);
      return true;
    },
  };
}

/** Problems with a user part class (empty when it can be stored); each names field, value and fix. */
export function checkPartClass(part: PartClass): string[] {
  const problems: string[] = [];
  const p = part as unknown as Record<string, unknown>;
  if (typeof part.id !== 'string' || !/^[a-z0-9][a-z0-9-]*$/.test(part.id)) {
    problems.push(`id: ${JSON.stringify(part.id)} is not a valid class id; use lower-case letters, digits and hyphens, e.g. "my-cmos-quad".`);
  } else if (Object.hasOwn(BUILTIN_PARTS, part.id)) {
    problems.push(`id: "${part.id}" is a built-in class; choose another id for your own class.`);
  }
  if (typeof part.description !== 'string' || !part.description.trim()) problems.push('description: missing; describe the class by its type and parameters.');
  if (part.output !== 'open-collector' && part.output !== 'push-pull') problems.push(`output: ${JSON.stringify(part.output)} is not known; use "open-collector" or "push-pull".`);
  if (part.biasDirection !== 'in' && part.biasDirection !== 'out') problems.push(`biasDirection: ${JSON.stringify(part.biasDirection)} is not known; use "in" or "out".`);
  for (const f of NUMBER_FIELDS) {
    const v = p[f];
    if (typeof v !== 'number' || !Number.isFinite(v)) problems.push(`${f}: ${JSON.stringify(v)} is not a number; give it in SI units (volts, amperes, ohms).`);
    else if (NON_NEGATIVE.has(f) && v < 0) problems.push(`${f}: ${v} is negative; give its magnitude.`);
  }
  if (problems.length) return problems;
  if (part.rsat <= 0) problems.push(`rsat: ${part.rsat} must be above 0 ohms; use the output's low-level resistance.`);
  if (part.output === 'push-pull' && part.rout <= 0) problems.push(`rout: ${part.rout} must be above 0 ohms for a push-pull output.`);
  if (part.vosMax < part.vosTyp) problems.push(`vosMax: ${part.vosMax} is below vosTyp ${part.vosTyp}; the maximum must be at least the typical value.`);
  if (part.ibMax < part.ibTyp) problems.push(`ibMax: ${part.ibMax} is below ibTyp ${part.ibTyp}; the maximum must be at least the typical value.`);
  if (part.supplyMax < part.supplyMin) problems.push(`supplyMax: ${part.supplyMax} is below supplyMin ${part.supplyMin}; swap them.`);
  if (part.absMaxSupply < part.supplyMax) problems.push(`absMaxSupply: ${part.absMaxSupply} is below supplyMax ${part.supplyMax}; the absolute maximum is at least the operating maximum.`);
  return problems;
}
