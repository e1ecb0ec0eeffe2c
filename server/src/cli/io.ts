/** Where the program writes; the real process streams in main.ts, string buffers in tests. */
export interface CliIo {
  /** Writes text to standard output as is (callers add the newlines). */
  readonly out: (text: string) => void;
  /** Writes one message line to standard error (the newline is added). */
  readonly err: (line: string) => void;
  /** Writes to standard error as is, for the progress line on a terminal (absent: no progress line). */
  readonly status?: (text: string) => void;
  /** Which streams are terminals (absent: neither, as in CI logs and tests). */
  readonly terminal?: { readonly stdout: boolean; readonly stderr: boolean; readonly columns?: number };
  /** The environment (for NO_COLOR); absent: empty. */
  readonly env?: Readonly<Record<string, string | undefined>>;
}
