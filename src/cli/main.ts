import { parseArgs } from 'node:util';
import pkg from '../../package.json';
import { checkCommand } from './commands/check';
import { exportCommand } from './commands/export';
import { planCommand } from './commands/plan';
import { presetsCommand } from './commands/presets';
import { spreadCommand } from './commands/spread';
import { EXIT, type CliIo } from '../io';
import type { Command } from './command';

/** Version printed by --version: package.json's, bundled in at build time. */
export const VERSION: string = pkg.version;

/** Every sub-command, in the order `--help` lists them. */
export const COMMANDS: Command[] = [checkCommand, planCommand, spreadCommand, exportCommand, presetsCommand];

const HELP = () => `tapline ${VERSION}: plan and check comparator threshold ladders.

Usage:
  tapline [FILE]              open FILE (or the built-in demo) in the interactive screen
${COMMANDS.map((c) => `  ${c.usage.padEnd(28)}${c.summary}`).join('\n')}
  tapline --help | --version

Exit codes: 0 clean, 1 an error-level finding or unmet target, 2 unreadable input.
`;

/**
 * Entry point with injected streams. With no sub-command it opens the interactive screen through
 * `openTui` (supplied by the executable, so tests and the library need not load the UI).
 */
export async function main(argv: string[], io: CliIo, openTui?: (file: string | undefined, io: CliIo) => Promise<number>): Promise<number> {
  const [first, ...rest] = argv;
  const command = COMMANDS.find((c) => c.name === first);
  if (command) return command.run(rest, io);
  let parsed;
  try {
    parsed = parseArgs({ args: argv, allowPositionals: true, options: { help: { type: 'boolean', short: 'h' }, version: { type: 'boolean', short: 'V' } } });
  } catch (e) {
    io.err(`tapline: ${(e as Error).message}\nRun 'tapline --help' for usage.\n`);
    return EXIT.input;
  }
  if (parsed.values.help) {
    io.out(HELP());
    return EXIT.ok;
  }
  if (parsed.values.version) {
    io.out(`${VERSION}\n`);
    return EXIT.ok;
  }
  if (parsed.positionals.length > 1) {
    io.err(`tapline: unknown command '${first}'. Commands: ${COMMANDS.map((c) => c.name).join(', ')}.\n`);
    return EXIT.input;
  }
  if (!openTui) {
    io.err('tapline: the interactive screen is not available in this build; use a sub-command.\n');
    return EXIT.input;
  }
  return openTui(parsed.positionals[0], io);
}
