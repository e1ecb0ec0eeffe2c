/**
 * `kernwright compare`: gather the two versions of each file (compareSources.ts), compare them with the core, print
 * the report as text, markdown or JSON, and set the exit code from the limits given on the command line.
 *
 * Exit codes: 0 no limit exceeded; 1 a limit exceeded (a flip with --fail-on-flip, a change above --max-…-change)
 * or a new version with errors; 2 bad usage or input that cannot be compared (a missing path, an unknown
 * revision, a binary or unreadable file, a file neither of whose versions parses cleanly). With exit code 2
 * nothing is printed on standard output.
 *
 * A file name may hold any character but '/' and NUL, and a newline or an escape sequence in one must not fake a line
 * of the report: in text and markdown a path with a control character (or one that starts with '"') is printed
 * quoted, with C-style escapes (`"a\nb.kw"`), and messages on standard error have their control characters
 * escaped. JSON keeps every path as it is (JSON escapes it).
 *
 * The numerical analyses run under the safety net (parallel.ts, `NetAnalyses`): a first attempt over every pair
 * collects the versions the core wants analysed numerically (parse and names run in this thread, for the kernels'
 * definitions the comparison reads), those analyses run in workers, and a second attempt compares with their
 * results. A kernel the net stops has a KW406 or KW407 in its version's analysis, and the comparison says that its
 * figures are not known.
 */
import {
  analyzeText,
  compareFileVersions,
  compareJsonReport,
  compareVerdict,
  comparison,
  formatComparisonMarkdown,
  formatComparisonText,
  type AnalysisOptions,
  type CompareAnalyzer,
  type FileAnalysis,
  type FileComparison,
} from '@kernwright/core';
import type { CompareCommandOptions } from './args';
import { colourCompareLine, colourText } from './colour';
import { gatherPairs } from './compareSources';
import { ExitCode } from './exitCode';
import type { CliIo } from './io';
import { NetAnalyses } from './parallel';
import { createProgress } from './progress';
import { toolName, toolVersion } from './version';

/**
 * C0 and C1 controls, DEL, the Unicode line and paragraph separators, and the bidirectional controls that reorder
 * what a terminal shows.
 */
const unsafeChar = /[\u0000-\u001f\u007f-\u009f\u061c\u200e\u200f\u2028\u2029\u202a-\u202e\u2066-\u2069]/u;
const unsafe = new RegExp(unsafeChar.source, 'gu');

function escapeChar(ch: string): string {
  const named: Record<string, string> = { '\n': '\\n', '\t': '\\t', '\r': '\\r' };
  const code = ch.codePointAt(0)!;
  return named[ch] ?? (code < 0x100 ? `\\x${code.toString(16).padStart(2, '0')}` : `\\u{${code.toString(16)}}`);
}

/** A message for standard error on one line, whatever the paths in it hold. */
export function escapeMessage(message: string): string {
  return message.replace(unsafe, escapeChar);
}

/** A path as the text and markdown reports show it: as it is, or quoted with escapes when it holds a control. */
export function shownPath(p: string): string {
  if (!unsafeChar.test(p) && !p.startsWith('"')) return p;
  return `"${p.replace(/[\\"]/g, (ch) => `\\${ch}`).replace(unsafe, escapeChar)}"`;
}

function errorMessage(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

/**
 * The core's analyser for compare, under the net: parse and names in this thread (the comparison needs the kernels'
 * resolved definitions, which do not cross a thread), the numerics from `net`. A numerical analysis that has not run
 * yet is answered for this attempt by the one without numerics, and remembered for `net.run`.
 */
function netAnalyser(net: NetAnalyses): CompareAnalyzer {
  const plain = new Map<string, FileAnalysis>();
  const withoutNumerics = (text: string, options: Partial<AnalysisOptions>): FileAnalysis => {
    const key = `${JSON.stringify(options)}\0${text}`;
    let analysis = plain.get(key);
    if (!analysis) plain.set(key, (analysis = analyzeText(text, { ...options, numerics: false })));
    return analysis;
  };
  return (text, options) => {
    const base = withoutNumerics(text, { ...options, numerics: false });
    if (options.numerics === false) return base;
    const result = net.peek(text, options);
    if (!result) return base;
    if (!result.ok) throw new Error(result.message);
    return { ...base, diagnostics: result.diagnostics, kernels: result.kernels };
  };
}

export async function runCompare(options: CompareCommandOptions, io: CliIo): Promise<number> {
  const { pairs, problems } = gatherPairs(options.sources);
  if (problems.length > 0) {
    problems.map(escapeMessage).forEach(io.err);
    return ExitCode.usage;
  }
  const analysis: Partial<AnalysisOptions> = {
    ...(options.timeBudgetMs !== undefined ? { timeBudgetMs: options.timeBudgetMs } : {}),
    ...(options.eigenCount !== undefined ? { eigenCount: options.eigenCount } : {}),
  };
  const net = new NetAnalyses();
  const analyse = netAnalyser(net);
  const shown = options.format === 'json' ? (p: string) => p : shownPath;
  const shownOrNull = (p: string | null) => (p === null ? null : shown(p));
  let files: FileComparison[] = [];
  let refusals: string[] = [];
  // Attempts end: the texts and options asked for are the same in every attempt, so the second finds them all.
  for (;;) {
    files = [];
    refusals = [];
    for (const pair of pairs) {
      try {
        const result = compareFileVersions(pair.old, pair.new, { analysis }, analyse);
        if (result.ok) {
          const f = result.file;
          files.push({ ...f, path: shown(pair.path), oldPath: shownOrNull(f.oldPath), newPath: shownOrNull(f.newPath) });
        } else refusals.push(result.message);
      } catch (error) {
        refusals.push(`internal error while comparing '${pair.path}': ${errorMessage(error)} (please report this)`);
      }
    }
    if (!net.pending) break;
    const pathOf = new Map(pairs.flatMap((p) => [p.old, p.new]).filter((v) => v !== null).map((v) => [v.text, v.path]));
    const progress = createProgress(io, net.pendingCount, 'comparing');
    await net.run(undefined, (text) => progress.tick(shownPath(pathOf.get(text) ?? '')));
    progress.clear();
  }
  if (refusals.length > 0) {
    refusals.map(escapeMessage).forEach(io.err);
    return ExitCode.usage;
  }
  const result = comparison(files);
  const verdict = compareVerdict(result, options.thresholds);
  switch (options.format) {
    case 'json':
      io.out(JSON.stringify(compareJsonReport(result, verdict, { name: toolName, version: toolVersion }), null, 2) + '\n');
      break;
    case 'markdown':
      io.out(formatComparisonMarkdown(result, verdict));
      break;
    case 'text':
      io.out(colourText(formatComparisonText(result, verdict), io, colourCompareLine));
      break;
  }
  return verdict.failed ? ExitCode.findings : ExitCode.ok;
}
