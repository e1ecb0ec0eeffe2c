/**
 * `kernwright report <file> [-o <report.html>] [--kernel <name>] [options]`: the pictures and figures of every kernel
 * of a file as one self-contained HTML page (inline SVG rendered with vega, inline CSS, no script, nothing loaded
 * from elsewhere), readable on wide and narrow windows, in light and dark mode.
 *
 * Options (after the word `report`, before or after the file; `--name value` or `--name=value`):
 *   -o, --output FILE      where to write (default: the file's name with .html, in the current folder; `-` prints it)
 *   --kernel NAME          only this kernel (repeatable)
 *   --eigenvalues N        how many leading eigenvalues to compute and show (default 16)
 *   --eigenfunctions N     how many leading eigenfunctions to draw, 1 to 4 (default 4)
 *   --grid-points N        cells per axis of the heat maps, 8 to 200 (default 48)
 *   --time-budget MS       budget for the numerical analysis of each kernel (default: the core's, 250)
 *
 * Exit codes: 0 the report was written (a kernel with errors gets a section saying so); 2 bad usage, unreadable
 * input or output that cannot be written. Nothing is written unless the whole page was made.
 */
import * as path from 'node:path';
import {
  analyzeText,
  fileKernelPictureData,
  LineIndex,
  reportPageHtml,
  type AnalysisOptions,
  type FileAnalysis,
  type KernelPictureData,
  type KernelSection,
} from '@kernwright/core';
import { renderKernelSection } from '../pictures/kernelPictures';
import { ExitCode } from './exitCode';
import { writeFileAtomically } from './exportCommand';
import { stoppedKernelsOf } from './parallel';
import { describeFsError } from './fsErrors';
import type { CliIo } from './io';
import { readSource } from './readSource';
import { toolName, toolVersion } from './version';

export interface ReportOptions {
  readonly file: string;
  /** Undefined: derived from the file name; '-': standard output. */
  readonly output?: string;
  readonly kernels: readonly string[];
  readonly eigenCount: number;
  readonly eigenfunctions: number;
  readonly gridPoints: number;
  readonly timeBudgetMs?: number;
}

export const reportUsage = `Usage: kernwright report <file> [-o <report.html>] [--kernel <name>] [options]

report: the pictures of every kernel of a file (K on its square with the lines where it is not smooth, the
Hermitian defect, the eigenvalues, the share of the trace, the leading eigenfunctions) and their figures with
error estimates, as one self-contained HTML page.
  -o, --output FILE           where to write (default: <file name>.html in the current folder; - prints it)
  --kernel NAME               only this kernel (may be given more than once)
  --eigenvalues N             leading eigenvalues to compute and show (default 16)
  --eigenfunctions N          leading eigenfunctions to draw, 1 to 4 (default 4)
  --grid-points N             cells per axis of the heat maps, 8 to 200 (default 48)
  --time-budget MS            budget for the numerical analysis of each kernel, counted in work (default 250)
`;

const valueOptions = new Set(['--output', '--kernel', '--eigenvalues', '--eigenfunctions', '--grid-points', '--time-budget']);
const aliases: Readonly<Record<string, string>> = { '-o': '--output' };

type Parsed = { readonly kind: 'options'; readonly options: ReportOptions } | { readonly kind: 'help' } | { readonly kind: 'error'; readonly message: string };

function whole(name: string, value: string, min: number, max: number): number | string {
  if (!/^\d+$/.test(value) || Number(value) < min || Number(value) > max) return `option ${name} needs a whole number from ${min} to ${max}, got '${value}'`;
  return Number(value);
}

/** Parses the arguments that follow the word `report`. Pure: a result or a one-line message. */
export function parseReportArgs(args: readonly string[]): Parsed {
  const files: string[] = [];
  const kernels: string[] = [];
  const values = new Map<string, string>();
  for (let i = 0; i < args.length; i++) {
    const arg = args[i];
    if (arg === '--') {
      files.push(...args.slice(i + 1));
      break;
    }
    if (arg === '-h' || arg === '--help') return { kind: 'help' };
    if (arg === '-' || !arg.startsWith('-')) {
      files.push(arg);
      continue;
    }
    const eq = arg.startsWith('--') ? arg.indexOf('=') : -1;
    const raw = eq < 0 ? arg : arg.slice(0, eq);
    const name = aliases[raw] ?? raw;
    if (!valueOptions.has(name)) return { kind: 'error', message: `unknown option '${raw}' for report (see kernwright report --help)` };
    let value: string | undefined = eq < 0 ? undefined : arg.slice(eq + 1);
    if (value === undefined) {
      value = args[i + 1];
      i++;
    }
    if (value === undefined || value === '') return { kind: 'error', message: `option ${raw} needs a value` };
    if (name === '--kernel') kernels.push(value);
    else if (values.has(name)) return { kind: 'error', message: `option ${raw} is given twice` };
    else values.set(name, value);
  }
  if (files.length !== 1) return { kind: 'error', message: `report needs exactly one kernel file, got ${files.length}` };
  const numbers: Record<string, number | undefined> = {};
  const limits: [string, number, number][] = [['--eigenvalues', 1, 64], ['--eigenfunctions', 1, 4], ['--grid-points', 8, 200], ['--time-budget', 1, 3_600_000]];
  for (const [name, min, max] of limits) {
    const v = values.get(name);
    if (v === undefined) continue;
    const n = whole(name, v, min, max);
    if (typeof n === 'string') return { kind: 'error', message: n };
    numbers[name] = n;
  }
  return {
    kind: 'options',
    options: {
      file: files[0],
      output: values.get('--output'),
      kernels,
      eigenCount: numbers['--eigenvalues'] ?? 16,
      eigenfunctions: numbers['--eigenfunctions'] ?? 4,
      gridPoints: numbers['--grid-points'] ?? 48,
      timeBudgetMs: numbers['--time-budget'],
    },
  };
}

/** Where the report goes when -o is not given: the file's base name with .html, in the current folder. */
export function defaultReportPath(file: string): string {
  const base = path.basename(file).replace(/\.kw$/i, '');
  return `${base === '' ? 'report' : base}.html`;
}

/** One line per diagnostic inside the kernel's declaration (hints left out): `line 9: error KW601 …`. */
function kernelNotes(analysis: FileAnalysis, data: KernelPictureData, index: LineIndex): string[] {
  const { start, end } = data.report.range;
  return analysis.diagnostics
    .filter((d) => d.severity !== 'hint' && d.range.start >= start && d.range.start <= end)
    .map((d) => `line ${index.position(d.range.start).line + 1}: ${d.severity} ${d.code} ${d.message.replace(/\s*[\r\n]+\s*/g, ' ')}`);
}

function summaryLine(analysis: FileAnalysis, shown: number): string {
  const count = (s: string) => analysis.diagnostics.filter((d) => d.severity === s).length;
  const e = count('error');
  const w = count('warning');
  const kernels = `${shown} kernel${shown === 1 ? '' : 's'}`;
  return `${kernels} · ${e} error${e === 1 ? '' : 's'}, ${w} warning${w === 1 ? '' : 's'}`;
}

/** The analysis options a report asks for. */
export function reportAnalysisOptions(options: ReportOptions): Partial<AnalysisOptions> {
  return { eigenCount: options.eigenCount, ...(options.timeBudgetMs !== undefined ? { timeBudgetMs: options.timeBudgetMs } : {}) };
}

export type ReportResult = { ok: true; html: string; kernels: number; figures: number } | { ok: false; message: string };

/** The HTML page of an analysis already made (so that a caller can put other reports beside it from the same data). */
export async function reportFromAnalysis(options: ReportOptions, analysis: FileAnalysis): Promise<ReportResult> {
  const all = fileKernelPictureData(analysis, { points: options.gridPoints });
  if (all.length === 0) return { ok: false, message: `'${options.file}' declares no kernel` };
  const unknown = options.kernels.filter((k) => !all.some((d) => d.report.name === k));
  if (unknown.length > 0) {
    return { ok: false, message: `'${options.file}' has no kernel named ${unknown.map((k) => `'${k}'`).join(', ')} (kernels: ${all.map((d) => d.report.name).join(', ')})` };
  }
  const chosen = options.kernels.length === 0 ? all : all.filter((d) => options.kernels.includes(d.report.name));
  const index = new LineIndex(analysis.source.text);
  const sections: KernelSection[] = [];
  for (const data of chosen) {
    sections.push(await renderKernelSection(data, { eigenfunctions: options.eigenfunctions, notes: kernelNotes(analysis, data, index) }));
  }
  const html = reportPageHtml({
    source: options.file.split(path.sep).join('/'),
    generator: `${toolName} ${toolVersion}`,
    summary: summaryLine(analysis, sections.length),
    kernels: sections,
  });
  return { ok: true, html, kernels: sections.length, figures: sections.reduce((n, s) => n + s.figures.length, 0) };
}

/** The HTML page for the options and the file's text, or a one-line reason why there is none. */
export async function buildReport(options: ReportOptions, text: string): Promise<ReportResult> {
  // The kernels the safety net stops in a worker are reported as stopped here, not analysed in this thread.
  const analysisOptions = reportAnalysisOptions(options);
  const stopped = await stoppedKernelsOf(text, analysisOptions);
  return reportFromAnalysis(options, analyzeText(text, analysisOptions, undefined, { stopped }));
}

/** Runs `kernwright report` with the arguments that follow the word `report`; resolves to the exit code. */
export async function runReportCommand(args: readonly string[], io: CliIo): Promise<number> {
  const parsed = parseReportArgs(args);
  if (parsed.kind === 'help') {
    io.out(reportUsage);
    return ExitCode.ok;
  }
  if (parsed.kind === 'error') {
    io.err(parsed.message);
    return ExitCode.usage;
  }
  const options = parsed.options;
  const read = readSource(options.file);
  if (!read.ok) {
    io.err(read.message);
    return ExitCode.usage;
  }
  const report = await buildReport(options, read.text);
  if (!report.ok) {
    io.err(report.message);
    return ExitCode.usage;
  }
  if (options.output === '-') {
    io.out(report.html);
    return ExitCode.ok;
  }
  const target = options.output ?? defaultReportPath(options.file);
  try {
    writeFileAtomically(target, report.html);
  } catch (error) {
    io.err(`cannot write the report to '${target}': ${error instanceof Error && !(error as NodeJS.ErrnoException).code ? error.message : describeFsError(error)}`);
    return ExitCode.usage;
  }
  io.out(`wrote ${target} (${report.kernels} kernel${report.kernels === 1 ? '' : 's'}, ${report.figures} figures)\n`);
  return ExitCode.ok;
}
