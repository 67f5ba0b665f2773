import type { CliIo } from '../io';

/** One sub-command: its name, one-line summary, usage text and entry point. */
export interface Command {
  name: string;
  summary: string;
  usage: string;
  /** Runs the command with the arguments after its name; resolves to the exit code. */
  run: (args: string[], io: CliIo) => Promise<number>;
}
