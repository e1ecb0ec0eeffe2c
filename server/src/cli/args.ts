/**
 * Command-line arguments: `kernwright check|compare|fix|export [options] <paths...>`, `--help`, `--version`.
 * Parsing is pure: it returns what to do, or a one-line usage error; it never prints and never exits.
 *
 * Options may stand before or after the command and the paths, as `--name value` or `--name=value`; everything after
 * `--` is a path. Each option belongs to the commands listed in its spec; using it with another command is an error.
 */
import type { CompareThresholds } from '@kernwright/core';

export type OutputFormat = 'text' | 'json' | 'sarif';
export type CompareFormat = 'text' | 'json' | 'markdown';
export type ExportFormat = 'json' | 'csv' | 'npy';
export type FailOn = 'error' | 'warning' | 'never';
type CommandName = 'check' | 'compare' | 'fix' | 'export';

export interface CheckOptions {
  readonly paths: readonly string[];
  readonly format: OutputFormat;
  readonly failOn: FailOn;
  readonly numerics: boolean;
  /** Worker threads; undefined: chosen from the number of files and cores. */
  readonly jobs?: number;
  /** Time budget of the numerical analysis per kernel, in ms; undefined: the core's default. */
  readonly timeBudgetMs?: number;
}

export type CompareSources =
  | { readonly kind: 'paths'; readonly old: string; readonly new: string }
  | { readonly kind: 'base'; readonly base: string; readonly paths: readonly string[] }
  | { readonly kind: 'range'; readonly base: string; readonly head: string; readonly paths: readonly string[] };

export interface CompareCommandOptions {
  readonly sources: CompareSources;
  readonly format: CompareFormat;
  readonly thresholds: CompareThresholds;
  readonly eigenCount?: number;
  readonly timeBudgetMs?: number;
}

export interface FixOptions {
  readonly paths: readonly string[];
  readonly only?: string;
  readonly dryRun: boolean;
  readonly timeBudgetMs?: number;
}

export interface ExportOptions {
  readonly file: string;
  readonly kernel?: string;
  readonly format: ExportFormat;
  readonly output?: string;
  readonly eigenCount?: number;
  readonly gridPoints?: number;
  readonly timeBudgetMs?: number;
}

export type Command =
  | { readonly kind: 'help' }
  | { readonly kind: 'version' }
  | { readonly kind: 'check'; readonly options: CheckOptions }
  | { readonly kind: 'compare'; readonly options: CompareCommandOptions }
  | { readonly kind: 'fix'; readonly options: FixOptions }
  | { readonly kind: 'export'; readonly options: ExportOptions }
  | { readonly kind: 'usage-error'; readonly message: string };

const commands: readonly CommandName[] = ['check', 'compare', 'fix', 'export'];
const checkFormats: readonly OutputFormat[] = ['text', 'json', 'sarif'];
const compareFormats: readonly CompareFormat[] = ['text', 'json', 'markdown'];
const exportFormats: readonly ExportFormat[] = ['json', 'csv', 'npy'];
const failOnValues: readonly FailOn[] = ['error', 'warning', 'never'];

interface OptionSpec {
  readonly value: boolean;
  readonly commands: readonly CommandName[];
}

const all = commands;
const specs: Readonly<Record<string, OptionSpec>> = {
  '--format': { value: true, commands: all.filter((c) => c !== 'fix') },
  '--fail-on': { value: true, commands: ['check'] },
  '--no-numerics': { value: false, commands: ['check'] },
  '--jobs': { value: true, commands: ['check'] },
  '--time-budget': { value: true, commands: all },
  '--base': { value: true, commands: ['compare'] },
  '--head': { value: true, commands: ['compare'] },
  '--fail-on-flip': { value: false, commands: ['compare'] },
  '--max-norm-change': { value: true, commands: ['compare'] },
  '--max-eigenvalue-change': { value: true, commands: ['compare'] },
  '--max-trace-change': { value: true, commands: ['compare'] },
  '--eigenvalues': { value: true, commands: ['compare', 'export'] },
  '--only': { value: true, commands: ['fix'] },
  '--dry-run': { value: false, commands: ['fix'] },
  '--kernel': { value: true, commands: ['export'] },
  '--output': { value: true, commands: ['export'] },
  '--grid-points': { value: true, commands: ['export'] },
};
const aliases: Readonly<Record<string, string>> = { '-j': '--jobs', '-o': '--output' };

export const usageText = `Usage: kernwright check [options] <files or folders...>
       kernwright compare [options] OLD NEW
       kernwright compare [options] --base <revision> [--head <revision>] [paths...]
       kernwright fix [--only <kind>] [--dry-run] <files...>
       kernwright export <file> [--kernel <name>] [--format json|csv|npy] [-o <file or folder>]
       kernwright report <file> [-o <file.html>|-] [--kernel <name>]...
       kernwright --help | --version

check: syntax, names, evaluation faults and, unless switched off, the numerical analysis (spectrum, norms,
property checks, declared expectations). Folders are searched recursively for *.kw files (node_modules and
dot-folders are skipped).
  --format text|json|sarif    report format (default: text)
  --fail-on error|warning|never
                              lowest severity that makes the exit code 1 (default: error)
  --no-numerics               syntax and name checks only (fast)
  -j, --jobs N                check files on N threads (default: by the number of files and cores)

compare: kernel by kernel, what changed between two versions: two files, two folders, the working tree against a
git revision (--base), or two revisions (--base and --head: every changed .kw file).
  --format text|json|markdown report format (default: text)
  --fail-on-flip              exit 1 when a property (Hermitian, positive, boundedness, continuity) flipped
  --max-norm-change P         exit 1 when a norm changed by more than P (5% or 0.05) beyond its error
  --max-eigenvalue-change P   the same for each leading eigenvalue
  --max-trace-change P        the same for the trace
  --eigenvalues N             how many leading eigenvalues to compare (default 8)

fix: applies the preferred fix of every diagnostic that has one, re-checking until nothing is left.
  --only KIND                 only fixes of this kind (e.g. declare-property, symmetrize)
  --dry-run                   print a unified diff instead of writing (exit 1 when something would change)

export: the discretisation of one kernel (Galerkin matrix, quadrature nodes and weights, eigenvalues,
eigenfunctions on a grid). json prints one document (or writes it to -o FILE); csv and npy write one file per
array into the folder -o FOLDER.
  --kernel NAME               the kernel to export (needed when the file has several)
  -o, --output PATH           where to write
  --eigenvalues N             how many eigenpairs (default 8)
  --grid-points N             points of the eigenfunction grid (default 101)

report: one self-contained HTML page (inline SVG, no script, no external requests) with the pictures and the
figures of every kernel: heat maps of K and of its Hermitian defect, the eigenvalues, the leading eigenfunctions.
  -o, --output FILE|-         where to write (default: <file name>.html; - prints the page)
  --kernel NAME               only this kernel (may be repeated)
  --eigenvalues N, --eigenfunctions N, --grid-points N

Common options:
  --time-budget MS            budget for the numerical analysis of each kernel, counted in work (default 250)
  -h, --help                  show this help
  -v, --version               show the version

Exit codes: 0 success (check: no finding at or above --fail-on; compare: no limit exceeded), 1 findings,
a limit exceeded, or (fix --dry-run) a file that would change, 2 bad usage or unreadable input.
`;

type Parsed = Map<string, string | true>;

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

/** A whole number ≥ 1, or an error message. */
function positiveInteger(name: string, value: string, max: number): number | string {
  if (!/^\d+$/.test(value) || Number(value) < 1 || Number(value) > max) return `option ${name} needs a whole number from 1 to ${max}, got '${value}'`;
  return Number(value);
}

/** `5%` or `0.05` → 0.05; a bare number above 1 is refused as ambiguous. */
export function parseFraction(name: string, value: string): number | string {
  const percent = /^(\d+(?:\.\d*)?|\.\d+)%$/.exec(value);
  if (percent) return Number(percent[1]) / 100;
  if (/^(\d+(?:\.\d*)?|\.\d+)$/.test(value) && Number(value) <= 1) return Number(value);
  return `option ${name} needs a percentage like 5% or a fraction like 0.05, got '${value}'`;
}

function formatOf<T extends string>(parsed: Parsed, allowed: readonly T[], fallback: T): T | string {
  const value = parsed.get('--format');
  if (value === undefined) return fallback;
  const v = String(value);
  return oneOf(v, allowed) ? v : `unknown format '${v}' (use ${allowed.slice(0, -1).join(', ')} or ${allowed[allowed.length - 1]})`;
}

/** The numeric options shared by several commands; a string is a usage error. */
function numbers(parsed: Parsed): { timeBudgetMs?: number; eigenCount?: number; gridPoints?: number; jobs?: number } | string {
  const out: { timeBudgetMs?: number; eigenCount?: number; gridPoints?: number; jobs?: number } = {};
  const table: [string, 'timeBudgetMs' | 'eigenCount' | 'gridPoints' | 'jobs', number][] = [
    ['--time-budget', 'timeBudgetMs', 3_600_000], ['--eigenvalues', 'eigenCount', 64], ['--grid-points', 'gridPoints', 10_001], ['--jobs', 'jobs', 64],
  ];
  for (const [name, key, max] of table) {
    const v = parsed.get(name);
    if (v === undefined) continue;
    const n = positiveInteger(name, String(v), max);
    if (typeof n === 'string') return n;
    out[key] = n;
  }
  return out;
}

function buildCheck(paths: string[], parsed: Parsed): Command {
  if (paths.length === 0) return usageError('check needs at least one file or folder');
  const format = formatOf(parsed, checkFormats, 'text');
  if (!oneOf(format, checkFormats)) return usageError(format);
  const failOn = parsed.get('--fail-on') ?? 'error';
  if (!oneOf(String(failOn), failOnValues)) return usageError(`unknown --fail-on value '${failOn}' (use ${failOnValues.join(', ')})`);
  const n = numbers(parsed);
  if (typeof n === 'string') return usageError(n);
  return {
    kind: 'check',
    options: { paths, format, failOn: failOn as FailOn, numerics: !parsed.has('--no-numerics'), jobs: n.jobs, timeBudgetMs: n.timeBudgetMs },
  };
}

function buildCompare(paths: string[], parsed: Parsed): Command {
  const format = formatOf(parsed, compareFormats, 'text');
  if (!oneOf(format, compareFormats)) return usageError(format);
  const limits: Record<string, number | null> = {};
  for (const name of ['--max-norm-change', '--max-eigenvalue-change', '--max-trace-change']) {
    const v = parsed.get(name);
    if (v === undefined) { limits[name] = null; continue; }
    const f = parseFraction(name, String(v));
    if (typeof f === 'string') return usageError(f);
    limits[name] = f;
  }
  const n = numbers(parsed);
  if (typeof n === 'string') return usageError(n);
  const base = parsed.get('--base');
  const head = parsed.get('--head');
  let sources: CompareSources;
  if (head !== undefined && base === undefined) return usageError('option --head needs --base (compare --base <revision> --head <revision>)');
  if (base !== undefined && head !== undefined) sources = { kind: 'range', base: String(base), head: String(head), paths };
  else if (base !== undefined) sources = { kind: 'base', base: String(base), paths: paths.length > 0 ? paths : ['.'] };
  else if (paths.length === 2) sources = { kind: 'paths', old: paths[0], new: paths[1] };
  else return usageError(`compare needs two files or two folders (OLD NEW), or --base <revision>; got ${paths.length} path${paths.length === 1 ? '' : 's'}`);
  const thresholds: CompareThresholds = {
    failOnFlip: parsed.has('--fail-on-flip'),
    maxNormChange: limits['--max-norm-change'],
    maxEigenvalueChange: limits['--max-eigenvalue-change'],
    maxTraceChange: limits['--max-trace-change'],
  };
  return { kind: 'compare', options: { sources, format, thresholds, eigenCount: n.eigenCount, timeBudgetMs: n.timeBudgetMs } };
}

function buildFix(paths: string[], parsed: Parsed): Command {
  if (paths.length === 0) return usageError('fix needs at least one file');
  const n = numbers(parsed);
  if (typeof n === 'string') return usageError(n);
  const only = parsed.get('--only');
  if (only !== undefined && !/^[a-z][a-z-]*$/.test(String(only))) return usageError(`option --only needs a fix kind like declare-property, got '${only}'`);
  return { kind: 'fix', options: { paths, only: only === undefined ? undefined : String(only), dryRun: parsed.has('--dry-run'), timeBudgetMs: n.timeBudgetMs } };
}

function buildExport(paths: string[], parsed: Parsed): Command {
  if (paths.length !== 1) return usageError(`export needs exactly one file, got ${paths.length}`);
  const format = formatOf(parsed, exportFormats, 'json');
  if (!oneOf(format, exportFormats)) return usageError(format);
  const output = parsed.get('--output');
  if (format !== 'json' && output === undefined) return usageError(`export --format ${format} writes one file per array: name a folder with -o <folder>`);
  const n = numbers(parsed);
  if (typeof n === 'string') return usageError(n);
  const kernel = parsed.get('--kernel');
  return {
    kind: 'export',
    options: {
      file: paths[0], format, kernel: kernel === undefined ? undefined : String(kernel), output: output === undefined ? undefined : String(output),
      eigenCount: n.eigenCount, gridPoints: n.gridPoints, timeBudgetMs: n.timeBudgetMs,
    },
  };
}

export function parseArgs(argv: readonly string[]): Command {
  let command: string | undefined;
  const paths: string[] = [];
  const parsed: Parsed = new Map();
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
    const [given, inline] = splitInline(raw);
    if (given === '-h' || given === '--help') { help = true; continue; }
    if (given === '-v' || given === '--version') { version = true; continue; }
    const name = aliases[given] ?? given;
    const spec = specs[name];
    if (!spec) return usageError(`unknown option '${given}' (see kernwright --help)`);
    if (!spec.value) {
      if (inline !== undefined) return usageError(`option ${name} takes no value`);
      parsed.set(name, true);
      continue;
    }
    let value = inline;
    if (value === undefined) {
      const next = argv[k + 1];
      if (next !== undefined && !(next.startsWith('-') && next !== '-')) {
        value = next;
        k++;
      }
    }
    if (value === undefined || value === '') return usageError(`option ${name} needs a value${name === '--format' ? ' (see kernwright --help)' : ''}`);
    parsed.set(name, value);
  }

  if (help) return { kind: 'help' };
  if (version) return { kind: 'version' };
  if (command === undefined) return usageError('no command given (try: kernwright check <files or folders...>)');
  if (!oneOf(command, commands)) {
    const hint = /\.kw$/i.test(command) || command.includes('/') ? ` (did you mean: kernwright check ${command}?)` : ` (the commands are: ${commands.join(', ')})`;
    return usageError(`unknown command '${command}'${hint}`);
  }
  for (const name of parsed.keys()) {
    if (!specs[name].commands.includes(command)) return usageError(`option ${name} does not apply to '${command}' (see kernwright --help)`);
  }
  switch (command) {
    case 'check':
      return buildCheck(paths, parsed);
    case 'compare':
      return buildCompare(paths, parsed);
    case 'fix':
      return buildFix(paths, parsed);
    case 'export':
      return buildExport(paths, parsed);
  }
}
