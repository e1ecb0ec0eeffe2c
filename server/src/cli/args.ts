/**
 * Command-line arguments: `kernwright check [options] <files or folders...>`, `--help`, `--version`.
 * Parsing is pure: it returns what to do, or a one-line usage error; it never prints and never exits.
 */

export type OutputFormat = 'text' | 'json';
export type FailOn = 'error' | 'warning' | 'never';

export interface CheckOptions {
  readonly paths: readonly string[];
  readonly format: OutputFormat;
  readonly failOn: FailOn;
  readonly numerics: boolean;
}

export type Command =
  | { readonly kind: 'help' }
  | { readonly kind: 'version' }
  | { readonly kind: 'check'; readonly options: CheckOptions }
  | { readonly kind: 'usage-error'; readonly message: string };

const formats: readonly OutputFormat[] = ['text', 'json'];
const failOnValues: readonly FailOn[] = ['error', 'warning', 'never'];

export const usageText = `Usage: kernwright check [options] <files or folders...>

Checks kernel files (.kw): syntax, names, evaluation faults and, unless switched off,
the numerical analysis (spectrum, norms, property checks, declared expectations).
Folders are searched recursively for *.kw files (node_modules and dot-folders are skipped).

Options:
  --format text|json          report format (default: text)
  --fail-on error|warning|never
                              lowest severity that makes the exit code 1 (default: error)
  --no-numerics               syntax and name checks only (fast)
  -h, --help                  show this help
  -v, --version               show the version

Exit codes: 0 no finding at or above --fail-on, 1 findings at or above --fail-on,
2 bad usage or unreadable input.
`;

function usageError(message: string): Command {
  return { kind: 'usage-error', message };
}

function oneOf<T extends string>(value: string, allowed: readonly T[]): value is T {
  return (allowed as readonly string[]).includes(value);
}

/** Splits `--name=value` into its two halves; other arguments come back unchanged. */
function splitInline(arg: string): [string, string | undefined] {
  if (!arg.startsWith('--')) return [arg, undefined];
  const eq = arg.indexOf('=');
  return eq < 0 ? [arg, undefined] : [arg.slice(0, eq), arg.slice(eq + 1)];
}

export function parseArgs(argv: readonly string[]): Command {
  let command: string | undefined;
  const paths: string[] = [];
  let format: OutputFormat = 'text';
  let failOn: FailOn = 'error';
  let numerics = true;
  let help = false;
  let version = false;
  let onlyPaths = false;

  for (let k = 0; k < argv.length; k++) {
    const raw = argv[k];
    if (onlyPaths || raw === '-' || !raw.startsWith('-')) {
      if (command === undefined) command = raw;
      else paths.push(raw);
      continue;
    }
    if (raw === '--') {
      onlyPaths = true;
      continue;
    }
    const [name, inline] = splitInline(raw);
    const takeValue = (): string | undefined => {
      if (inline !== undefined) return inline;
      const next = argv[k + 1];
      if (next === undefined || (next.startsWith('-') && next !== '-')) return undefined;
      k++;
      return next;
    };
    switch (name) {
      case '-h':
      case '--help':
        help = true;
        break;
      case '-v':
      case '--version':
        version = true;
        break;
      case '--no-numerics':
        if (inline !== undefined) return usageError(`option --no-numerics takes no value`);
        numerics = false;
        break;
      case '--format': {
        const value = takeValue();
        if (value === undefined) return usageError(`option --format needs a value: ${formats.join(' or ')}`);
        if (!oneOf(value, formats)) return usageError(`unknown format '${value}' (use ${formats.join(' or ')})`);
        format = value;
        break;
      }
      case '--fail-on': {
        const value = takeValue();
        if (value === undefined) return usageError(`option --fail-on needs a value: ${failOnValues.join(', ')}`);
        if (!oneOf(value, failOnValues)) {
          return usageError(`unknown --fail-on value '${value}' (use ${failOnValues.join(', ')})`);
        }
        failOn = value;
        break;
      }
      default:
        return usageError(`unknown option '${name}' (see kernwright --help)`);
    }
  }

  if (help) return { kind: 'help' };
  if (version) return { kind: 'version' };
  if (command === undefined) return usageError('no command given (try: kernwright check <files or folders...>)');
  if (command !== 'check') {
    const hint = /\.kw$/i.test(command) || command.includes('/') ? ` (did you mean: kernwright check ${command}?)` : ' (the command is: check)';
    return usageError(`unknown command '${command}'${hint}`);
  }
  if (paths.length === 0) return usageError('check needs at least one file or folder');
  return { kind: 'check', options: { paths, format, failOn, numerics } };
}
