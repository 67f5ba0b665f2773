import { cautionsFor } from '../../engine/cautions';
import { DEFAULT_TRIALS, type SpreadReport } from '../../engine/spread';
import { runSpreadParallel } from '../../workers/spread-pool';
import { EXIT, type CliIo } from '../../io';
import { parseCommand, readDesignArg } from '../args';
import type { Command } from '../command';
import { spreadJson, spreadText } from '../report/spread-report';

const USAGE = `Usage: tapline spread FILE [--trials N] [--seed S] [--threads T] [--json] [--ascii]

Where real parts put each trip point: worst-case bounds over every uncertain parameter (resistor and
reference tolerance, comparator offset and bias current, LED knee, supply range) and a seeded Monte
Carlo of the exact sweep. Exit 0 when steps keep their order, windows never invert, no trial
chatters and (with an allowance) at least 99.73 % of trials are within it; 1 otherwise; 2 when
FILE or an option cannot be read.

Options:
  --trials N   Monte Carlo trials (default ${DEFAULT_TRIALS})
  --seed S     seed, a whole number from 0 to 4294967295 (default 1); the same seed gives
               the same numbers
  --threads T  worker threads besides this one (default: one per 20000 trials, at most one per
               core but one; 0 runs here only)
  --json       print a machine-readable document instead of the report
  --ascii      plain ASCII (no µ or ±)
  -h, --help
`;

/** Least share of trials within the allowance for a clean exit: the ±3 sigma fraction. */
const YIELD_GOAL = 0.9973;

function wholeOption(name: string, text: string | undefined, fallback: number, min: number, max: number): number | string {
  if (text === undefined) return fallback;
  const v = Number(text);
  if (!/^\d+$/.test(text.trim()) || v < min || v > max) return `--${name}: "${text}" is not a whole number from ${min} to ${max}; for example --${name} ${fallback}.`;
  return v;
}

/** Whether the report shows a risk that should fail the command. */
export function spreadFails(report: SpreadReport): boolean {
  const risky = [...report.order, ...report.windows].some((r) => r.probability > 0);
  return risky || report.chatter > 0 || (report.yield !== null && report.yield < YIELD_GOAL);
}

/** `tapline spread FILE`: worst case and Monte Carlo spread of every trip point. */
export const spreadCommand: Command = {
  name: 'spread',
  summary: 'worst case and Monte Carlo spread of every trip point',
  usage: 'tapline spread FILE [--trials N] [--seed S] [--json]',
  async run(args: string[], io: CliIo): Promise<number> {
    const parsed = parseCommand('spread', USAGE, args, io, {
      trials: { type: 'string' },
      seed: { type: 'string' },
      threads: { type: 'string' },
      json: { type: 'boolean' },
      ascii: { type: 'boolean' },
    });
    if ('exit' in parsed) return parsed.exit;
    const v = parsed.values;
    const trials = wholeOption('trials', v.trials, DEFAULT_TRIALS, 1, 10_000_000);
    const seed = wholeOption('seed', v.seed, 1, 0, 4294967295);
    const threads = wholeOption('threads', v.threads, -1, 0, 1024);
    for (const bad of [trials, seed, threads]) {
      if (typeof bad === 'string') {
        io.err(`tapline spread: ${bad}\n`);
        return EXIT.input;
      }
    }
    const design = await readDesignArg(parsed.file, io);
    if (!design) return EXIT.input;
    const showProgress = io.isTty;
    const onProgress = showProgress ? (done: number, total: number) => io.err(`\r${progressBar(done / total, v.ascii ?? false)}`) : undefined;
    const { report } = await runSpreadParallel(design, {
      trials: trials as number,
      seed: seed as number,
      ...(threads === -1 ? {} : { threads: threads as number }),
      onProgress,
    });
    if (showProgress) io.err('\r\x1b[K');
    const cautions = cautionsFor(design);
    if (v.json) io.out(`${JSON.stringify(spreadJson(design, report, cautions), null, 2)}\n`);
    else io.out(spreadText(design, report, cautions, { ascii: v.ascii ?? false }));
    return spreadFails(report) ? EXIT.findings : EXIT.ok;
  },
};

/** One-line progress bar for a terminal, e.g. "Monte Carlo [#####-----]  50 %". */
export function progressBar(fraction: number, ascii: boolean): string {
  const width = 30;
  const filled = Math.round(Math.min(1, Math.max(0, fraction)) * width);
  const [on, off] = ascii ? ['#', '-'] : ['█', '░'];
  return `Monte Carlo [${on.repeat(filled)}${off.repeat(width - filled)}] ${String(Math.floor(fraction * 100)).padStart(3)} %`;
}
