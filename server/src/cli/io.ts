/** Where the program writes; the real process streams in main.ts, string buffers in tests. */
export interface CliIo {
  /** Writes text to standard output as is (callers add the newlines). */
  readonly out: (text: string) => void;
  /** Writes one message line to standard error (the newline is added). */
  readonly err: (line: string) => void;
}
