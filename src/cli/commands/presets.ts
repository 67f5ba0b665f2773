import { parseArgs } from 'node:util';
import { relative } from 'node:path';
import { listPresets } from '../../store/presets';
import { wrapWords } from '../../ui/common/wrap-words';
import { EXIT, type CliIo } from '../../io';
import type { Command } from '../command';

const USAGE = `Usage: tapline presets [--json]

Lists the built-in example designs: id, one-line description and the file's path. Open one with
'tapline PATH', check it with 'tapline check PATH', or copy it and edit the copy.

Options:
  --json    print the list as JSON
  -h, --help
`;

/** `tapline presets`: the built-in example designs. */
export const presetsCommand: Command = {
  name: 'presets',
  summary: 'list the built-in example designs',
  usage: 'tapline presets [--json]',
  async run(args: string[], io: CliIo): Promise<number> {
    let parsed;
    try {
      parsed = parseArgs({ args, allowPositionals: false, options: { json: { type: 'boolean' }, help: { type: 'boolean', short: 'h' } } });
    } catch (e) {
      io.err(`tapline presets: ${(e as Error).message}\n${USAGE}`);
      return EXIT.input;
    }
    if (parsed.values.help) {
      io.out(USAGE);
      return EXIT.ok;
    }
    const { presets, problems } = await listPresets();
    for (const p of problems) io.err(`tapline presets: ${p}\n`);
    if (parsed.values.json) {
      io.out(`${JSON.stringify(presets, null, 2)}\n`);
      return problems.length ? EXIT.input : EXIT.ok;
    }
    const width = Math.max(0, ...presets.map((p) => p.id.length));
    const indent = ' '.repeat(width + 2);
    for (const p of presets) {
      const shown = relative(io.cwd, p.path);
      // Descriptions wrap to an 80-column terminal under the name; the path stays whole.
      const about = wrapWords(p.description, Math.max(30, 78 - indent.length)).map((l) => `${indent}${l}\n`).join('');
      io.out(`${p.id.padEnd(width)}  ${p.name}\n${about}${indent}${shown.startsWith('..') ? p.path : shown}\n`);
    }
    return problems.length ? EXIT.input : EXIT.ok;
  },
};
