/** Streams and environment a command or the interactive screen runs with, injected so both can be tested in-process. */
export interface CliIo {
  /** Standard output writer. */
  out: (text: string) => void;
  /** Standard error writer. */
  err: (text: string) => void;
  /** Whether standard output is an interactive terminal (progress bars, the TUI). */
  isTty: boolean;
  /** Working directory that relative paths resolve against. */
  cwd: string;
  /** Environment variables (NO_COLOR, XDG_CONFIG_HOME, ...). */
  env: Record<string, string | undefined>;
}

/** Exit codes shared by every command. */
export const EXIT = {
  /** Clean: nothing to report at error level. */
  ok: 0,
  /** The design has an error-level finding, or a target cannot be met. */
  findings: 1,
  /** Unreadable input: bad arguments, missing or invalid file. */
  input: 2,
} as const;
