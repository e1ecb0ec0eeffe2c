import { describe, expect, it } from 'vitest';
import {
  digitsFor,
  formatDiagnosticLine,
  formatEigenvalue,
  formatEstimate,
  formatFileText,
  formatKernelLine,
  formatNumber,
  formatProperties,
  formatSummaryText,
  summarize,
} from '../../src-core/report/index';
import { LineIndex } from '../../src-core/syntax/textRange';
import { sampleFile, sampleText } from './reportData';

describe('formatNumber', () => {
  const cases: [number, number, string][] = [
    [0.5, 4, '0.5'],
    [1 / 3, 4, '0.3333'],
    [2, 15, '2'],
    [123456, 3, '1.23e5'],
    [2.5e6, 4, '2.5e6'],
    [1e-6, 2, '1e-6'],
    [0.00012, 2, '0.00012'],
    [3.2e-9, 2, '3.2e-9'],
    [1e-10, 2, '1e-10'],
    [-0.000125, 2, '-0.00013'],
    [0, 5, '0'],
    [Infinity, 3, '∞'],
    [-Infinity, 3, '-∞'],
    [NaN, 3, 'NaN'],
  ];
  for (const [x, digits, expected] of cases) {
    it(`${x} with ${digits} digits → ${expected}`, () => expect(formatNumber(x, digits)).toBe(expected));
  }
});

describe('digitsFor', () => {
  it('prints down to the leading digit of the error plus a guard digit', () => {
    expect(digitsFor(0.7312456789, 3.2e-9)).toBe(10); // 0.7312456789: last digit at 1e-10
    expect(digitsFor(12.5, 0.3)).toBe(4); // 12.50
  });
  it('keeps at least two digits even when the error exceeds the value', () => {
    expect(digitsFor(0.01, 5)).toBe(2);
  });
  it('prints every digit when the error is exactly zero', () => {
    expect(digitsFor(1 / 3, 0)).toBe(15);
  });
});

describe('formatEstimate and formatEigenvalue', () => {
  it('shows the value to the precision its error allows, and the error with two digits', () => {
    expect(formatEstimate(0.7312456789, 3.2e-9)).toBe('0.7312456789 ± 3.2e-9');
    expect(formatEstimate(0.10132118364233778, 2.47e-11)).toBe('0.101321183642 ± 2.5e-11');
  });
  it('never drops the error, even when it is not finite', () => {
    expect(formatEstimate(Infinity, NaN)).toBe('∞ ± ?');
    expect(formatEstimate(1.5, Infinity)).toBe('1.5 ± ∞');
  });
  it('leaves out an imaginary part that lies within the error', () => {
    expect(formatEigenvalue({ re: 0.5, im: 1e-12, error: 1e-9 })).toBe('0.5 ± 1e-9');
  });
  it('writes a complex eigenvalue as re ± im i with its error', () => {
    expect(formatEigenvalue({ re: 0.25, im: -0.125, error: 1e-6 })).toBe('0.25 - 0.125i ± 1e-6');
    expect(formatEigenvalue({ re: -1, im: 2, error: 0.01 })).toBe('-1 + 2i ± 0.01');
  });
});

describe('formatDiagnosticLine', () => {
  const index = new LineIndex(sampleText);
  it('gives path:line:column with 1-based line and column, then severity, code and message', () => {
    const line = formatDiagnosticLine('a.kw', sampleFile.diagnostics[1], index);
    const column = 'kernel lake(t, s) = exp(-abs(t - s) / '.length + 1;
    expect(line).toBe(`a.kw:4:${column}: error KW201 Unknown name “elll”. Did you mean “ell”?`);
  });
  it('keeps a multi-line message on one line', () => {
    const line = formatDiagnosticLine('a.kw', sampleFile.diagnostics[2], index);
    expect(line).toBe('a.kw:6:10: warning KW999 A message over two lines.');
  });
});

describe('formatKernelLine', () => {
  const index = new LineIndex(sampleText);
  it('is null for a kernel without a spectrum', () => {
    expect(formatKernelLine('a.kw', sampleFile.kernels[0], index)).toBeNull();
  });
  it('summarises norm and leading eigenvalue, each with its error, and names the method', () => {
    expect(formatKernelLine('a.kw', sampleFile.kernels[1], index)).toBe(
      'a.kw:5: kernel wave on [0, 2]: norm 0.7312456789 ± 3.2e-9, λ₁ 0.7312456789 ± 3.2e-9 (Gauss–Legendre Nyström, n = 96)',
    );
  });
  it('says when figures are missing and when the accuracy target was not reached', () => {
    const line = formatKernelLine('a.kw', sampleFile.kernels[2], index);
    expect(line).toBe('a.kw:7: kernel dry on [0, 2]: norm unknown, no eigenvalues (Gauss–Legendre Nyström, n = 96; accuracy target not reached)');
  });
});

describe('formatProperties', () => {
  const index = new LineIndex(sampleText);
  const wave = sampleFile.kernels[1];
  it('is empty when the checks did not run', () => expect(formatProperties(wave)).toBe(''));
  it('names each property in a few words, the minimum eigenvalue with its error', () => {
    const judged = {
      ...wave,
      hermitian: { holds: true, defect: 0, defectError: 0, method: 'symbolic' as const, worst: null },
      positive: { holds: false, minEigenvalue: { value: -0.25, error: 3e-10 }, certificate: null, mercer: null },
      continuity: { class: 'jump' as const, where: 'the diagonal t = s', jump: { value: 2, error: 1e-15 }, jumps: ['the diagonal t = s'], kinks: [] },
      boundedness: { class: 'bounded' as const, exponent: 0.5, where: 'the diagonal t = s' },
    };
    expect(formatProperties(judged)).toBe('Hermitian, not positive (λmin -0.25 ± 3e-10), jumps across the diagonal t = s, bounded, not Hilbert–Schmidt');
    expect(formatKernelLine('a.kw', judged, index)).toBe(
      'a.kw:5: kernel wave on [0, 2]: norm 0.7312456789 ± 3.2e-9, λ₁ 0.7312456789 ± 3.2e-9; Hermitian, not positive (λmin -0.25 ± 3e-10), '
      + 'jumps across the diagonal t = s, bounded, not Hilbert–Schmidt (Gauss–Legendre Nyström, n = 96)',
    );
  });
  it('gives the effective rank, with “>” for counts beyond the resolved modes', () => {
    const positive = {
      ...wave,
      hermitian: { holds: true, defect: 0, defectError: 0, method: 'symbolic' as const, worst: null },
      positive: { holds: true, minEigenvalue: { value: 1e-6, error: 4e-7 }, certificate: null, mercer: null },
      effectiveRank: { p90: 2, p99: 21, p999: null, resolvedModes: 24 },
    };
    expect(formatProperties(positive)).toBe('Hermitian, positive semidefinite, 90/99/99.9 % of the trace in 2/21/>24 modes');
  });
});

describe('formatFileText', () => {
  it('lists the diagnostics in order, then the kernels that have a spectrum', () => {
    const lines = formatFileText(sampleFile);
    expect(lines).toHaveLength(5);
    expect(lines.slice(0, 3).map((l) => l.split(' ')[2])).toEqual(['KW211', 'KW201', 'KW999']);
    expect(lines[3]).toMatch(/^lakes\/temperature\.kw:5: kernel wave /);
    expect(lines[4]).toMatch(/^lakes\/temperature\.kw:7: kernel dry /);
    for (const line of lines) expect(line.startsWith('lakes/temperature.kw:')).toBe(true);
  });
  it('prints nothing for a clean file without spectra', () => {
    expect(formatFileText({ path: 'x.kw', text: '', diagnostics: [], kernels: [] })).toEqual([]);
  });
});

describe('formatSummaryText', () => {
  it('counts files and each severity, with singular and plural words', () => {
    const summary = summarize([sampleFile, sampleFile]);
    expect(summary).toEqual({ files: 2, errors: 2, warnings: 2, infos: 0, hints: 2 });
    expect(formatSummaryText(summary)).toBe('checked 2 files: 2 errors, 2 warnings, 0 infos, 2 hints');
    expect(formatSummaryText({ files: 1, errors: 1, warnings: 1, infos: 1, hints: 1 })).toBe(
      'checked 1 file: 1 error, 1 warning, 1 info, 1 hint',
    );
  });
});
