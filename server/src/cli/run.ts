/** The whole program as a function of its arguments: parse, dispatch, return the exit code. */
import { parseArgs, usageText } from './args';
import { runCheck, type Analyzer } from './checkCommand';
import { ExitCode } from './exitCode';
import type { CliIo } from './io';
import { toolName, toolVersion } from './version';

export function runCli(argv: readonly string[], io: CliIo, analyze?: Analyzer): number {
  const command = parseArgs(argv);
  switch (command.kind) {
    case 'help':
      io.out(usageText);
      return ExitCode.ok;
    case 'version':
      io.out(`${toolName} ${toolVersion}\n`);
      return ExitCode.ok;
    case 'usage-error':
      io.err(command.message);
      return ExitCode.usage;
    case 'check':
      return runCheck(command.options, io, analyze);
  }
}
