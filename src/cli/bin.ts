#!/usr/bin/env node
import { main } from './main';
import type { CliIo } from '../io';

const io: CliIo = {
  out: (text) => void process.stdout.write(text),
  err: (text) => void process.stderr.write(text),
  isTty: Boolean(process.stdout.isTTY && process.stdin.isTTY),
  cwd: process.cwd(),
  env: process.env,
};

// The interactive screen is loaded only when asked for, so `check` and friends start fast.
const openTui = async (file: string | undefined, cliIo: CliIo) => {
  // Ink switches to a log-only mode (nothing drawn until exit) when CI variables are set, which it
  // reads once on import. A person at a real terminal gets the live screen regardless.
  if (cliIo.isTty) {
    delete process.env.CI;
    delete process.env.CONTINUOUS_INTEGRATION;
  }
  // The layout engine under Ink loads its WebAssembly through fetch when one exists, which pulls in
  // Node's whole HTTP client (about 40 ms at start-up); without it the module decodes the bytes
  // directly. The screen itself makes no network requests.
  delete (globalThis as { fetch?: unknown }).fetch;
  return (await import('../ui/run')).openTui(file, cliIo);
};

main(process.argv.slice(2), io, openTui).then(
  (code) => {
    process.exitCode = code;
  },
  (error: unknown) => {
    process.stderr.write(`tapline: internal error: ${error instanceof Error ? error.message : String(error)}\nPlease report it with the design file that caused it.\n`);
    process.exitCode = 70;
  },
);
