/**
 * Hand-made analysis results for the report tests: a small kernel file (an invented scenario) and the diagnostics
 * and kernel reports an analysis of it might return, with ranges found by searching the text.
 */
import type { Diagnostic, Severity } from '../../src-core/diagnostics/types';
import type { KernelReport, SpectrumReport } from '../../src-core/analysis/types';
import type { AnalysedFile } from '../../src-core/report/index';
import type { TextRange } from '../../src-core/syntax/textRange';

export const sampleText = [
  '# Invented scenario: a made-up lake-temperature covariance, values chosen for the test.',
  'domain [0, 2]',
  'const ell = 0.4   # km',
  'kernel lake(t, s) = exp(-abs(t - s) / elll)',
  'kernel wave(t, s) = exp(i*(t - s)) * exp(-abs(t - s))',
  '  expect hermitian',
  'kernel dry(t, s) = t * s',
  '',
].join('\n');

/** The range of the `nth` (0-based) occurrence of `needle` in `text`. */
export function rangeOf(text: string, needle: string, nth = 0): TextRange {
  let at = -1;
  for (let k = 0; k <= nth; k++) {
    at = text.indexOf(needle, at + 1);
    if (at < 0) throw new Error(`“${needle}” not found`);
  }
  return { start: at, end: at + needle.length };
}

export function diagnostic(code: string, severity: Severity, needle: string, message: string, extra: Partial<Diagnostic> = {}): Diagnostic {
  return { code, severity, range: rangeOf(sampleText, needle), message, ...extra };
}

export const spectrum: SpectrumReport = {
  eigenvalues: [
    { re: 0.7312456789, im: 0, error: 3.2e-9 },
    { re: 0.25, im: -0.125, error: 1e-6 },
  ],
  eigenfunctions: null,
  norm: { value: 0.7312456789, error: 3.2e-9, lower: 0.73124567, upper: 0.73124568 },
  hsNorm: { value: 0.81, error: 1e-8 },
  trace: { value: Infinity, error: NaN },
  method: 'Gauss–Legendre Nyström, n = 96',
  converged: true,
  elapsedMs: 12,
};

function kernel(name: string, declStart: string, spec: SpectrumReport | null, complex = false): KernelReport {
  const decl = rangeOf(sampleText, declStart);
  const lineEnd = sampleText.indexOf('\n', decl.start);
  return {
    name,
    nameRange: { start: decl.start + 'kernel '.length, end: decl.start + 'kernel '.length + name.length },
    range: { start: decl.start, end: lineEnd },
    domain: [0, 2],
    complex,
    hash: null,
    spectrum: spec,
    hermitian: null,
    boundedness: null,
    continuity: null,
    positive: null,
    effectiveRank: null,
    resolvent: [],
  };
}

export const sampleFile: AnalysedFile = {
  path: 'lakes/temperature.kw',
  text: sampleText,
  diagnostics: [
    diagnostic('KW211', 'hint', 'ell', 'Constant “ell” is never used.'),
    diagnostic('KW201', 'error', 'elll', 'Unknown name “elll”. Did you mean “ell”?', {
      related: [{ range: rangeOf(sampleText, 'ell'), message: '“ell” is declared here' }],
      figures: { distance: 1, worst: -Infinity, label: 'x', exact: true, nothing: null },
    }),
    diagnostic('KW999', 'warning', 'hermitian', 'A message\nover two lines.'),
  ],
  kernels: [
    kernel('lake', 'kernel lake', null),
    kernel('wave', 'kernel wave', spectrum, true),
    kernel('dry', 'kernel dry', { ...spectrum, eigenvalues: [], norm: null, hsNorm: null, trace: null, converged: false }),
  ],
};
