import { resolve } from 'node:path';
import { EXPORT_FORMATS as FORMATS, EXPORT_TRIALS, type ExportFormat as Format, exportText } from '../../engine/export/export-text';
import { writeFileAtomic } from '../../store/files';
import { parseCommand, readDesignArg } from '../args';
import { EXIT, type CliIo } from '../../io';
import type { Command } from '../command';

export { EXPORT_TRIALS };

const USAGE = `Usage: tapline export FILE --to spice|bom|report|json [--out PATH] [--table]

Writes the design in FILE in another form, to PATH (atomically) or to standard output:
  spice    SPICE netlist that ramps the measured quantity up and down and measures each trip point
           (run it with: ngspice -b PATH)
  bom      bill of materials as CSV (RFC 4180); --table prints a readable table instead
  report   Markdown report: job, string, allocation, trip points, currents, spread, findings, cautions
  json     the design file plus every number the report shows
The report and JSON run a ${EXPORT_TRIALS}-trial Monte Carlo spread (seed 1) and a worst-case search.

Options:
  --to FORMAT   one of ${FORMATS.join(', ')}
  --out PATH    write here instead of standard output
  --table       with --to bom: a readable table, not CSV
  -h, --help
`;

/** `tapline export FILE --to FORMAT [--out PATH]`. */
export const exportCommand: Command = {
  name: 'export',
  summary: 'write a design as SPICE netlist, bill of materials, report or JSON',
  usage: 'tapline export FILE --to FORMAT',
  async run(args: string[], io: CliIo): Promise<number> {
    const parsed = parseCommand('export', USAGE, args, io, { to: { type: 'string' }, out: { type: 'string' }, table: { type: 'boolean' } });
    if ('exit' in parsed) return parsed.exit;
    const v = parsed.values;
    if (!v.to || !FORMATS.includes(v.to as Format)) {
      io.err(`tapline export: --to is ${v.to === undefined ? 'missing' : `"${v.to}"`}; give one of ${FORMATS.join(', ')}, e.g. --to report.\n`);
      return EXIT.input;
    }
    const design = await readDesignArg(parsed.file, io);
    if (!design) return EXIT.input;
    const format = v.to as Format;
    const text = exportText({ design, format, isTable: v.table });
    if (!v.out) {
      io.out(text);
      return EXIT.ok;
    }
    const out = resolve(io.cwd, v.out);
    try {
      await writeFileAtomic(out, text);
    } catch (e) {
      io.err(`tapline export: cannot write ${v.out}: ${(e as Error).message}. Check that the folder exists and is writable.\n`);
      return EXIT.input;
    }
    io.err(`Wrote ${format} to ${v.out}.\n`);
    return EXIT.ok;
  },
};
