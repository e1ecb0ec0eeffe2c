/** The whole program as a function of its arguments: parse, dispatch, resolve to the exit code. */
import { parseArgs, usageText } from './args';
import { runCheck, type Analyzer } from './checkCommand';
import { runCompare } from './compareCommand';
import { ExitCode } from './exitCode';
import { runExport } from './exportCommand';
import { runFix } from './fixCommand';
import { runReportCommand } from './reportCommand';
import type { CliIo } from './io';
import { toolName, toolVersion } from './version';

export async function runCli(argv: readonly string[], io: CliIo, analyze?: Analyzer): Promise<number> {
  if (argv[0] === 'report') return runReportCommand(argv.slice(1), io);
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
    case 'compare':
      return runCompare(command.options, io);
    case 'fix':
      return runFix(command.options, io);
    case 'export':
      return runExport(command.options, io);
  }
}
