import { relative, resolve } from 'node:path';
import { designToFile } from '../../engine/design/save';
import { plan } from '../../engine/planner/index';
import { writeFileAtomic } from '../../store/files';
import { parseCommand, readDesignArg } from '../args';
import { EXIT, type CliIo } from '../../io';
import type { Command } from '../command';
import { planReport } from '../report/plan-report';

const USAGE = `Usage: tapline plan FILE [--out FILE] [--in-place] [--json] [--ascii]

Turns the targets in FILE into a realised design: channels placed on quad packages, every resistor
sized, closed against the exact sweep and snapped to the chosen E-series. Prints the package map,
the values and target vs realised for every trip point. Writes the realised design to FILE with
".planned.tapline.json" instead of ".tapline.json" unless --out names another file. Exit 0 when
every target is met, 1 when one cannot be met, 2 when FILE cannot be read.

Options:
  --out FILE   write the realised design here
  --in-place   allow the output to be the input file itself (overwrites it)
  --json       print a machine-readable document instead of the report
  --ascii      plain ASCII (no µ, Ω or box characters)
  -h, --help
`;

/** Default output path: `x.tapline.json` → `x.planned.tapline.json`, `x.json` → `x.planned.tapline.json`. */
export function plannedName(path: string): string {
  const stem = path.replace(/\.tapline\.json$/i, '').replace(/\.json$/i, '');
  return `${stem}.planned.tapline.json`;
}

/** `path` relative to `cwd` when it lies below it, else as it is. */
function shortPath(cwd: string, path: string): string {
  const rel = relative(cwd, path);
  return rel.startsWith('..') ? path : rel;
}

/** `tapline plan FILE`: plans the targets and writes the realised design. */
export const planCommand: Command = {
  name: 'plan',
  summary: 'turn targets into a realised design',
  usage: 'tapline plan FILE [--out FILE] [--json]',
  async run(args: string[], io: CliIo): Promise<number> {
    const parsed = parseCommand('plan', USAGE, args, io, {
      out: { type: 'string' },
      'in-place': { type: 'boolean' },
      json: { type: 'boolean' },
      ascii: { type: 'boolean' },
    });
    if ('exit' in parsed) return parsed.exit;
    const v = parsed.values;
    const input = parsed.file;
    const output = v.out !== undefined ? resolve(io.cwd, v.out) : v['in-place'] ? input : plannedName(input);
    if (output === input && !v['in-place']) {
      io.err(`tapline plan: --out ${v.out} is the input file; add --in-place to overwrite it, or name another file.\n`);
      return EXIT.input;
    }
    const design = await readDesignArg(input, io);
    if (!design) return EXIT.input;
    const result = plan(design);
    let written: string | null = null;
    if (result.rows.length) {
      try {
        await writeFileAtomic(output, `${JSON.stringify(designToFile(result.design), null, 2)}\n`);
        written = output;
      } catch (e) {
        io.err(`tapline plan: cannot write ${output}: ${(e as Error).message}. Choose another --out.\n`);
        return EXIT.input;
      }
    }
    if (v.json) {
      const { design: _design, ...rest } = result;
      io.out(`${JSON.stringify({ ...rest, output: written }, null, 2)}\n`);
    } else {
      io.out(planReport(result, { ascii: v.ascii ?? false, output: written ? shortPath(io.cwd, written) : null }));
    }
    return result.ok ? EXIT.ok : EXIT.findings;
  },
};
