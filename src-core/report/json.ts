/**
 * The machine-readable report (format version 1): plain data, ready for `JSON.stringify`. Ranges are 0-based
 * line/character positions (LSP style); numbers are JSON numbers, and a number that is not finite becomes null.
 *
 * Each object has its own small builder (`jsonDiagnostic`, `jsonKernel`, ...) so that a new field is one line in
 * one function. Increase `jsonReportVersion` only for changes that break readers (renamed or removed fields).
 */
import type { Diagnostic, Severity } from '../diagnostics/types';
import type {
  BoundednessReport, ContinuityReport, EffectiveRankReport, Estimate, EigenEstimate, FileAnalysis, HermitianReport,
  KernelReport, NormEstimate, PositivityReport, ResolventReport,
} from '../analysis/types';
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
  /** The property checks; null (or empty) when the kernel was not analysed numerically. */
  readonly hermitian: JsonHermitian | null;
  readonly boundedness: JsonBoundedness | null;
  readonly continuity: JsonContinuity | null;
  readonly positive: JsonPositive | null;
  readonly effectiveRank: JsonEffectiveRank | null;
  readonly resolvent: readonly JsonResolvent[];
}

export interface JsonPoint {
  readonly t: number | null;
  readonly s: number | null;
}

export interface JsonComplex {
  readonly re: number | null;
  readonly im: number | null;
}

export interface JsonHermitian {
  readonly holds: boolean;
  /** ‖K − K*‖_HS / ‖K‖_HS; 0 when Hermitian by construction (method 'symbolic'). */
  readonly defect: number | null;
  /** Estimated absolute error of `defect`. */
  readonly defectError: number | null;
  readonly method: 'symbolic' | 'numeric';
  /** The point of the largest |K(t, s) − conj K(s, t)|, with both values; null when there is none. */
  readonly worst: (JsonPoint & { readonly value: JsonComplex; readonly mirrored: JsonComplex }) | null;
}

export interface JsonBoundedness {
  readonly class: 'hilbert-schmidt' | 'bounded' | 'unbounded';
  readonly exponent: number | null;
  readonly where: string | null;
}

export interface JsonContinuity {
  readonly class: 'continuous' | 'jump' | 'singular';
  readonly where: string | null;
  readonly jump: JsonEstimate | null;
  readonly jumps: readonly string[];
  readonly kinks: readonly string[];
}

export interface JsonPositive {
  readonly holds: boolean | null;
  /** The most negative eigenvalue with its error. */
  readonly minEigenvalue: JsonEstimate | null;
  readonly certificate: (JsonPoint & { readonly kind: 'diagonal' | 'minor'; readonly margin: number | null }) | null;
  readonly mercer: { readonly trace: JsonEstimate; readonly sum: JsonEstimate; readonly holds: boolean } | null;
}

export interface JsonEffectiveRank {
  readonly p90: number | null;
  readonly p99: number | null;
  readonly p999: number | null;
  readonly resolvedModes: number;
}

export interface JsonResolvent {
  readonly mu: JsonComplex;
  readonly inResolventSet: boolean | null;
  readonly distance: JsonEstimate | null;
  readonly resolventNorm: JsonEstimate | null;
  readonly neumannConverges: boolean | null;
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

function jsonComplex(z: { re: number; im: number }): JsonComplex {
  return { re: jsonNumber(z.re), im: jsonNumber(z.im) };
}

export function jsonHermitian(h: HermitianReport | null): JsonHermitian | null {
  if (!h) return null;
  const w = h.worst;
  return {
    holds: h.holds,
    defect: jsonNumber(h.defect),
    defectError: jsonNumber(h.defectError),
    method: h.method,
    worst: w ? { t: jsonNumber(w.t), s: jsonNumber(w.s), value: jsonComplex(w.value), mirrored: jsonComplex(w.mirrored) } : null,
  };
}

export function jsonBoundedness(b: BoundednessReport | null): JsonBoundedness | null {
  return b ? { class: b.class, exponent: b.exponent === null ? null : jsonNumber(b.exponent), where: b.where } : null;
}

export function jsonContinuity(c: ContinuityReport | null): JsonContinuity | null {
  return c ? { class: c.class, where: c.where, jump: jsonEstimate(c.jump), jumps: [...c.jumps], kinks: [...c.kinks] } : null;
}

export function jsonPositive(p: PositivityReport | null): JsonPositive | null {
  if (!p) return null;
  const c = p.certificate;
  return {
    holds: p.holds,
    minEigenvalue: jsonEstimate(p.minEigenvalue),
    certificate: c ? { t: jsonNumber(c.t), s: jsonNumber(c.s), kind: c.kind, margin: jsonNumber(c.margin) } : null,
    mercer: p.mercer ? { trace: jsonEstimate(p.mercer.trace)!, sum: jsonEstimate(p.mercer.sum)!, holds: p.mercer.holds } : null,
  };
}

export function jsonEffectiveRank(r: EffectiveRankReport | null): JsonEffectiveRank | null {
  return r ? { p90: r.p90, p99: r.p99, p999: r.p999, resolvedModes: r.resolvedModes } : null;
}

export function jsonResolvent(r: ResolventReport): JsonResolvent {
  return {
    mu: jsonComplex(r.mu),
    inResolventSet: r.inResolventSet,
    distance: jsonEstimate(r.distance),
    resolventNorm: jsonEstimate(r.resolventNorm),
    neumannConverges: r.neumannConverges,
  };
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
    hermitian: jsonHermitian(k.hermitian),
    boundedness: jsonBoundedness(k.boundedness),
    continuity: jsonContinuity(k.continuity),
    positive: jsonPositive(k.positive),
    effectiveRank: jsonEffectiveRank(k.effectiveRank),
    resolvent: k.resolvent.map(jsonResolvent),
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
