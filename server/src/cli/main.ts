/**
 * Entry point of the bundled program (server/dist/cli.js). Connects `runCli` to the process: streams, exit code,
 * and a last-resort handler so that the user sees a one-line message, never a stack trace.
 */
import { ExitCode } from './exitCode';
import type { CliIo } from './io';
import { runCli } from './run';
import { installMathjsSimplifier } from '../mathjsSimplifier';

const prefix = 'kernwright: ';

function fail(error: unknown): void {
  const message = error instanceof Error ? error.message : String(error);
  try {
    process.stderr.write(`${prefix}internal error: ${message} (please report this)\n`);
  } finally {
    process.exitCode = ExitCode.usage;
  }
}

// A reader that stops early (`kernwright check . | head`) is not an error of ours.
process.stdout.on('error', (error: NodeJS.ErrnoException) => {
  if (error.code === 'EPIPE') process.exit(process.exitCode ?? ExitCode.ok);
  fail(error);
});
process.on('uncaughtException', (error) => {
  fail(error);
  process.exit(ExitCode.usage);
});

// The fixes (shown by fix, and in SARIF) simplify their text as the editor's do.
installMathjsSimplifier();

const io: CliIo = {
  out: (text) => process.stdout.write(text),
  err: (line) => process.stderr.write(`${prefix}${line}\n`),
  status: (text) => process.stderr.write(text),
  terminal: { stdout: process.stdout.isTTY === true, stderr: process.stderr.isTTY === true, columns: process.stderr.columns },
  env: process.env,
};

runCli(process.argv.slice(2), io).then(
  (code) => {
    process.exitCode = code;
  },
  (error: unknown) => fail(error),
);
