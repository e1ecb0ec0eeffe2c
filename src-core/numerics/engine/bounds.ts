/**
 * Figures that bracket and complement the spectrum, each with an error estimate:
 *  - Schur's test: ‖T‖ ≤ (sup_t ∫|K(t, s)| ds · sup_s ∫|K(t, s)| dt)^½ (I. Schur 1911; P. R. Halmos & V. S. Sunder,
 *    Bounded Integral Operators on L² Spaces, 1978, Thm 5.2). The suprema are taken over a sample of points refined
 *    near the largest value, so the bound is a numerical estimate, not a certificate.
 *  - the trace ∫ K(t, t) dt (for a continuous positive kernel it equals the sum of the eigenvalues: Mercer's theorem;
 *    F. Riesz & B. Sz.-Nagy, Functional Analysis, 1955, §98).
 */
import { integrateAdaptiveArray } from '../quadrature';
import type { CompiledKernel } from '../../semantics/evaluator';
import type { CancellationToken } from '../../util/cancellation';
import type { Estimate } from '../../analysis/types';
import type { Locus } from './loci';

/** Points in (lo, hi) where a locus crosses the line through the square with the other variable fixed at x. */
function crossings(loci: readonly Locus[], fixedIsT: boolean, x: number, lo: number, hi: number): number[] {
  const out: number[] = [];
  for (const { line } of loci) {
    const coefFree = fixedIsT ? line.cs : line.ct;
    const coefFixed = fixedIsT ? line.ct : line.cs;
    if (coefFree === 0) continue;
    const y = -(coefFixed * x + line.c0) / coefFree;
    if (y > lo && y < hi) out.push(y);
  }
  return out;
}

interface LineIntegral { value: number; error: number; ok: boolean }

function absLineIntegral(kernel: CompiledKernel, loci: readonly Locus[], fixedIsT: boolean, x: number, a: number, b: number, token?: CancellationToken): LineIntegral {
  const fixed = new Float64Array(30);
  const re = new Float64Array(30);
  const im = new Float64Array(30);
  const breaks = crossings(loci, fixedIsT, x, a, b);
  const scale = Math.max(1, Math.abs(a), Math.abs(b));
  // A node that lands on a locus to rounding sees the singular value itself: a single point, worth nothing.
  const onLocus = (y: number) => y <= a || y >= b || breaks.some((c) => Math.abs(y - c) <= 1e-13 * scale)
    || Math.abs(y - x) <= 1e-13 * scale;
  const r = integrateAdaptiveArray((xs, outRe) => {
    const n = xs.length;
    const f = n <= fixed.length ? fixed.subarray(0, n) : new Float64Array(n);
    f.fill(x);
    const kr = n <= re.length ? re.subarray(0, n) : new Float64Array(n);
    const ki = n <= im.length ? im.subarray(0, n) : new Float64Array(n);
    kernel.evaluateColumns(fixedIsT ? [f, xs] : [xs, f], kr, kernel.complex ? ki : null);
    for (let i = 0; i < n; i++) {
      const v = kernel.complex ? Math.hypot(kr[i], ki[i]) : Math.abs(kr[i]);
      outRe[i] = Number.isFinite(v) || !onLocus(xs[i]) ? v : 0;
    }
  }, a, b, { breakpoints: breaks, relTol: 1e-7, absTol: 1e-13, maxEvaluations: 4_000, token });
  return { value: r.value.re, error: r.error, ok: r.status !== 'nonFiniteValue' };
}

/** sup over x of ∫|K| along a line, sampled at Chebyshev points and refined by golden-section search near the best. */
function supLineIntegral(kernel: CompiledKernel, loci: readonly Locus[], fixedIsT: boolean, a: number, b: number, token?: CancellationToken): Estimate | null {
  const m = 17;
  let best = { x: a, value: -Infinity, error: 0 };
  const evalAt = (x: number) => absLineIntegral(kernel, loci, fixedIsT, x, a, b, token);
  const samples: { x: number; value: number }[] = [];
  for (let k = 0; k < m; k++) {
    const x = (a + b) / 2 - ((b - a) / 2) * Math.cos((Math.PI * k) / (m - 1));
    const r = evalAt(x);
    if (!r.ok || !Number.isFinite(r.value)) return null;
    samples.push({ x, value: r.value });
    if (r.value > best.value) best = { x, value: r.value, error: r.error };
  }
  // Golden-section refinement on the bracket around the best sample.
  const i = samples.findIndex((p) => p.x === best.x);
  let lo = samples[Math.max(0, i - 1)].x;
  let hi = samples[Math.min(m - 1, i + 1)].x;
  const g = (Math.sqrt(5) - 1) / 2;
  for (let it = 0; it < 12 && hi - lo > 1e-6 * (b - a); it++) {
    const x1 = hi - g * (hi - lo);
    const x2 = lo + g * (hi - lo);
    const r1 = evalAt(x1);
    const r2 = evalAt(x2);
    if (r1.value > best.value) best = { x: x1, value: r1.value, error: r1.error };
    if (r2.value > best.value) best = { x: x2, value: r2.value, error: r2.error };
    if (r1.value >= r2.value) hi = x2;
    else lo = x1;
  }
  return { value: best.value, error: best.error };
}

export function schurBound(kernel: CompiledKernel, loci: readonly Locus[], a: number, b: number, token?: CancellationToken): Estimate | null {
  const rows = supLineIntegral(kernel, loci, true, a, b, token);
  if (!rows) return null;
  const cols = supLineIntegral(kernel, loci, false, a, b, token);
  if (!cols) return null;
  const value = Math.sqrt(rows.value * cols.value);
  const rel = rows.error / Math.max(rows.value, 1e-300) + cols.error / Math.max(cols.value, 1e-300);
  return { value, error: 0.5 * rel * value };
}

/**
 * Weights of polynomial extrapolation to h = 0 from values at h = δ, 2δ, 3δ, 4δ (error O(δ⁴)) and from δ, 2δ, 3δ
 * (error O(δ³)): Lagrange interpolation evaluated at 0 (common practice; Richardson extrapolation in its
 * polynomial form, G. Dahlquist & Å. Björck, Numerical Methods in Scientific Computing, vol. 1, 2008, §3.4).
 */
const extrapolate4 = [4, -6, 4, -1] as const;
const extrapolate3 = [3, -3, 1] as const;

/**
 * ∫ K(t, t) dt; null when the diagonal values are not finite or not integrable. On a removable singularity along
 * the diagonal (sin(t − s)/(t − s) is 0/0 at t = s) K(t, t) is the limit along s → t, taken by extrapolation from
 * s = t ± kδ (k = 1…4, δ = 2^−12·(b − a), toward the inside of the square); the difference between the fourth- and
 * third-order extrapolations (which also carries the rounding of the cancelling quotient, amplified by 15 at most)
 * is added to the error.
 */
export function traceIntegral(kernel: CompiledKernel, loci: readonly Locus[], a: number, b: number, token?: CancellationToken): (Estimate & { im: number }) | null {
  const breakpoints: number[] = [];
  let removableDiagonal = false;
  for (const { line, removable } of loci) {
    const c = line.ct + line.cs;
    if (c === 0) {
      if (removable && line.c0 === 0) removableDiagonal = true;
      continue; // parallel to the diagonal (or the diagonal itself)
    }
    const t = -line.c0 / c;
    if (t > a && t < b) breakpoints.push(t);
  }
  if (!removableDiagonal) {
    const r = integrateAdaptiveArray((xs, outRe, outIm) => {
      kernel.evaluateColumns([xs, xs], outRe, kernel.complex ? outIm : null);
    }, a, b, { breakpoints, relTol: 1e-13, absTol: 1e-15, maxEvaluations: 50_000, token });
    return traceOf(r);
  }
  const delta = (b - a) * 2 ** -12;
  const limitAlongDiagonal = (weights: readonly number[]) => (xs: Float64Array, outRe: Float64Array, outIm: Float64Array) => {
    const n = xs.length;
    const ss = new Float64Array(n);
    const re = new Float64Array(n);
    const im = new Float64Array(n);
    outRe.fill(0);
    outIm.fill(0);
    weights.forEach((w, j) => {
      for (let i = 0; i < n; i++) ss[i] = xs[i] + 4 * delta <= b ? xs[i] + (j + 1) * delta : xs[i] - (j + 1) * delta;
      kernel.evaluateColumns([xs, ss], re, kernel.complex ? im : null);
      for (let i = 0; i < n; i++) {
        outRe[i] += w * re[i];
        if (kernel.complex) outIm[i] += w * im[i];
      }
    });
  };
  const options = { breakpoints, relTol: 1e-13, absTol: 1e-15, maxEvaluations: 20_000, token };
  const fourth = traceOf(integrateAdaptiveArray(limitAlongDiagonal(extrapolate4), a, b, options));
  const third = traceOf(integrateAdaptiveArray(limitAlongDiagonal(extrapolate3), a, b, options));
  if (!fourth || !third) return null;
  return { ...fourth, error: fourth.error + Math.hypot(fourth.value - third.value, fourth.im - third.im) };
}

function traceOf(r: ReturnType<typeof integrateAdaptiveArray>): (Estimate & { im: number }) | null {
  if (r.status === 'nonFiniteValue' || !Number.isFinite(r.value.re) || !Number.isFinite(r.value.im)) return null;
  if (!r.converged && r.status === 'maxEvaluations') {
    return { value: r.value.re, im: r.value.im, error: Math.max(r.error, 1e-3 * Math.abs(r.value.re)) };
  }
  return { value: r.value.re, im: r.value.im, error: Math.max(r.error, 4 * Number.EPSILON * Math.abs(r.value.re)) };
}
