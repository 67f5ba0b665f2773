import type { CliIo } from '../../src/io';

/** A captured in-process CLI environment: what a command printed, for assertions. */
export interface FakeIo extends CliIo {
  stdout: () => string;
  stderr: () => string;
}

/** Builds a fake io rooted at `cwd` (the repository root by default), not a TTY. */
export function fakeIo(cwd = process.cwd(), env: Record<string, string | undefined> = {}): FakeIo {
  let out = '';
  let err = '';
  return {
    out: (t) => void (out += t),
    err: (t) => void (err += t),
    isTty: false,
    cwd,
    env,
    stdout: () => out,
    stderr: () => err,
  };
}
