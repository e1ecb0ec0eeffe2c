/**
 * `kernwright compare`: gather the two versions of each file (compareSources.ts), compare them with the core, print
 * the report as text, markdown or JSON, and set the exit code from the limits given on the command line.
 *
 * Exit codes: 0 no limit exceeded; 1 a limit exceeded (a flip with --fail-on-flip, a change above --max-…-change)
 * or a new version with errors; 2 bad usage or input that cannot be compared (a missing path, an unknown
 * revision, a binary or unreadable file, a file neither of whose versions parses cleanly). With exit code 2
 * nothing is printed on standard output.
 */
import {
  compareFileVersions,
  compareJsonReport,
  compareVerdict,
  comparison,
  formatComparisonMarkdown,
  formatComparisonText,
  type AnalysisOptions,
  type FileComparison,
} from '@kernwright/core';
import type { CompareCommandOptions } from './args';
import { colourCompareLine, colourText } from './colour';
import { gatherPairs } from './compareSources';
import { ExitCode } from './exitCode';
import type { CliIo } from './io';
import { createProgress } from './progress';
import { toolName, toolVersion } from './version';

function errorMessage(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

export async function runCompare(options: CompareCommandOptions, io: CliIo): Promise<number> {
  const { pairs, problems } = gatherPairs(options.sources);
  if (problems.length > 0) {
    problems.forEach(io.err);
    return ExitCode.usage;
  }
  const analysis: Partial<AnalysisOptions> = {
    ...(options.timeBudgetMs !== undefined ? { timeBudgetMs: options.timeBudgetMs } : {}),
    ...(options.eigenCount !== undefined ? { eigenCount: options.eigenCount } : {}),
  };
  const progress = createProgress(io, pairs.length, 'comparing');
  const files: FileComparison[] = [];
  const refusals: string[] = [];
  for (const pair of pairs) {
    try {
      const result = compareFileVersions(pair.old, pair.new, { analysis });
      if (result.ok) files.push({ ...result.file, path: pair.path });
      else refusals.push(result.message);
    } catch (error) {
      refusals.push(`internal error while comparing '${pair.path}': ${errorMessage(error)} (please report this)`);
    }
    progress.tick(pair.path);
  }
  progress.clear();
  if (refusals.length > 0) {
    refusals.forEach(io.err);
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
