/**
 * `kernwright check`: find the files, read them, analyse each with the core (on several threads when that pays),
 * print the report, pick the exit code. Input problems (missing paths, empty folders, unreadable, binary, non-UTF-8
 * or huge files) are all reported before any analysis starts, and then no report is printed: the exit code is 2.
 *
 * Files are reported in file order whichever thread finished first, so a parallel run prints exactly what a
 * sequential one prints. The numerics run in worker threads under the safety net (parallel.ts): a kernel stopped
 * by it is reported as a warning (KW406 or KW407) like any other finding, and the rest of its file is analysed. On a terminal a progress line on stderr shows how far the check is.
 */
import * as path from 'node:path';
import {
  analyzeText,
  formatFileText,
  formatSummaryText,
  jsonReport,
  sarifLog,
  summarize,
  type AnalysedFile,
  type AnalysisOptions,
  type FileAnalysis,
} from '@kernwright/core';
import type { CheckOptions } from './args';
import { colourCheckLine, colourText } from './colour';
import { discoverFiles } from './discover';
import { ExitCode, exitCodeFor } from './exitCode';
import type { CliIo } from './io';
import { chooseThreads, runInWorkers, workerScript, type StoppedByJob } from './parallel';
import { createProgress } from './progress';
import { readSource } from './readSource';
import { toolName, toolVersion } from './version';

export type Analyzer = (text: string, options: Partial<AnalysisOptions>) => FileAnalysis;

interface SourceFileText {
  readonly path: string;
  readonly text: string;
}

/** Every input file's text, or the list of problems that stop the check. */
export function gatherSources(paths: readonly string[]): { sources: SourceFileText[]; problems: string[] } {
  const discovery = discoverFiles(paths);
  const problems = [...discovery.problems];
  const sources: SourceFileText[] = [];
  for (const file of discovery.files) {
    const read = readSource(file);
    if (read.ok) sources.push({ path: file, text: read.text });
    else problems.push(read.message);
  }
  return { sources, problems };
}

function errorMessage(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

/** A path for SARIF: relative to the working folder (forward slashes come from `sarifUri`). */
function sarifPath(file: string): string {
  const rel = path.relative(process.cwd(), path.resolve(file));
  return rel === '' ? file : rel;
}

export async function runCheck(options: CheckOptions, io: CliIo, analyze?: Analyzer): Promise<number> {
  const { sources, problems } = gatherSources(options.paths);
  if (problems.length > 0) {
    problems.forEach(io.err);
    return ExitCode.usage;
  }
  const analysisOptions: Partial<AnalysisOptions> = {
    numerics: options.numerics,
    ...(options.timeBudgetMs !== undefined ? { timeBudgetMs: options.timeBudgetMs } : {}),
  };
  const results: (AnalysedFile | null | undefined)[] = new Array(sources.length).fill(undefined);
  const progress = createProgress(io, sources.length);
  let printed = 0;
  let crashed = false;

  const report = (index: number, file: AnalysedFile | null, failure?: string): void => {
    results[index] = file;
    if (failure !== undefined) {
      progress.clear();
      io.err(`internal error while analysing '${sources[index].path}': ${failure} (please report this)`);
      crashed = true;
    }
    progress.tick(sources[index].path);
    // Print every file whose turn has come, in file order.
    while (printed < results.length && results[printed] !== undefined) {
      const done = results[printed++];
      if (options.format !== 'text' || !done) continue;
      const lines = formatFileText(done);
      if (lines.length === 0) continue;
      progress.clear();
      io.out(colourText(lines.join('\n'), io, colourCheckLine) + '\n');
    }
  };
  const stopped: StoppedByJob = new Map();
  const analyseHere = (index: number): void => {
    const source = sources[index];
    try {
      const earlier = stopped.get(index);
      const analysis = analyze
        ? analyze(source.text, analysisOptions)
        : analyzeText(source.text, analysisOptions, undefined, earlier ? { stopped: earlier.snapshot() } : {});
      report(index, { path: source.path, text: source.text, diagnostics: analysis.diagnostics, kernels: analysis.kernels });
    } catch (error) {
      report(index, null, errorMessage(error));
    }
  };

  // With numerics, the bundled program analyses even a single file in a worker, under the safety net (a worker
  // costs tens of milliseconds); the files a worker could not finish, and every file when the program runs from
  // its TypeScript sources or with an injected analyser, are analysed in this thread.
  const threads = chooseThreads(sources.length, options.jobs, options.numerics);
  const script = analyze === undefined && (options.numerics || threads > 1) && sources.length > 0 ? workerScript() : null;
  let leftOver = sources.map((_, k) => k);
  if (script) {
    const jobs = sources.map((s, index) => ({ index, text: s.text, options: analysisOptions }));
    leftOver = await runInWorkers(jobs, threads, script, (r) => {
      const source = sources[r.index];
      if (r.ok) report(r.index, { path: source.path, text: source.text, diagnostics: r.diagnostics, kernels: r.kernels });
      else report(r.index, null, r.message);
    }, stopped);
  }
  for (const index of leftOver) analyseHere(index);
  progress.clear();

  const analysed = results.filter((f): f is AnalysedFile => !!f);
  const summary = summarize(analysed);
  if (options.format === 'json') {
    io.out(JSON.stringify(jsonReport(analysed, { name: toolName, version: toolVersion }), null, 2) + '\n');
  } else if (options.format === 'sarif') {
    const files = analysed.map((f) => ({ ...f, path: sarifPath(f.path) }));
    io.out(JSON.stringify(sarifLog(files, { name: toolName, version: toolVersion }), null, 2) + '\n');
  } else {
    io.out(colourText(formatSummaryText(summary), io, colourCheckLine) + '\n');
  }
  return crashed ? ExitCode.usage : exitCodeFor(summary, options.failOn);
}
