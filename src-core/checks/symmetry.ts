/**
 * The Hermitian (self-adjoint) check: T is self-adjoint exactly when K(t, s) = conj K(s, t) almost everywhere
 * (for a real kernel: K symmetric).
 *
 * What it measures:
 *  - first, symbolically, whether the expression is Hermitian by construction (symbolicHermitian.ts); then the
 *    defect is exactly 0 and no sampling noise enters;
 *  - otherwise the relative defect ‖K − K*‖_HS / ‖K‖_HS, sampled with Gauss–Legendre rules of 64 points in t and
 *    63 in s (two rules without a common point, so the grid never lies on the diagonal, where a piecewise kernel
 *    may take either branch), with the point of the largest |K(t, s) − conj K(s, t)|, and its error from the same
 *    defect on 48 × 47 points; and the Galerkin matrix defect ‖A − Aᴴ‖_F / ‖A‖_F from the engine.
 * Tolerance: the larger of the `hermitianTolerance` setting and the relative accuracy the engine reached (a
 * defect below what the discretisation can resolve is no evidence). Both defects must be within it.
 * Finding: KW501 on the kernel's name (a symmetrize fix attached); claim: KW601 on the `hermitian` item.
 */
import type { ClaimVerdict, CheckContext, Finding } from './types';
import { holds } from './types';
import type { HermitianReport } from '../analysis/types';
import type { Fix } from '../diagnostics/types';
import { isHermitianByConstruction } from './symbolicHermitian';
import { fmt, fmtComplex, fmtEstimate, gaussGrid, sampleGrid } from './sampling';

export interface SymmetryFacts {
  readonly report: HermitianReport;
  /** Relative defects: sampled on the grid, and of the Galerkin matrix (NaN without one). */
  readonly gridDefect: number;
  readonly galerkinDefect: number;
  readonly tolerance: number;
  readonly complex: boolean;
}

export function measureSymmetry(ctx: CheckContext): SymmetryFacts {
  const galerkinDefect = ctx.engine.finest ? ctx.engine.defect : NaN;
  const reached = Number.isFinite(ctx.engine.reached) ? ctx.engine.reached : 0;
  const tolerance = Math.max(ctx.options.hermitianTolerance, reached);
  const complex = ctx.ir.complex;
  if (isHermitianByConstruction(ctx.ir)) {
    return { report: { holds: true, defect: 0, defectError: 0, method: 'symbolic', worst: null }, gridDefect: 0, galerkinDefect, tolerance, complex };
  }
  const fine = sampledDefect(ctx, 64, 63);
  // The same defect on a coarser pair of rules: the difference (×4, as the engine's estimates, for rules that
  // converge only algebraically across a jump) is the error of the finer value, floored at rounding level.
  const coarse = sampledDefect(ctx, 48, 47);
  const defectError = Math.max(4 * Math.abs(fine.defect - coarse.defect), 16 * Number.EPSILON * Math.max(1, fine.defect));
  const gridDefect = fine.defect;
  const holdsNow = gridDefect <= tolerance && !(galerkinDefect > tolerance);
  const report: HermitianReport = { holds: holdsNow, defect: gridDefect, defectError, method: 'numeric', worst: fine.worst };
  return { report, gridDefect, galerkinDefect, tolerance, complex };
}

/**
 * ‖K − K*‖/‖K‖ sampled with Gauss–Legendre rules of nt points in t and ns in s, and the point of the largest
 * |K(t, s) − conj K(s, t)| (rules of different sizes share no point, so the grid never lies on the diagonal).
 */
function sampledDefect(ctx: CheckContext, nt: number, ns: number): { defect: number; worst: HermitianReport['worst'] } {
  const [a, b] = ctx.domain;
  const gt = gaussGrid(a, b, nt);
  const gs = gaussGrid(a, b, ns);
  const k = sampleGrid(ctx.compiled, gt.nodes, gs.nodes); // K(t_i, s_j) at i * ns + j
  const m = sampleGrid(ctx.compiled, gs.nodes, gt.nodes); // K(s_j, t_i) at j * nt + i
  // Sums of squares are taken relative to the largest finite value, so that kernels near 1e300 (squares
  // overflow) or 1e-300 (squares underflow) still get a defect.
  let big = 0;
  for (const arr of [k.re, k.im, m.re, m.im]) {
    if (arr) for (let p = 0; p < arr.length; p++) if (Number.isFinite(arr[p])) big = Math.max(big, Math.abs(arr[p]));
  }
  const unit = big > 0 ? big : 1;
  let num = 0;
  let den = 0;
  let worst = -1;
  let worstAt = { i: 0, j: 0 };
  for (let i = 0; i < nt; i++) {
    for (let j = 0; j < ns; j++) {
      const p = i * ns + j;
      const q = j * nt + i;
      const kr = k.re[p];
      const ki = k.im ? k.im[p] : 0;
      const mr = m.re[q];
      const mi = m.im ? -m.im[q] : 0; // conj K(s, t)
      if (!Number.isFinite(kr) || !Number.isFinite(ki) || !Number.isFinite(mr) || !Number.isFinite(mi)) continue;
      // The weights are taken relative to the square's area too (the ratio does not change): on [-1e300, 1e300]
      // their product overflows.
      const w = (gt.weights[i] / (b - a)) * (gs.weights[j] / (b - a));
      const d2 = (kr / unit - mr / unit) ** 2 + (ki / unit - mi / unit) ** 2;
      num += w * d2;
      den += w * 0.5 * ((kr / unit) ** 2 + (ki / unit) ** 2 + (mr / unit) ** 2 + (mi / unit) ** 2);
      if (d2 > worst) { worst = d2; worstAt = { i, j }; }
    }
  }
  const { i, j } = worstAt;
  const p = i * ns + j;
  const q = j * nt + i;
  return {
    defect: den > 0 ? Math.sqrt(num / den) : 0,
    worst: worst > 0 ? {
      t: gt.nodes[i], s: gs.nodes[j],
      value: { re: k.re[p], im: k.im ? k.im[p] : 0 },
      mirrored: { re: m.re[q], im: m.im ? -m.im[q] : 0 },
    } : null,
  };
}

function messageArgs(ctx: { name: string }, f: SymmetryFacts): Record<string, string | number> {
  const w = f.report.worst;
  return {
    name: ctx.name,
    what: f.complex ? 'Hermitian' : 'symmetric',
    defect: fmtEstimate(f.report.defect, f.report.defectError),
    t: w ? fmt(w.t, 4) : '?',
    s: w ? fmt(w.s, 4) : '?',
    value: w ? fmtComplex(w.value.re, w.value.im, 6) : '?',
    mirror: f.complex ? 'conj K(s, t)' : 'K(s, t)',
    mirrored: w ? fmtComplex(w.mirrored.re, w.mirrored.im, 6) : '?',
  };
}

function figures(f: SymmetryFacts): Record<string, number | null> {
  const w = f.report.worst;
  return {
    defect: f.report.defect,
    defectError: f.report.defectError,
    galerkinDefect: Number.isFinite(f.galerkinDefect) ? f.galerkinDefect : null,
    tolerance: f.tolerance,
    t: w?.t ?? null,
    s: w?.s ?? null,
  };
}

export function symmetryFindings(ctx: { name: string }, f: SymmetryFacts, symmetrize: Fix | null): Finding[] {
  if (f.report.holds) return [];
  return [{
    name: 'not-hermitian', args: messageArgs(ctx, f), figures: figures(f), covers: ['hermitian'],
    ...(symmetrize ? { fixes: [symmetrize] } : {}),
  }];
}

export function hermitianClaim(ctx: { name: string }, f: SymmetryFacts, symmetrize: Fix | null): ClaimVerdict {
  if (f.report.holds) return holds;
  return {
    outcome: 'fails', diagnostic: 'hermitian-claim-failed', args: messageArgs(ctx, f), figures: figures(f),
    ...(symmetrize ? { fixes: [symmetrize] } : {}),
  };
}
