/**
 * Benchmarks of the interactive screen, run on the bundled CLI (dist/tapline.js) in a pseudo-terminal
 * made by `script` (util-linux): cold start to the first full frame of the demo, the redraw after a
 * keystroke that changes a value (from writing the key to the pty until the new trip point is in the
 * terminal output), and resident memory.
 */
import { type ChildProcessWithoutNullStreams, execFileSync, spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { analyze } from '../../src/engine/analyze';
import { DEMO_DESIGN_FILE } from '../../src/engine/design/demo';
import { parseDesign } from '../../src/engine/design/load';
import type { Design } from '../../src/engine/design/types';
import { formatEng } from '../../src/engine/values';
import { type BenchResult, median } from './measure';

const FRAME_MARK = 'Probe';
const RUNS = 11;

/** The bundled CLI: dist/tapline.js under the working directory (npm scripts run at the root). */
function binPath(): string {
  return join(process.cwd(), 'dist', 'tapline.js');
}

interface Session {
  child: ChildProcessWithoutNullStreams;
  /** Output since the last `mark()`. */
  since(): string;
  mark(): void;
  /** Resolves with the ms from `t0` until the output since the mark, escape sequences removed, contains `text`. */
  until(text: string, t0: number, timeoutMs?: number): Promise<number>;
}

/** Starts `command` (a shell line) in an 80x24 pseudo-terminal. */
function ptySession(command: string, env: NodeJS.ProcessEnv): Session {
  const child = spawn('script', ['-qfec', `stty cols 80 rows 24; exec ${command}`, '/dev/null'], { env });
  let out = '';
  let from = 0;
  const waiters: (() => void)[] = [];
  child.stdout.on('data', (b: Buffer) => {
    out += b.toString('utf8');
    waiters.splice(0).forEach((w) => w());
  });
  return {
    child,
    since: () => out.slice(from),
    mark: () => (from = out.length),
    until(text, t0, timeoutMs = 10_000) {
      return new Promise((resolve, reject) => {
        const timer = setTimeout(() => reject(new Error(`no "${text}" within ${timeoutMs} ms`)), timeoutMs);
        const check = () => {
          if (plain(out.slice(from)).includes(text)) {
            clearTimeout(timer);
            resolve(performance.now() - t0);
          } else waiters.push(check);
        };
        check();
      });
    },
  };
}

function stop(s: Session): Promise<void> {
  return new Promise((resolve) => {
    s.child.once('exit', () => resolve());
    s.child.kill('SIGKILL');
  });
}

/** The pid of the program `script` runs (its only child). */
function programPid(scriptPid: number): number | null {
  try {
    const kids = readFileSync(`/proc/${scriptPid}/task/${scriptPid}/children`, 'utf8').trim().split(/\s+/).map(Number);
    return kids[0] || null;
  } catch {
    return null;
  }
}

function rssMb(pid: number): number | null {
  try {
    const m = /VmRSS:\s+(\d+)\s+kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
    return m ? Number(m[1]) / 1024 : null;
  } catch {
    return null;
  }
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Removes terminal escape sequences (colour, cursor moves) so the text on screen can be searched. */
function plain(s: string): string {
  // eslint-disable-next-line no-control-regex
  return s.replace(/\u001B\[[0-?]*[ -/]*[@-~]|\u001B[@-Z\\-_]/g, '');
}

/**
 * The rising trip point of the demo's top channel as the channels table prints it (4 digits), with
 * RS1 at `rs1` ohms: the screen shows the new trip point only once the redraw is on screen.
 */
function demoTopRise(rs1: number): string {
  const r = parseDesign(DEMO_DESIGN_FILE);
  if (!r.ok) throw new Error('the demo design does not load');
  const d: Design = { ...r.design, string: [rs1, ...r.design.string.slice(1)] };
  const ch = analyze(d).channels;
  return formatEng(ch[ch.length - 1].rising!.x, '', { digits: 4 });
}

/** Every figure of the screen against its limit. */
export async function benchTui(): Promise<BenchResult[]> {
  execFileSync('script', ['--version']);
  const home = mkdtempSync(join(tmpdir(), 'tapline-bench-'));
  const env = { ...process.env, XDG_CONFIG_HOME: home, TERM: 'xterm-256color', NO_COLOR: '' };
  const node = process.execPath;
  const starts: number[] = [];
  const bases: number[] = [];
  const keystrokes: number[] = [];
  let rss = 0;
  // The demo starts with RS1 = 3k09; + steps it to 3k16 (IEC 60063 E96), u steps back.
  const risen = [demoTopRise(3160), demoTopRise(3090)];
  if (risen[0] === risen[1]) throw new Error('the step does not move the top trip point; the benchmark would time nothing');
  try {
    for (let k = 0; k < RUNS; k++) {
      const base = ptySession(`'${node}' -e 'process.stdout.write("ready")'`, env);
      bases.push(await base.until('ready', performance.now()));
      await stop(base);

      const t0 = performance.now();
      const s = ptySession(`'${node}' '${binPath()}'`, env);
      starts.push(await s.until(FRAME_MARK, t0));
      if (k === 0) {
        for (let j = 0; j < 30; j++) {
          // Past the autosave delay, so the draft write of the previous edit is not timed with this key.
          await sleep(400);
          s.mark();
          const t = performance.now();
          s.child.stdin.write(j % 2 === 0 ? '+' : 'u');
          // Timed until the new trip point itself is on screen, not the status message.
          keystrokes.push(await s.until(risen[j % 2], t));
        }
        await sleep(300);
        const pid = programPid(s.child.pid!);
        rss = pid ? rssMb(pid) ?? 0 : 0;
      }
      await stop(s);
    }
  } finally {
    rmSync(home, { recursive: true, force: true });
  }
  const base = median(bases);
  return [
    { name: `tui: cold start to first frame, pty (node alone ${base.toFixed(0)} ms)`, medianMs: median(starts), limitMs: 350 },
    { name: 'tui: cold start minus node start-up, pty', medianMs: Math.max(0, median(starts) - base), limitMs: 350 },
    { name: 'tui: keystroke to redraw with new trip points', medianMs: median(keystrokes), limitMs: 16 },
    { name: 'tui: resident memory after start and edits', value: rss, unit: 'MB', limit: 150 },
  ];
}
