import { resolve } from 'node:path';
import { parseArgs, type ParseArgsConfig } from 'node:util';
import type { Design } from '../engine/design/types';
import { EXIT, type CliIo } from '../io';
import { readDesignFile } from '../store/files';

type Options = NonNullable<ParseArgsConfig['options']>;

/** The parsed values of a command's options, typed from its option table. */
export type Values<T extends Options> = { [K in keyof T]?: T[K] extends { type: 'boolean' } ? boolean : string };

/** A command's parsed arguments, or the exit code it must stop with (help printed, or bad input). */
export type Parsed<T extends Options> = { values: Values<T>; file: string } | { exit: number };

/**
 * Parses the arguments of `tapline NAME FILE [options]`: prints `usage` for --help, and for an
 * unknown option, a missing file or several files prints one message naming the problem, then the
 * usage. `file` comes back resolved against the working directory.
 */
export function parseCommand<T extends Options>(name: string, usage: string, args: string[], io: CliIo, options: T): Parsed<T> {
  let parsed;
  try {
    parsed = parseArgs({ args, allowPositionals: true, options: { ...options, help: { type: 'boolean', short: 'h' } } });
  } catch (e) {
    io.err(`tapline ${name}: ${(e as Error).message}\n${usage}`);
    return { exit: EXIT.input };
  }
  if ((parsed.values as { help?: boolean }).help) {
    io.out(usage);
    return { exit: EXIT.ok };
  }
  if (parsed.positionals.length !== 1) {
    io.err(`tapline ${name}: give exactly one design file (got ${parsed.positionals.length}).\n${usage}`);
    return { exit: EXIT.input };
  }
  return { values: parsed.values as unknown as Values<T>, file: resolve(io.cwd, parsed.positionals[0]) };
}

/** Reads the design at `path`, printing the loader's message and returning null when it cannot. */
export async function readDesignArg(path: string, io: CliIo): Promise<Design | null> {
  const read = await readDesignFile(path);
  if (!read.ok) {
    io.err(`${read.message}\n`);
    return null;
  }
  for (const w of read.warnings) io.err(`warning: ${w}\n`);
  return read.design;
}
