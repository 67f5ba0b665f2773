import { parseArgs } from 'node:util';
import { resolve } from 'node:path';
import { EXPORT_FORMATS as FORMATS, EXPORT_TRIALS, type ExportFormat as Format, exportText } from '../../engine/export/export-text';
import { readDesignFile, writeFileAtomic } from '../../store/files';
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
    let parsed;
    try {
      parsed = parseArgs({
        args,
        allowPositionals: true,
        options: { to: { type: 'string' }, out: { type: 'string' }, table: { type: 'boolean' }, help: { type: 'boolean', short: 'h' } },
      });
    } catch (e) {
      io.err(`tapline export: ${(e as Error).message}\n${USAGE}`);
      return EXIT.input;
    }
    const v = parsed.values;
    if (v.help) {
      io.out(USAGE);
      return EXIT.ok;
    }
    if (parsed.positionals.length !== 1) {
      io.err(`tapline export: give exactly one design file (got ${parsed.positionals.length}).\n${USAGE}`);
      return EXIT.input;
    }
    if (!v.to || !FORMATS.includes(v.to as Format)) {
      io.err(`tapline export: --to is ${v.to === undefined ? 'missing' : `"${v.to}"`}; give one of ${FORMATS.join(', ')}, e.g. --to report.\n`);
      return EXIT.input;
    }
    const read = await readDesignFile(resolve(io.cwd, parsed.positionals[0]));
    if (!read.ok) {
      io.err(`${read.message}\n`);
      return EXIT.input;
    }
    const format = v.to as Format;
    const text = exportText({ design: read.design, format, isTable: v.table });
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
