import { parseArgs } from 'node:util';
import { resolve } from 'node:path';
import { analyze } from '../../engine/analyze';
import { checkReport, checkJson } from '../report/check-report';
import { readDesignFile } from '../../store/files';
import { EXIT, type CliIo } from '../../io';
import type { Command } from '../command';

const USAGE = `Usage: tapline check FILE [--json] [--ascii]

Analyses the design in FILE exactly: tap voltages, rising and falling trip points and hysteresis of
every channel, supply current, and the checks. Exit 0 when clean, 1 when a finding is an error,
2 when FILE cannot be read.

Options:
  --json    print a machine-readable document instead of the report
  --ascii   plain ASCII (no µ, Ω or box characters)
  -h, --help
`;

/** `tapline check FILE [--json]`: the exact analysis as a report or JSON. */
export const checkCommand: Command = {
  name: 'check',
  summary: 'analyse a design: trip points, currents, findings',
  usage: 'tapline check FILE [--json]',
  async run(args: string[], io: CliIo): Promise<number> {
    let parsed;
    try {
      parsed = parseArgs({ args, allowPositionals: true, options: { json: { type: 'boolean' }, ascii: { type: 'boolean' }, help: { type: 'boolean', short: 'h' } } });
    } catch (e) {
      io.err(`tapline check: ${(e as Error).message}\n${USAGE}`);
      return EXIT.input;
    }
    if (parsed.values.help) {
      io.out(USAGE);
      return EXIT.ok;
    }
    if (parsed.positionals.length !== 1) {
      io.err(`tapline check: give exactly one design file (got ${parsed.positionals.length}).\n${USAGE}`);
      return EXIT.input;
    }
    const file = resolve(io.cwd, parsed.positionals[0]);
    const read = await readDesignFile(file);
    if (!read.ok) {
      io.err(`${read.message}\n`);
      return EXIT.input;
    }
    const analysis = analyze(read.design);
    if (parsed.values.json) io.out(`${JSON.stringify(checkJson(read.design, analysis), null, 2)}\n`);
    else io.out(checkReport(read.design, analysis, { ascii: parsed.values.ascii ?? false, fileName: parsed.positionals[0] }));
    return analysis.findings.some((f) => f.severity === 'error') ? EXIT.findings : EXIT.ok;
  },
};
