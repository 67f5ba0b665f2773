/**
 * Benchmarks of the interactive screen, run on the bundled CLI (dist/tapline.js) in a pseudo-terminal
 * made by `script` (util-linux): cold start to the first full frame of the demo, the redraw after a
 * keystroke that changes a value, and resident memory.
 */
import { type ChildProcessWithoutNullStreams, execFileSync, spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { type BenchResult, median } from './measure';

const FRAME_MARK = 'Probe';
const RUNS = 7;

/** The bundled CLI: dist/tapline.js under the working directory (npm scripts run at the root). */
function binPath(): string {
  return join(process.cwd(), 'dist', 'tapline.js');
}

interface Session {
  child: ChildProcessWithoutNullStreams;
  /** Output since the last `mark()`. */
  since(): string;
  mark(): void;
  /** Resolves with the ms from `t0` until the output since the mark contains `text`. */
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
          if (out.slice(from).includes(text)) {
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
  try {
    for (let k = 0; k < RUNS; k++) {
      const base = ptySession(`'${node}' -e 'process.stdout.write("ready")'`, env);
      bases.push(await base.until('ready', performance.now()));
      await stop(base);

      const t0 = performance.now();
      const s = ptySession(`'${node}' '${binPath()}'`, env);
      starts.push(await s.until(FRAME_MARK, t0));
      if (k === 0) {
        for (let j = 0; j < 10; j++) {
          // Past the autosave delay, so the draft write of the previous edit is not timed with this key.
          await sleep(400);
          s.mark();
          const t = performance.now();
          s.child.stdin.write(j % 2 === 0 ? '+' : 'u');
          keystrokes.push(await s.until(j % 2 === 0 ? '3k16' : 'undone', t));
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
