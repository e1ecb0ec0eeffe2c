/**
 * `kernwright check`: find the files, read them, analyse each with the core, print the report, pick the exit code.
 * Input problems (missing paths, empty folders, unreadable, binary, non-UTF-8 or huge files) are all reported
 * before any analysis starts, and then no report is printed: the exit code is 2.
 */
import {
  analyzeText,
  analysedFile,
  formatFileText,
  formatSummaryText,
  jsonReport,
  summarize,
  type AnalysedFile,
  type AnalysisOptions,
  type FileAnalysis,
} from '@kernwright/core';
import type { CheckOptions } from './args';
import { discoverFiles } from './discover';
import { ExitCode, exitCodeFor } from './exitCode';
import type { CliIo } from './io';
import { readSource } from './readSource';
import { toolName, toolVersion } from './version';

export type Analyzer = (text: string, options: Partial<AnalysisOptions>) => FileAnalysis;

interface SourceFileText {
  readonly path: string;
  readonly text: string;
}

/** Every input file's text, or the list of problems that stop the check. */
function gatherSources(paths: readonly string[]): { sources: SourceFileText[]; problems: string[] } {
  const discovery = discoverFiles(paths);
  const problems = [...discovery.problems];
  const sources: SourceFileText[] = [];
  for (const path of discovery.files) {
    const read = readSource(path);
    if (read.ok) sources.push({ path, text: read.text });
    else problems.push(read.message);
  }
  return { sources, problems };
}

function errorMessage(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

export function runCheck(options: CheckOptions, io: CliIo, analyze: Analyzer = analyzeText): number {
  const { sources, problems } = gatherSources(options.paths);
  if (problems.length > 0) {
    problems.forEach(io.err);
    return ExitCode.usage;
  }

  const analysed: AnalysedFile[] = [];
  let crashed = false;
  for (const source of sources) {
    let file: AnalysedFile;
    try {
      file = analysedFile(source.path, analyze(source.text, { numerics: options.numerics }));
    } catch (error) {
      io.err(`internal error while analysing '${source.path}': ${errorMessage(error)} (please report this)`);
      crashed = true;
      continue;
    }
    analysed.push(file);
    if (options.format === 'text') {
      const lines = formatFileText(file);
      if (lines.length > 0) io.out(lines.join('\n') + '\n');
    }
  }

  const summary = summarize(analysed);
  if (options.format === 'json') {
    io.out(JSON.stringify(jsonReport(analysed, { name: toolName, version: toolVersion }), null, 2) + '\n');
  } else {
    io.out(formatSummaryText(summary) + '\n');
  }
  return crashed ? ExitCode.usage : exitCodeFor(summary, options.failOn);
}
