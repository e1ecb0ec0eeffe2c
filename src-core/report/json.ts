/**
 * The machine-readable report (format version 1): plain data, ready for `JSON.stringify`. Ranges are 0-based
 * line/character positions (LSP style); numbers are JSON numbers, and a number that is not finite becomes null.
 *
 * Each object has its own small builder (`jsonDiagnostic`, `jsonKernel`, ...) so that a new field is one line in
 * one function. Increase `jsonReportVersion` only for changes that break readers (renamed or removed fields).
 */
import type { Diagnostic, Severity } from '../diagnostics/types';
import type { Estimate, EigenEstimate, FileAnalysis, KernelReport, NormEstimate } from '../analysis/types';
import { LineIndex, type TextRange } from '../syntax/textRange';

export const jsonReportVersion = 1;

/** One analysed file as the reports see it: where it is, its text (for line numbers) and what the analysis found. */
export interface AnalysedFile {
  readonly path: string;
  readonly text: string;
  readonly diagnostics: readonly Diagnostic[];
  readonly kernels: readonly KernelReport[];
}

export function analysedFile(path: string, analysis: FileAnalysis): AnalysedFile {
  return { path, text: analysis.source.text, diagnostics: analysis.diagnostics, kernels: analysis.kernels };
}

export interface ReportSummary {
  readonly files: number;
  readonly errors: number;
  readonly warnings: number;
  readonly infos: number;
  readonly hints: number;
}

/** How many files, and how many diagnostics of each severity they hold. */
export function summarize(files: readonly { readonly diagnostics: readonly { readonly severity: Severity }[] }[]): ReportSummary {
  const n: Record<Severity, number> = { error: 0, warning: 0, info: 0, hint: 0 };
  for (const f of files) for (const d of f.diagnostics) n[d.severity]++;
  return { files: files.length, errors: n.error, warnings: n.warning, infos: n.info, hints: n.hint };
}

// ---------- the JSON shapes ----------

export interface JsonPosition {
  readonly line: number;
  readonly character: number;
}

export interface JsonRange {
  readonly start: JsonPosition;
  readonly end: JsonPosition;
}

export interface JsonRelated {
  readonly message: string;
  readonly range: JsonRange;
}

export type JsonFigure = number | string | boolean | null;

export interface JsonDiagnostic {
  readonly code: string;
  readonly severity: Severity;
  readonly message: string;
  readonly range: JsonRange;
  readonly related: readonly JsonRelated[];
  readonly figures?: Readonly<Record<string, JsonFigure>>;
}

export interface JsonEstimate {
  readonly value: number | null;
  readonly error: number | null;
}

export interface JsonNorm extends JsonEstimate {
  readonly lower: number | null;
  readonly upper: number | null;
}

export interface JsonEigenvalue {
  readonly re: number | null;
  readonly im: number | null;
  readonly error: number | null;
}

export interface JsonKernel {
  readonly name: string;
  readonly domain: readonly [number, number] | null;
  readonly range: JsonRange;
  readonly complex: boolean;
  readonly eigenvalues: readonly JsonEigenvalue[];
  readonly norm: JsonNorm | null;
  readonly hsNorm: JsonEstimate | null;
  readonly trace: JsonEstimate | null;
  readonly method: string | null;
}

export interface JsonFile {
  readonly path: string;
  readonly diagnostics: readonly JsonDiagnostic[];
  readonly kernels: readonly JsonKernel[];
}

export interface JsonTool {
  readonly name: string;
  readonly version: string;
}

export interface JsonReport {
  readonly version: number;
  readonly tool: JsonTool;
  readonly files: readonly JsonFile[];
  readonly summary: ReportSummary;
}

// ---------- builders ----------

/** A finite number as is; NaN and ±∞ become null (JSON has no spelling for them). */
export function jsonNumber(x: number): number | null {
  return Number.isFinite(x) ? x : null;
}

export function jsonRange(r: TextRange, index: LineIndex): JsonRange {
  const lc = index.toLineColumn(r);
  return { start: { line: lc.start.line, character: lc.start.character }, end: { line: lc.end.line, character: lc.end.character } };
}

function jsonFigures(figures: Readonly<Record<string, JsonFigure>>): Record<string, JsonFigure> {
  const out: Record<string, JsonFigure> = {};
  for (const [key, value] of Object.entries(figures)) out[key] = typeof value === 'number' ? jsonNumber(value) : value;
  return out;
}

export function jsonDiagnostic(d: Diagnostic, index: LineIndex): JsonDiagnostic {
  return {
    code: d.code,
    severity: d.severity,
    message: d.message,
    range: jsonRange(d.range, index),
    related: (d.related ?? []).map((r) => ({ message: r.message, range: jsonRange(r.range, index) })),
    ...(d.figures ? { figures: jsonFigures(d.figures) } : {}),
  };
}

export function jsonEstimate(e: Estimate | null): JsonEstimate | null {
  return e ? { value: jsonNumber(e.value), error: jsonNumber(e.error) } : null;
}

export function jsonNorm(n: NormEstimate | null): JsonNorm | null {
  return n
    ? { value: jsonNumber(n.value), error: jsonNumber(n.error), lower: jsonNumber(n.lower), upper: jsonNumber(n.upper) }
    : null;
}

export function jsonEigenvalue(ev: EigenEstimate): JsonEigenvalue {
  return { re: jsonNumber(ev.re), im: jsonNumber(ev.im), error: jsonNumber(ev.error) };
}

export function jsonDomain(domain: readonly [number, number] | null): readonly [number, number] | null {
  if (!domain || !Number.isFinite(domain[0]) || !Number.isFinite(domain[1])) return null;
  return [domain[0], domain[1]];
}

/** One kernel: its declaration and, when it was analysed numerically, its spectral figures with their errors. */
export function jsonKernel(k: KernelReport, index: LineIndex): JsonKernel {
  const s = k.spectrum;
  return {
    name: k.name,
    domain: jsonDomain(k.domain),
    range: jsonRange(k.range, index),
    complex: k.complex,
    eigenvalues: s ? s.eigenvalues.map(jsonEigenvalue) : [],
    norm: jsonNorm(s?.norm ?? null),
    hsNorm: jsonEstimate(s?.hsNorm ?? null),
    trace: jsonEstimate(s?.trace ?? null),
    method: s ? s.method : null,
  };
}

export function jsonFile(file: AnalysedFile): JsonFile {
  const index = new LineIndex(file.text);
  return {
    path: file.path,
    diagnostics: file.diagnostics.map((d) => jsonDiagnostic(d, index)),
    kernels: file.kernels.map((k) => jsonKernel(k, index)),
  };
}

export function jsonReport(files: readonly AnalysedFile[], tool: JsonTool): JsonReport {
  return {
    version: jsonReportVersion,
    tool: { name: tool.name, version: tool.version },
    files: files.map(jsonFile),
    summary: summarize(files),
  };
}
