/**
 * `kernwright export <file> [--kernel <name>] --format json|csv|npy [-o <file or folder>]`: the discretisation of one
 * kernel (src-core/report/exportData.ts) written for use elsewhere.
 *
 * json prints one document on standard output, or writes it to -o FILE (into -o FOLDER as KERNEL.json). csv and npy
 * write one file per array and a manifest.json into the folder -o FOLDER. Writing is all or nothing: the files go to
 * a temporary folder beside the target first and are moved into place only when all of them are written.
 *
 * Exit codes: 0 written; 1 the kernel has nothing to export (errors in its definition, an operator that is not
 * bounded, or an analysis the safety net stopped), nothing written; 2 bad usage, unreadable input, or output that cannot be written.
 */
import * as crypto from 'node:crypto';
import * as fs from 'node:fs';
import * as path from 'node:path';
import {
  analyzeText,
  catalogue,
  exportCsvFiles,
  exportJsonDocument,
  exportKernelData,
  exportNpyFiles,
  type AnalysisOptions,
  type Diagnostic,
  type ExportFile,
  type FileAnalysis,
  type StopReason,
} from '@kernwright/core';
import type { ExportOptions } from './args';
import { ExitCode } from './exitCode';
import { describeFsError } from './fsErrors';
import type { CliIo } from './io';
import { stoppedKernelsOf } from './parallel';
import { readSource } from './readSource';
import { toolName, toolVersion } from './version';

class OutputError extends Error {}

function failure(error: unknown): string {
  if (error instanceof OutputError) return error.message;
  return describeFsError(error);
}

/** Writes every file into a fresh folder beside `target`, then moves them into `target` (created if missing). */
export function writeFolder(target: string, files: readonly ExportFile[]): void {
  const parent = path.dirname(path.resolve(target));
  if (!fs.existsSync(parent)) throw new OutputError(`the folder '${path.dirname(target)}' does not exist`);
  const exists = fs.existsSync(target);
  if (exists && !fs.statSync(target).isDirectory()) throw new OutputError(`'${target}' exists and is not a folder`);
  const staging = fs.mkdtempSync(path.join(parent, `.${path.basename(path.resolve(target))}.kwexport-`));
  try {
    for (const f of files) fs.writeFileSync(path.join(staging, f.name), f.content);
    if (!exists) {
      fs.renameSync(staging, target);
      return;
    }
    for (const f of files) fs.renameSync(path.join(staging, f.name), path.join(target, f.name));
  } finally {
    fs.rmSync(staging, { recursive: true, force: true });
  }
}

/** Writes one file through a temporary file in the same folder and a rename. */
export function writeFileAtomically(target: string, content: string): void {
  const dir = path.dirname(path.resolve(target));
  if (!fs.existsSync(dir)) throw new OutputError(`the folder '${path.dirname(target)}' does not exist`);
  const tmp = path.join(dir, `.${path.basename(target)}.${process.pid}.${crypto.randomBytes(4).toString('hex')}.tmp`);
  try {
    fs.writeFileSync(tmp, content, { flag: 'wx' });
    fs.renameSync(tmp, target);
  } finally {
    fs.rmSync(tmp, { force: true });
  }
}

const stoppedCodes = new Set<string>([catalogue['analysis-stopped'].code, catalogue['analysis-out-of-memory'].code]);

/** The diagnostic saying that the safety net stopped kernel `name`, when it did (its figures are not known then). */
function stoppedDiagnostic(analysis: FileAnalysis, name: string, stopped: ReadonlyMap<string, StopReason>): Diagnostic | undefined {
  const symbol = analysis.model.kernels.find((k) => k.name === name && k.hash !== null && stopped.has(k.hash));
  if (!symbol) return undefined;
  return analysis.diagnostics.find((d) => stoppedCodes.has(d.code) && d.range.start === symbol.nameRange.start);
}

export async function runExport(options: ExportOptions, io: CliIo): Promise<number> {
  const read = readSource(options.file);
  if (!read.ok) {
    io.err(read.message);
    return ExitCode.usage;
  }
  const analysisOptions: Partial<AnalysisOptions> = {
    ...(options.timeBudgetMs !== undefined ? { timeBudgetMs: options.timeBudgetMs } : {}),
    ...(options.eigenCount !== undefined ? { eigenCount: options.eigenCount } : {}),
    ...(options.gridPoints !== undefined ? { gridPoints: options.gridPoints } : {}),
  };
  // The kernels the safety net stops in a worker are reported as stopped here, not analysed in this thread.
  const stopped = await stoppedKernelsOf(read.text, analysisOptions);
  const analysis = analyzeText(read.text, analysisOptions, undefined, { stopped });
  const names = analysis.kernels.map((k) => k.name);
  if (names.length === 0) {
    io.err(`'${options.file}' declares no kernel`);
    return ExitCode.usage;
  }
  const name = options.kernel ?? (names.length === 1 ? names[0] : undefined);
  if (name === undefined) {
    io.err(`'${options.file}' declares ${names.length} kernels (${names.join(', ')}): choose one with --kernel`);
    return ExitCode.usage;
  }
  if (!names.includes(name)) {
    io.err(`'${options.file}' has no kernel named '${name}' (kernels: ${names.join(', ')})`);
    return ExitCode.usage;
  }
  const stoppedNote = stoppedDiagnostic(analysis, name, stopped);
  if (stoppedNote) {
    io.err(`nothing exported from '${options.file}': ${stoppedNote.message}`);
    return ExitCode.findings;
  }
  const exported = exportKernelData(analysis, name, analysisOptions);
  if (!exported.ok) {
    io.err(`nothing exported from '${options.file}': ${exported.message}`);
    return ExitCode.findings;
  }
  const tool = { name: toolName, version: toolVersion };
  const source = options.file.split(path.sep).join('/');
  try {
    if (options.format === 'json') {
      const doc = exportJsonDocument(exported.data, tool, source);
      if (options.output === undefined) {
        io.out(doc);
        return ExitCode.ok;
      }
      const target = fs.existsSync(options.output) && fs.statSync(options.output).isDirectory()
        ? path.join(options.output, `${name}.json`)
        : options.output;
      writeFileAtomically(target, doc);
      io.out(`wrote ${target}\n`);
      return ExitCode.ok;
    }
    const files = options.format === 'csv' ? exportCsvFiles(exported.data, tool, source) : exportNpyFiles(exported.data, tool, source);
    writeFolder(options.output!, files);
    io.out(`wrote ${files.length} files to ${options.output}\n`);
    return ExitCode.ok;
  } catch (error) {
    io.err(`cannot write the export of '${name}': ${failure(error)}`);
    return ExitCode.usage;
  }
}
