/**
 * The symmetrize fix: the new body parses, re-analyses as Hermitian, equals the Hermitian part of the old kernel
 * pointwise, and its spectrum matches the spectrum of the discretised Hermitian part (A + Aᴴ)/2 built from the old
 * kernel's finest Galerkin matrix, an independent route to the same operator.
 */
import { describe, expect, it } from 'vitest';
import { analyzeText, bindFile, defaultAnalysisOptions, parse, type Fix } from '@kernwright/core';
import { compileKernel } from '../../src-core/semantics/evaluator';
import { runSpectralEngine } from '../../src-core/numerics/engine/spectralEngine';
import { hermitianEigen } from '../../src-core/numerics/linalg';
import { seededUniform } from '../../src-core/numerics/linalg/seededRandom';
import { applyFix } from './helpers';

const options = { timeBudgetMs: 5000 };

function symmetrizeFixOf(text: string): Fix {
  const d = analyzeText(text, options).diagnostics.find((x) => x.code === 'KW501' || x.code === 'KW601');
  const fix = d?.fixes?.find((f) => f.kind === 'symmetrize');
  if (!fix) throw new Error('no symmetrize fix');
  return fix;
}

function compiled(text: string, name = 'k') {
  const k = bindFile(parse(text)).kernels.find((q) => q.name === name)!;
  return { k, f: compileKernel(k.ir!) };
}

function at(f: ReturnType<typeof compileKernel>, t: number, s: number): [number, number] {
  const re = new Float64Array(1);
  const im = new Float64Array(1);
  f.evaluateColumns([Float64Array.of(t), Float64Array.of(s)], re, f.complex ? im : null);
  return [re[0], f.complex ? im[0] : 0];
}

/**
 * Eigenvalues of (A + Aᴴ)/2 for the old kernel's finest Galerkin matrix, by decreasing modulus, and how accurate
 * that matrix is: the relative accuracy the engine reached for the old kernel, times its norm.
 */
function discretisedHermitianPart(text: string): { values: number[]; accuracy: number } {
  const { k } = compiled(text);
  const r = runSpectralEngine(k.name, k.ir!, [k.domain!.a, k.domain!.b], { ...defaultAnalysisOptions, ...options });
  const { n, re, im } = r.finest!.matrix;
  const hr = new Float64Array(n * n);
  const hi = im ? new Float64Array(n * n) : null;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      hr[i * n + j] = 0.5 * (re[i * n + j] + re[j * n + i]);
      if (hi && im) hi[i * n + j] = 0.5 * (im[i * n + j] - im[j * n + i]);
    }
  }
  const values = Array.from(hermitianEigen(hr, hi, n).values).sort((x, y) => Math.abs(y) - Math.abs(x));
  return { values, accuracy: r.reached * r.spectrum!.norm!.value };
}

const cases: [string, string][] = [
  ['real polynomial', 'kernel k(t, s) = t * s^2'],
  ['real exponential', 'kernel k(t, s) = exp(t - 2 * s)'],
  ['shifted kink', 'kernel k(t, s) = exp(-abs(t - s - 0.3))'],
  ['complex', 'kernel k(t, s) = exp(i * (t + 2 * s)) * (1 + t)'],
  ['with a helper, a constant and other variable names', 'const w = 0.5\nfn bump(x) = exp(-x^2)\nkernel k(x, y) = bump(x - w * y) * (1 + x)'],
];

describe('symmetrize', () => {
  for (const [label, body] of cases) {
    it(label, () => {
      const before = `domain [0, 1]\n${body}\n`;
      const fix = symmetrizeFixOf(before);
      expect(fix.edits).toHaveLength(1);
      const after = applyFix(before, fix);
      expect(parse(after).diagnostics).toEqual([]);

      const analysis = analyzeText(after, options);
      expect(analysis.diagnostics.filter((d) => d.severity === 'error').map((d) => d.message)).toEqual([]);
      const k = analysis.kernels.find((q) => q.name === 'k')!;
      expect(k.hermitian!.holds).toBe(true);
      expect(analysis.diagnostics.map((d) => d.code)).not.toContain('KW501');

      // Pointwise: the new kernel is (K(t, s) + conj K(s, t)) / 2 of the old one, which is its own Hermitian part.
      const old = compiled(before).f;
      const now = compiled(after).f;
      const random = seededUniform(7);
      for (let n = 0; n < 20; n++) {
        const t = random();
        const s = random();
        const [ar, ai] = at(old, t, s);
        const [br, bi] = at(old, s, t);
        const [cr, ci] = at(now, t, s);
        expect(cr).toBeCloseTo(0.5 * (ar + br), 13);
        expect(ci).toBeCloseTo(0.5 * (ai - bi), 13);
      }

      // Spectrum: against the discretised Hermitian part of the old kernel.
      // Both sides carry their discretisation errors (the old kernel's may be the larger: a kernel that is not
      // Hermitian converges more slowly, here with the kink off the diagonal).
      const reference = discretisedHermitianPart(before);
      for (const [i, e] of k.spectrum!.eigenvalues.slice(0, 4).entries()) {
        expect(e.im).toBe(0);
        const allowed = Math.max(10 * e.error, 1e-10 * Math.abs(reference.values[0])) + 10 * reference.accuracy;
        expect(Math.abs(e.re - reference.values[i]), `λ${i + 1}`).toBeLessThanOrEqual(allowed);
      }
    }, 120_000);
  }

  it('t·s² becomes (t·s² + s·t²)/2, with eigenvalues 1/8 ± (1/60)^½ (by hand from the 2 × 2 degenerate matrix)', () => {
    // (t s² + s t²)/2 = f₁(t)g₁(s) + f₂(t)g₂(s) with f = (t/2, t²/2), g = (s², s): M_ij = ∫ g_i f_j = [[1/8, 1/10], [1/6, 1/8]].
    const before = 'domain [0, 1]\nkernel k(t, s) = t * s^2\n';
    const fix = symmetrizeFixOf(before);
    expect(fix.edits[0].newText).toBe('(t * s ^ 2 + s * t ^ 2) / 2');
    const eig = analyzeText(applyFix(before, fix), options).kernels[0].spectrum!.eigenvalues.map((e) => e.re);
    expect(eig[0]).toBeCloseTo(1 / 8 + Math.sqrt(1 / 60), 13);
    expect(eig[1]).toBeCloseTo(1 / 8 - Math.sqrt(1 / 60), 13);
  });

  it('writes a complex kernel’s mirror image with conj, a real one without', () => {
    expect(symmetrizeFixOf('domain [0, 1]\nkernel k(t, s) = exp(i * (t + 2 * s))\n').edits[0].newText).toBe('(exp(i * (t + 2 * s)) + conj(exp(i * (s + 2 * t)))) / 2');
    expect(symmetrizeFixOf('domain [0, 1]\nkernel k(x, y) = exp(x - 2 * y)\n').edits[0].newText).toBe('(exp(x - 2 * y) + exp(y - 2 * x)) / 2');
  });

  it('takes the mathjs simplification when it is shorter and checks out: (2ts + t − s + 2st + s − t)/2 = 2ts', () => {
    const fix = symmetrizeFixOf('domain [0, 1]\nkernel k(t, s) = 2 * t * s + t - s\n');
    expect(fix.edits[0].newText).toBe('2 * t * s');
  });

  it('keeps the plain form when mathjs cannot take the expression (a conditional)', () => {
    const fix = symmetrizeFixOf('domain [0, 1]\nkernel k(t, s) = t < s ? 1 : 2\n');
    expect(fix.edits[0].newText).toBe('((t < s ? 1 : 2) + (s < t ? 1 : 2)) / 2');
  });
});
