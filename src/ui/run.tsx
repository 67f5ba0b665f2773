/**
 * The interactive screen's entry: refuses without a terminal, loads the design (or the demo), offers
 * a draft left by a crash, renders the app on the alternate screen, and always gives the terminal
 * back: on quit, on Ctrl+C, on a hang-up or termination signal, and on an internal error.
 */
import { basename, resolve } from 'node:path';
import { render } from 'ink';
import { EXIT, type CliIo } from '../io';
import { DEMO_DESIGN_FILE, DEMO_FILE_NAME } from '../engine/design/demo';
import { parseDesign } from '../engine/design/load';
import { designToFile } from '../engine/design/save';
import type { Design } from '../engine/design/types';
import { openDrafts } from '../store/drafts';
import { readDesignFile, writeFileAtomic } from '../store/files';
import { fileExists } from '../store/paths';
import { listPresets } from '../store/presets';
import { openSettings } from '../store/settings';
import { App } from './app';
import { capabilities } from './capabilities';
import { sameDesign } from './controller/use-controller';
import type { Services } from './services';
import { initialState } from './state/app-reducer';
import { noColorRequested } from './theme';

const ALT_SCREEN_ON = '\u001B[?1049h';
const ALT_SCREEN_OFF = '\u001B[?1049l';
const SHOW_CURSOR = '\u001B[?25h';

/** The design to start with: FILE, or the built-in demo. */
async function loadStart(file: string | undefined, io: CliIo): Promise<{ ok: true; design: Design; path: string | null; name: string } | { ok: false; message: string }> {
  if (file === undefined) {
    const parsed = parseDesign(DEMO_DESIGN_FILE);
    if (!parsed.ok) return { ok: false, message: 'tapline: the built-in demo design does not load; this is a bug.' };
    return { ok: true, design: parsed.design, path: null, name: `${DEMO_FILE_NAME} (demo)` };
  }
  const path = resolve(io.cwd, file);
  const read = await readDesignFile(path);
  if (!read.ok) return { ok: false, message: read.message };
  return { ok: true, design: read.design, path, name: basename(path) };
}

/**
 * Opens the interactive screen on `file` (or the demo) and resolves to the exit code when the user
 * leaves. Without a terminal on both input and output it says to use the batch commands instead.
 */
export async function openTui(file: string | undefined, io: CliIo): Promise<number> {
  if (!io.isTty || !process.stdin.isTTY) {
    io.err('tapline: the interactive screen needs a terminal (standard input and output are not one).\n'
      + "Use 'tapline check FILE' to analyse a design or 'tapline plan FILE' to plan one from its targets.\n");
    return EXIT.input;
  }
  const start = await loadStart(file, io);
  if (!start.ok) {
    io.err(`${start.message}\n`);
    return EXIT.input;
  }
  const settings = openSettings(io.env);
  const drafts = openDrafts(io.env);
  if (start.path) settings.addRecent(start.path);
  const initial = initialState(start.design, start.path, start.name);
  const draft = drafts.load(start.path);
  if (draft && !sameDesign(draft.design, start.design)) initial.question = { kind: 'draft', draft };
  else if (draft) drafts.clear(start.path);

  const { close: closeCapabilities, ...capable } = capabilities();
  const services: Services = {
    settings,
    drafts,
    now: () => Date.now(),
    cwd: io.cwd,
    readDesign: readDesignFile,
    writeDesign: (path, design) => writeFileAtomic(path, `${JSON.stringify(designToFile(design), null, 2)}\n`),
    fileExists,
    presets: async () => (await listPresets()).presets,
    ...capable,
  };

  let code: number = EXIT.ok;
  let flush = () => {};
  const stdout = process.stdout;
  stdout.write(ALT_SCREEN_ON);
  let restored = false;
  const restore = () => {
    if (restored) return;
    restored = true;
    if (process.stdin.isTTY) process.stdin.setRawMode(false);
    stdout.write(`${SHOW_CURSOR}${ALT_SCREEN_OFF}`);
  };
  const instance = render(
    <App initial={initial} services={services} noColor={noColorRequested(io.env)} onExit={(c) => (code = c)} onFlushReady={(f) => (flush = f)} />,
    { exitOnCtrlC: false, incrementalRendering: true, patchConsole: true, maxFps: 60 },
  );
  const onSignal = (signal: NodeJS.Signals, exitCode: number) => () => {
    try {
      flush();
    } finally {
      code = exitCode;
      instance.unmount();
      restore();
    }
  };
  const handlers: [NodeJS.Signals, () => void][] = [
    ['SIGHUP', onSignal('SIGHUP', 129)], ['SIGTERM', onSignal('SIGTERM', 143)], ['SIGINT', onSignal('SIGINT', 130)],
  ];
  for (const [sig, h] of handlers) process.on(sig, h);
  try {
    await instance.waitUntilExit();
  } catch (e) {
    try {
      flush();
    } catch {
      // The draft store itself failed; the error below is what the user needs to see.
    }
    restore();
    io.err(`tapline: internal error: ${(e as Error).message}\nYour unsaved edits were kept as a draft; start tapline on the same file to get them back.\n`);
    code = 70;
  } finally {
    for (const [sig, h] of handlers) process.off(sig, h);
    restore();
    await closeCapabilities();
  }
  return code;
}
