/** Exit codes of the command-line program, and which findings turn into a failing exit code. */
import type { ReportSummary } from '@kernwright/core';
import type { FailOn } from './args';

export const ExitCode = {
  /** No finding at or above the --fail-on severity. */
  ok: 0,
  /** At least one finding at or above the --fail-on severity. */
  findings: 1,
  /** Bad usage, unreadable input, or an internal failure. */
  usage: 2,
} as const;

export function exitCodeFor(summary: ReportSummary, failOn: FailOn): number {
  switch (failOn) {
    case 'never':
      return ExitCode.ok;
    case 'warning':
      return summary.errors + summary.warnings > 0 ? ExitCode.findings : ExitCode.ok;
    case 'error':
      return summary.errors > 0 ? ExitCode.findings : ExitCode.ok;
  }
}
