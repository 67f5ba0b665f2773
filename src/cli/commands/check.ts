import { basename } from 'node:path';
import { analyze } from '../../engine/analyze';
import { checkReport, checkJson } from '../report/check-report';
import { parseCommand, readDesignArg } from '../args';
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
    const parsed = parseCommand('check', USAGE, args, io, { json: { type: 'boolean' }, ascii: { type: 'boolean' } });
    if ('exit' in parsed) return parsed.exit;
    const design = await readDesignArg(parsed.file, io);
    if (!design) return EXIT.input;
    const analysis = analyze(design);
    if (parsed.values.json) io.out(`${JSON.stringify(checkJson(design, analysis), null, 2)}\n`);
    else io.out(checkReport(design, analysis, { ascii: parsed.values.ascii ?? false, fileName: basename(parsed.file) }));
    return analysis.findings.some((f) => f.severity === 'error') ? EXIT.findings : EXIT.ok;
  },
};
