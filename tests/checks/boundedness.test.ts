/**
 * Boundedness: the class and the growth exponent of |K| at each kind of singularity, against the exponents written
 * in the kernels (|t − s|^(−α) grows like d^(−α) by construction) and the standard classes (common practice;
 * R. Kress, Linear Integral Equations, 3rd ed. 2014, §2.3: along a line, α < 1/2 Hilbert–Schmidt, α < 1 bounded).
 */
// Citations of books and papers in this file (authors, years, sections) are given from memory.
import { describe, expect, it } from 'vitest';
import { analyse } from './helpers';

const cases: [string, string, 'hilbert-schmidt' | 'bounded' | 'unbounded', number | null, string | null][] = [
  ['smooth', 'exp(t * s)', 'hilbert-schmidt', null, null],
  ['logarithmic', '-log(abs(t - s))', 'hilbert-schmidt', 0, 'the diagonal t = s'],
  ['quarter', 'abs(t - s)^(-0.25)', 'hilbert-schmidt', 0.25, 'the diagonal t = s'],
  ['half', 'abs(t - s)^(-0.5)', 'bounded', 0.5, 'the diagonal t = s'],
  ['three_quarters', 'abs(t - s)^(-0.75)', 'bounded', 0.75, 'the diagonal t = s'],
  ['inverse', '1 / abs(t - s)', 'unbounded', 1, 'the diagonal t = s'],
  // A rank-one kernel f(t)·g(s) is bounded on L² exactly when f and g are in L² (then ‖T‖ = ‖f‖·‖g‖; common
  // practice): |t − 0.5|^(−0.75) is not square-integrable (2 · 0.75 ≥ 1), so this operator is unbounded.
  ['edge', 'abs(t - 0.5)^(-0.75) * s', 'unbounded', 0.75, 'the line t = 0.5'],
  ['antidiagonal', 'abs(t + s - 1)^(-1.5)', 'unbounded', 1.5, 'the line t + s = 1'],
  ['corner', '(t + s)^(-0.5)', 'hilbert-schmidt', 0.5, 'the corner (t, s) = (0, 0)'],
  ['steep_corner', '(t + s)^(-1.5)', 'unbounded', 1.5, 'the corner (t, s) = (0, 0)'],
];

describe('classes and exponents', () => {
  const r = analyse(cases.map(([name, body]) => `kernel ${name}(t, s) = ${body}`).join('\n'));
  for (const [name, body, cls, exponent, where] of cases) {
    it(`${body}: ${cls}${exponent === null ? '' : `, α = ${exponent}`}`, () => {
      const b = r.kernel(name).boundedness!;
      expect(b.class).toBe(cls);
      expect(b.where).toBe(where);
      if (exponent === null) expect(b.exponent).toBeNull();
      else expect(b.exponent).toBeCloseTo(exponent, 2);
    });
  }

  it('reports no eigenvalues and no norm for unbounded kernels, and says why instead of “no spectrum”', () => {
    for (const name of ['inverse', 'edge', 'antidiagonal', 'steep_corner']) {
      expect(r.kernel(name).spectrum, name).toBeNull();
      expect(r.codes(name), name).toContain('KW510');
      expect(r.codes(name), name).not.toContain('KW402');
      expect(r.codes(name), name).not.toContain('KW401');
    }
    const message = r.diagnostics('antidiagonal').find((d) => d.code === 'KW510')!.message;
    expect(message).toContain('d^(−1.50) toward the line t + s = 1');
    expect(r.diagnostics('antidiagonal').find((d) => d.code === 'KW510')!.severity).toBe('warning');
  });

  it('keeps the spectrum of bounded kernels, singular ones included', () => {
    for (const name of ['logarithmic', 'quarter', 'half', 'three_quarters', 'corner']) expect(r.kernel(name).spectrum, name).not.toBeNull();
  });

  it('does not warn about the values on an integrable singular line (they are the singularity)', () => {
    expect(r.analysis.diagnostics.filter((d) => d.code === 'KW301')).toEqual([]);
  });
});

describe('values that are not finite where they matter', () => {
  it('still reports NaN off the singular loci, and calls the operator unbounded', () => {
    const r = analyse('kernel hole(t, s) = t < 0.5 ? 0 / 0 : 1');
    expect(r.codes('hole')).toEqual(expect.arrayContaining(['KW301', 'KW510']));
    expect(r.kernel('hole').boundedness).toMatchObject({ class: 'unbounded', exponent: null, where: null });
  });

  it('finds a singular curve that is not a straight line: 1/(t² + s² − 1/4) on the quarter circle of radius 1/2', () => {
    const r = analyse('kernel ring(t, s) = 1 / (t^2 + s^2 - 0.25)');
    const b = r.kernel('ring').boundedness!;
    expect(b.class).toBe('unbounded');
    expect(b.exponent).toBeCloseTo(1, 2);
    const at = /through t = ([\d.]+), s = ([\d.]+)/.exec(b.where!)!;
    expect(Math.hypot(Number(at[1]), Number(at[2]))).toBeCloseTo(0.5, 3);
  });
});
