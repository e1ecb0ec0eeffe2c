/**
 * A one-line progress display on standard error (`checking 12/40: examples/a.kw`), rewritten in place, for a
 * terminal only and only when there are enough files to wait for. Nothing of it reaches a CI log: without a
 * terminal on stderr every call is a no-op. Messages written while it shows clear it first.
 */
import type { CliIo } from './io';

/** Fewer files than this finish before a progress line would help. */
export const progressThreshold = 4;

export interface Progress {
  /** One more file done; `label` names the file just finished. */
  readonly tick: (label: string) => void;
  /** Removes the line (before other output, and at the end). */
  readonly clear: () => void;
  readonly active: boolean;
}

const inactive: Progress = { tick: () => undefined, clear: () => undefined, active: false };

export function createProgress(io: CliIo, total: number, verb = 'checking'): Progress {
  const write = io.status;
  if (!write || io.terminal?.stderr !== true || total < progressThreshold) return inactive;
  const width = Math.max(20, (io.terminal.columns ?? 80) - 1);
  let done = 0;
  let shown = false;
  return {
    active: true,
    tick(label: string) {
      done++;
      let line = `${verb} ${done}/${total}: ${label}`;
      if (line.length > width) line = `${line.slice(0, width - 1)}…`;
      write(`\r\x1b[K${line}`);
      shown = true;
    },
    clear() {
      if (shown) write('\r\x1b[K');
      shown = false;
    },
  };
}
