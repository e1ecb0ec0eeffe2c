/**
 * The human-readable report: one line per diagnostic (`path:line:column: severity code message`, 1-based line and
 * column), one compact line per kernel that has a spectrum, and a closing summary line. Pure functions of data:
 * no terminal, no colours, no file system.
 *
 * Every figure is printed with its error estimate; the number of digits shown for a value follows its error, so
 * digits that the error makes meaningless are not printed, and the error itself is never rounded away.
 */
import type { Diagnostic } from '../diagnostics/types';
import type { EigenEstimate, KernelReport, SpectrumReport } from '../analysis/types';
import { LineIndex } from '../syntax/textRange';
import type { AnalysedFile, ReportSummary } from './json';

/** Most significant digits ever printed for a value. */
const maxDigits = 15;
/** Significant digits printed for an error estimate. */
const errorDigits = 2;

/**
 * `x` with `digits` significant digits, trailing zeros trimmed, in exponent form below 1e-4 and from 1e6 on;
 * `∞`, `-∞` and `NaN` spelt out.
 */
export function formatNumber(x: number, digits: number): string {
  if (Number.isNaN(x)) return 'NaN';
  if (!Number.isFinite(x)) return x > 0 ? '∞' : '-∞';
  if (x === 0) return '0';
  const d = Math.max(1, Math.min(maxDigits, Math.round(digits)));
  const a = Math.abs(x);
  const written = a < 1e-4 || a >= 1e6 ? x.toExponential(d - 1) : x.toPrecision(d);
  const [mantissa, exponent] = written.split('e');
  const trimmed = mantissa.includes('.') ? mantissa.replace(/\.?0+$/, '') : mantissa;
  return exponent === undefined ? trimmed : `${trimmed}e${exponent.replace('+', '')}`;
}

/**
 * How many significant digits of a value of size `magnitude` are worth printing when its absolute error is `error`:
 * down to the leading digit of the error, plus one guard digit.
 */
export function digitsFor(magnitude: number, error: number): number {
  const m = Math.abs(magnitude);
  if (!Number.isFinite(m) || m === 0) return 4;
  if (!Number.isFinite(error) || Number.isNaN(error)) return 4;
  if (error <= 0) return maxDigits;
  const d = Math.floor(Math.log10(m)) - Math.floor(Math.log10(error)) + 2;
  return Math.max(2, Math.min(maxDigits, d));
}

/** `value ± error`, e.g. `0.10132 ± 2.4e-9`. */
export function formatEstimate(value: number, error: number): string {
  const e = Number.isNaN(error) ? '?' : formatNumber(error, errorDigits);
  return `${formatNumber(value, digitsFor(value, error))} ± ${e}`;
}

/**
 * An eigenvalue with its error: `re ± error` when the imaginary part is zero or within the error, otherwise
 * `re + im·i ± error` (both parts to the digits the error allows).
 */
export function formatEigenvalue(ev: EigenEstimate): string {
  if (ev.im === 0 || Math.abs(ev.im) <= ev.error) return formatEstimate(ev.re, ev.error);
  const digits = digitsFor(Math.max(Math.abs(ev.re), Math.abs(ev.im)), ev.error);
  const reDigits = Math.max(1, digits - magnitudeGap(ev.re, ev.im));
  const imDigits = Math.max(1, digits - magnitudeGap(ev.im, ev.re));
  const sign = ev.im < 0 ? '-' : '+';
  const e = Number.isNaN(ev.error) ? '?' : formatNumber(ev.error, errorDigits);
  return `${formatNumber(ev.re, reDigits)} ${sign} ${formatNumber(Math.abs(ev.im), imDigits)}i ± ${e}`;
}

/** How many decades `x` lies below `other` (0 when it is not smaller). */
function magnitudeGap(x: number, other: number): number {
  const a = Math.abs(x);
  const b = Math.abs(other);
  if (a === 0 || b === 0 || !Number.isFinite(a) || !Number.isFinite(b) || a >= b) return 0;
  return Math.floor(Math.log10(b)) - Math.floor(Math.log10(a));
}

/** `path:line:column: severity code message`, with 1-based line and column; the message kept on one line. */
export function formatDiagnosticLine(path: string, diagnostic: Diagnostic, index: LineIndex): string {
  const at = index.position(diagnostic.range.start);
  const message = diagnostic.message.replace(/\s*[\r\n]+\s*/g, ' ');
  return `${path}:${at.line + 1}:${at.character + 1}: ${diagnostic.severity} ${diagnostic.code} ${message}`;
}

/** The figures of a spectrum, each with its error: operator norm and leading eigenvalue. */
export function formatSpectrumFigures(spectrum: SpectrumReport): string {
  const parts: string[] = [];
  parts.push(spectrum.norm ? `norm ${formatEstimate(spectrum.norm.value, spectrum.norm.error)}` : 'norm unknown');
  const lead = spectrum.eigenvalues[0];
  parts.push(lead ? `λ₁ ${formatEigenvalue(lead)}` : spectrum.quasinilpotent ? 'no nonzero eigenvalues (σ(T) = {0}, Volterra type)' : 'no eigenvalues');
  return parts.join(', ');
}

/**
 * The property checks in a few words, e.g. `Hermitian, positive semidefinite, continuous, Hilbert–Schmidt,
 * 90/99/99.9 % of the trace in 2/2/3 modes`; empty when the checks did not run.
 */
export function formatProperties(kernel: KernelReport): string {
  const parts: string[] = [];
  const h = kernel.hermitian;
  if (h) parts.push(h.holds ? 'Hermitian' : `not Hermitian (defect ${formatEstimate(h.defect, h.defectError)})`);
  const p = kernel.positive;
  if (p && h?.holds && p.holds !== null) {
    const m = p.minEigenvalue;
    parts.push(p.holds ? 'positive semidefinite' : `not positive${m ? ` (λmin ${formatEstimate(m.value, m.error)})` : ''}`);
  }
  const c = kernel.continuity;
  if (c) parts.push(c.class === 'continuous' ? 'continuous' : c.class === 'jump' ? `jumps across ${c.where ?? 'a curve'}` : `singular on ${c.where ?? 'a set'}`);
  const b = kernel.boundedness;
  if (b) {
    parts.push(b.undecided?.property === 'bounded' ? 'boundedness undecided'
      : b.undecided ? 'bounded, Hilbert–Schmidt undecided'
        : b.class === 'hilbert-schmidt' ? 'Hilbert–Schmidt' : b.class === 'bounded' ? 'bounded, not Hilbert–Schmidt' : 'unbounded');
  }
  const r = kernel.effectiveRank;
  if (r) {
    const show = (x: number | null) => (x === null ? `>${r.resolvedModes}` : String(x));
    parts.push(`90/99/99.9 % of the trace in ${show(r.p90)}/${show(r.p99)}/${show(r.p999)} modes`);
  }
  return parts.join(', ');
}

/**
 * `path:line: kernel name on [a, b]: norm … ± …, λ₁ … ± …; properties (method)` for a kernel with a spectrum; null
 * when the kernel was not analysed numerically.
 */
export function formatKernelLine(path: string, kernel: KernelReport, index: LineIndex): string | null {
  const spectrum = kernel.spectrum;
  const line = index.position(kernel.range.start).line + 1;
  const domain = kernel.domain ? ` on [${formatNumber(kernel.domain[0], maxDigits)}, ${formatNumber(kernel.domain[1], maxDigits)}]` : '';
  if (!spectrum) {
    // No figures because boundedness is open: say so, with what is known (an unbounded kernel has its KW510).
    const open = kernel.boundedness?.undecided;
    if (open?.property !== 'bounded') return null;
    return `${path}:${line}: kernel ${kernel.name}${domain}: no figures, boundedness undecided (${open.reason}); ${formatProperties(kernel)}`;
  }
  const notes = [spectrum.method, ...(spectrum.converged ? [] : ['accuracy target not reached'])].filter((n) => n.length > 0);
  const tail = notes.length > 0 ? ` (${notes.join('; ')})` : '';
  const properties = formatProperties(kernel);
  return `${path}:${line}: kernel ${kernel.name}${domain}: ${formatSpectrumFigures(spectrum)}${properties ? `; ${properties}` : ''}${tail}`;
}

/** All lines of one file: its diagnostics in order, then one line per kernel with a spectrum. */
export function formatFileText(file: AnalysedFile): string[] {
  const index = new LineIndex(file.text);
  const lines = file.diagnostics.map((d) => formatDiagnosticLine(file.path, d, index));
  for (const kernel of file.kernels) {
    const line = formatKernelLine(file.path, kernel, index);
    if (line !== null) lines.push(line);
  }
  return lines;
}

function count(n: number, singular: string, plural: string): string {
  return `${n} ${n === 1 ? singular : plural}`;
}

/** `checked 3 files: 2 errors, 4 warnings, 1 info, 5 hints` */
export function formatSummaryText(summary: ReportSummary): string {
  return (
    `checked ${count(summary.files, 'file', 'files')}: ` +
    [
      count(summary.errors, 'error', 'errors'),
      count(summary.warnings, 'warning', 'warnings'),
      count(summary.infos, 'info', 'infos'),
      count(summary.hints, 'hint', 'hints'),
    ].join(', ')
  );
}
