/**
 * End to end in a real terminal: tapline runs in tmux at 80x24; keys are typed with send-keys and
 * the screen is read with capture-pane. Needs dist/tapline.js (`npm test` builds it first) and tmux
 * (CI installs it; locally the test is skipped with a message when tmux is absent).
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyze } from '../../src/engine/analyze';
import { parseDesign } from '../../src/engine/design/load';
import type { Design } from '../../src/engine/design/types';
import { formatEng } from '../../src/engine/values';

const ROOT = resolve(__dirname, '../..');
const BIN = join(ROOT, 'dist/tapline.js');
const PRESET = join(ROOT, 'presets/lead-acid-12v-gauge.tapline.json');
const hasTmux = spawnSync('tmux', ['-V']).status === 0;
if (!hasTmux) console.warn('tui.e2e: tmux is not installed here, so the terminal test is skipped (CI installs it via .ci/run).');

const SOCKET = `tapline-e2e-${process.pid}`;
let dir = '';
const tmux = (...args: string[]) => execFileSync('tmux', ['-L', SOCKET, ...args], { encoding: 'utf8' });
const screen = () => tmux('capture-pane', '-p', '-t', 'tl');
const keys = (...k: string[]) => tmux('send-keys', '-t', 'tl', ...k);
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

// Generous: on a loaded 2-core CI machine running the whole suite, a cold start can take seconds.
async function waitFor(test: (s: string) => boolean, what: string, ms = 45_000): Promise<string> {
  const end = Date.now() + ms;
  let last = '';
  while (Date.now() < end) {
    try {
      last = screen();
    } catch {
      last = '(no tmux pane)';
    }
    if (test(last)) return last;
    await sleep(50);
  }
  throw new Error(`timed out waiting for ${what}; screen was:\n${last}`);
}

function start(file: string) {
  const cmd = `cd '${dir}' && exec env XDG_CONFIG_HOME='${join(dir, 'config')}' NO_COLOR=1 node '${BIN}' '${file}'`;
  tmux('new-session', '-d', '-s', 'tl', '-x', '80', '-y', '24', cmd);
  return waitFor((s) => s.includes('Probe') || s.includes('Found unsaved edits'), 'the first full frame');
}

/** The rising trip point of `id` from the channels table (bare number, unit in the title). */
function rise(s: string, id: string): string {
  const row = s.split('\n').find((l) => new RegExp(`^.${id} `).test(l)) ?? '';
  return row.trim().split(/\s+/)[5] ?? '';
}

/** What the engine says the rising trip of channel k is, printed as the table prints it (4 digits). */
function expectedRise(d: Design, k: number): string {
  return formatEng(analyze(d).channels[k].rising!.x, '', { digits: 4 });
}

function load(path: string): Design {
  const r = parseDesign(JSON.parse(readFileSync(path, 'utf8')));
  if (!r.ok) throw new Error('saved file does not load');
  return r.design;
}

describe.skipIf(!hasTmux)('tapline in a terminal', () => {
  beforeAll(() => {
    if (!existsSync(BIN)) throw new Error('dist/tapline.js is missing: run `npm run build` first (npm test does).');
    dir = mkdtempSync(join(tmpdir(), 'tapline-e2e-'));
    copyFileSync(PRESET, join(dir, 'gauge.tapline.json'));
  });
  afterAll(() => {
    spawnSync('tmux', ['-L', SOCKET, 'kill-server']);
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  it('steps a resistor, moves the probe, undoes, saves, and recovers a draft after SIGKILL', async () => {
    const file = join(dir, 'gauge.tapline.json');
    const original = load(file);
    let s = await start('gauge.tapline.json');
    expect(rise(s, 'S4')).toBe(expectedRise(original, 3));

    // Step RS1 (selected at start) one E96 value up: 3k09 -> 3k16 (IEC 60063 E96).
    keys('+');
    s = await waitFor((x) => x.includes('RS1 3k09 -> 3k16'), 'the step message');
    const stepped = { ...original, string: [3160, ...original.string.slice(1)] };
    expect(rise(s, 'S4')).toBe(expectedRise(stepped, 3));
    expect(s).toContain('[modified]');

    // Probe one column right of the middle: 48 chart columns over 10..15 V at 80 columns.
    keys('Right');
    s = await waitFor((x) => x.includes(`Probe ${formatEng(12.5 + 5 / 48, 'V', { digits: 4 })}`), 'the probe to move');

    keys('u');
    s = await waitFor((x) => x.includes('undone'), 'undo');
    expect(rise(s, 'S4')).toBe(expectedRise(original, 3));
    expect(s).not.toContain('[modified]');

    keys('+');
    await waitFor((x) => x.includes('3k16 (E96)'), 'the second step');
    keys('s');
    s = await waitFor((x) => x.includes('saved '), 'the save');
    expect(load(file).string[0]).toBeCloseTo(3160, 6);

    // Another edit, give autosave its second, then kill the process without warning.
    keys('+');
    await waitFor((x) => x.includes('3k16 -> 3k24'), 'the third step');
    await sleep(1200);
    const pid = Number(tmux('display-message', '-p', '-t', 'tl', '#{pane_pid}').trim());
    process.kill(pid, 'SIGKILL');
    spawnSync('tmux', ['-L', SOCKET, 'kill-session', '-t', 'tl']);
    expect(load(file).string[0]).toBeCloseTo(3160, 6);

    s = await start('gauge.tapline.json');
    expect(s).toContain('Found unsaved edits');
    keys('y');
    s = await waitFor((x) => x.includes('draft restored'), 'the restore');
    expect(s).toContain('RS1 3k24');
    expect(rise(s, 'S4')).toBe(expectedRise({ ...original, string: [3240, ...original.string.slice(1)] }, 3));

    keys('q');
    await waitFor((x) => x.includes('Save before quitting?'), 'the quit question');
    keys('y');
    await waitFor(() => {
      try {
        return tmux('list-panes', '-t', 'tl', '-F', '#{pane_dead}').trim() !== '0';
      } catch {
        return true;
      }
    }, 'the program to exit', 5000).catch(() => '');
  }, 240_000);
});
