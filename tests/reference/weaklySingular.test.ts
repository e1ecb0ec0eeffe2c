/**
 * Reference suite, diagonal singularities: |t − s|^(−α) for α ∈ {0.1, 0.3, 0.49, 0.51, 0.6, 0.75, 0.9, 0.99} and
 * −log|t − s| on [0, 1].
 *
 * Reference eigenvalues: tests/reference/data/weaklySingular.json, from tests/reference/scripts/weaklySingular.py
 * (python3 with numpy/scipy/mpmath; not run in CI). Two independent product-integration Nyström methods (K. E.
 * Atkinson, The Numerical Solution of Integral Equations of the Second Kind, 1997, ch. 4), in which the singular
 * factor is integrated exactly against the interpolant of the eigenfunction (Gauss–Jacobi for the power, closed
 * forms in mpmath for the logarithm, checked against mpmath.quad): A on geometric meshes with growing degree,
 * B on algebraically graded meshes with Richardson extrapolation. Each case stores A's value and an error: the
 * larger of A's last level difference and |A − B| (at most 1e-9 relative for α ≤ 0.9; see the JSON).
 *
 * Properties (common practice; R. Kress, Linear Integral Equations, 3rd ed. 2014, §2.3, from memory):
 * |t − s|^(−α) with 0 < α < 1 is integrable across the diagonal uniformly, so the operator is bounded (Schur);
 * ∫∫|K|² < ∞ iff α < 1/2, so it is Hilbert–Schmidt exactly for α < 1/2 (and for the logarithm); K is real
 * symmetric (Hermitian) and infinite on the diagonal (not continuous). Both kernels are positive: |x|^(−α) and
 * −log|x| (on an interval of length ≤ 1) are positive definite, their Fourier transforms being positive (from
 * memory); a positivity verdict may be 'undecided' but never 'fails'. For a positive self-adjoint operator
 * ‖T‖ = λ₁ (common practice). Hilbert–Schmidt norm in closed form: ∫∫_{[0,1]²} |t − s|^(−2α) = 2/((1 − 2α)(2 − 2α))
 * for α < 1/2 (integrate over the two triangles; common practice), so ‖K‖_HS is known exactly for the power cases.
 *
 * Accuracy targets (issue 12): eigenvalues to 1e-8·‖T‖ for α ≤ 1/2, 1e-6·‖T‖ for α ≤ 0.9, 1e-9·‖T‖ for the
 * logarithm, or KW401 stating the accuracy reached. Every reported error must cover the truth.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeText } from '@kernwright/core';

interface ReferenceCase {
  readonly kernel: string;
  readonly kind: 'power' | 'log';
  readonly alpha: number | null;
  readonly eigenvalues: readonly number[];
  readonly error: readonly number[];
}

const data = JSON.parse(readFileSync(join(__dirname, 'data', 'weaklySingular.json'), 'utf8')) as { cases: ReferenceCase[] };

function target(c: ReferenceCase): number | null {
  if (c.kind === 'log') return 1e-9;
  if (c.alpha! <= 0.5) return 1e-8;
  if (c.alpha! <= 0.9) return 1e-6;
  return null; // α = 0.99: no target, only honest errors
}

describe('diagonal singularities against product-integration Nyström references', () => {
  for (const c of data.cases) {
    it(c.kernel, () => {
      const r = analyzeText(`domain [0, 1]\nkernel k(t, s) = ${c.kernel}\n`);
      const k = r.kernels[0];
      const sp = k.spectrum!;
      expect(sp).not.toBeNull();
      const norm = c.eigenvalues[0];

      // Properties.
      expect(k.hermitian?.holds).toBe(true);
      expect(k.positive?.holds).not.toBe(false);
      expect(k.continuity?.class).toBe('singular');
      const hs = c.kind === 'log' || c.alpha! < 0.5;
      expect(k.boundedness?.class).toBe(hs ? 'hilbert-schmidt' : 'bounded');

      // ‖T‖ = λ₁, within the reported error and bracket.
      const ne = sp.norm!;
      expect(ne).not.toBeNull();
      expect(Math.abs(ne.value - norm)).toBeLessThanOrEqual(ne.error + c.error[0]);
      expect(ne.lower).toBeLessThanOrEqual(norm + c.error[0]);
      expect(ne.upper).toBeGreaterThanOrEqual(norm - c.error[0]);

      // Leading eigenvalues: every error covers the truth.
      const n = Math.min(sp.eigenvalues.length, c.eigenvalues.length);
      expect(n).toBeGreaterThanOrEqual(4);
      let worst = 0;
      for (let j = 0; j < n; j++) {
        const e = sp.eigenvalues[j];
        expect(Math.abs(e.im)).toBeLessThanOrEqual(e.error);
        expect(Math.abs(e.re - c.eigenvalues[j])).toBeLessThanOrEqual(e.error + c.error[j]);
        worst = Math.max(worst, e.error);
      }

      // The Hilbert–Schmidt norm, where one is reported, covers the closed form (it is close to infinite at 0.49).
      if (c.kind === 'power' && c.alpha! < 0.5 && sp.hsNorm) {
        const exact = Math.sqrt(2 / ((1 - 2 * c.alpha!) * (2 - 2 * c.alpha!)));
        expect(Math.abs(sp.hsNorm.value - exact), 'HS').toBeLessThanOrEqual(sp.hsNorm.error);
      }
      if (c.kind === 'power' && c.alpha! < 0.5) expect(sp.hsNorm, 'an HS norm for α < 1/2').not.toBeNull();

      // The class target is reached, or KW401 says what was reached (and that figure is at least the truth's).
      const tgt = target(c);
      const kw401 = r.diagnostics.find((d) => d.code === 'KW401');
      if (tgt !== null && !kw401) expect(worst / norm).toBeLessThanOrEqual(tgt);
      if (kw401) expect(sp.converged).toBe(false);
    });
  }
});
