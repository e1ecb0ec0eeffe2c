/**
 * The degenerate-kernel method for separable kernels K(t, s) = Σ_j f_j(t) g_j(s): the nonzero eigenvalues of T are
 * exactly those of the small matrix M_ij = ∫ g_i(x) f_j(x) dx (T = F Gᵀ and Gᵀ F = M share their nonzero spectrum;
 * K. Atkinson, The Numerical Solution of Integral Equations of the Second Kind, 1997, §2.1; R. Kress, Linear
 * Integral Equations, 3rd ed. 2014, §11.1). The inner products are computed by composite Gauss–Legendre at two
 * orders; their difference bounds the quadrature error, which reaches the eigenvalues amplified at most by the
 * condition number of the eigenvector matrix (Bauer–Fike). The result is compared with the Galerkin answer.
 */
import type { IrFunction } from '../../semantics/ir';
import { compileKernel } from '../../semantics/evaluator';
import { mayBeComplex } from '../../semantics/lower';
import { closeOver, collectBindings, slotCountOf } from '../../semantics/irTools';
import { compositeRule } from '../quadrature';
import { entriesFinite, generalEigen, singularValues } from '../linalg';
import type { AnalysisOptions, EigenEstimate, SpectrumReport } from '../../analysis/types';
import { expandSeparable, termFactors } from './separable';
import { meshBreakpoints, planMesh } from './mesh';
import type { SpectralResult } from './spectralEngine';
import type { Locus } from './loci';
import { errorTimesPow2, prescaledIr, scaleKernel, timesPow2 } from './kernelScale';

export interface DegenerateResult {
  readonly rank: number;
  readonly eigenvalues: EigenEstimate[];
}

function innerProducts(fs: ((x: Float64Array) => { re: Float64Array; im: Float64Array })[], gs: typeof fs, breakpoints: number[], points: number) {
  const rule = compositeRule(breakpoints, points);
  const F = fs.map((f) => f(rule.nodes));
  const G = gs.map((g) => g(rule.nodes));
  const r = fs.length;
  const re = new Float64Array(r * r);
  const im = new Float64Array(r * r);
  for (let i = 0; i < r; i++) {
    for (let j = 0; j < r; j++) {
      let sr = 0;
      let si = 0;
      const g = G[i];
      const f = F[j];
      for (let k = 0; k < rule.weights.length; k++) {
        const w = rule.weights[k];
        sr += w * (g.re[k] * f.re[k] - g.im[k] * f.im[k]);
        si += w * (g.re[k] * f.im[k] + g.im[k] * f.re[k]);
      }
      re[i * r + j] = sr;
      im[i * r + j] = si;
    }
  }
  return { re, im };
}

export function degenerateSpectrum(
  ir: IrFunction, domain: readonly [number, number], hermitian: boolean, loci: readonly Locus[] = [],
): DegenerateResult | null {
  // A kernel near the ends of the double range (1e-320·t·s): its constant factor scaled by a power of two before
  // evaluation when it takes it exactly, else its subnormal values' rounding as an absolute error (kernelScale.ts).
  const [a, b] = domain;
  const scaling = scaleKernel(ir, compileKernel(ir), a, b);
  const pre = scaling.beforeEvaluation ? prescaledIr(ir, scaling.exponent) : null;
  const k = pre ? scaling.exponent : 0;
  const valueError = pre ? 0 : timesPow2(scaling.valueError, scaling.exponent) * (b - a);
  const r = degenerateUnscaled(pre ?? ir, domain, hermitian, loci);
  if (!r) return null;
  return {
    rank: r.rank,
    eigenvalues: r.eigenvalues.map((e) => ({ re: timesPow2(e.re, k), im: timesPow2(e.im, k), error: (k === 0 ? e.error : errorTimesPow2(e.error, k)) + valueError })),
  };
}

function degenerateUnscaled(
  ir: IrFunction, domain: readonly [number, number], hermitian: boolean, loci: readonly Locus[],
): DegenerateResult | null {
  const terms = expandSeparable(ir.root);
  if (!terms || terms.length === 0) return null;
  const bindings = collectBindings(ir.root);
  const one = (node: IrFunction['root']) => {
    const root = closeOver(node, bindings);
    const slots = slotCountOf(root);
    const kernel = compileKernel({ root, arity: 2, slotCount: slots, complex: mayBeComplex(root, slots) });
    return (x: Float64Array) => {
      const re = new Float64Array(x.length);
      const im = new Float64Array(x.length);
      kernel.evaluateColumns([x, x], re, kernel.complex ? im : null);
      return { re, im };
    };
  };
  const fs = terms.map((p) => one(termFactors(p, ir.root.range).f));
  const gs = terms.map((p) => one(termFactors(p, ir.root.range).g));
  const [a, b] = domain;
  // The factors may have their own one-variable loci (abs(t − c), log t): reuse the mesh planner on them.
  const plan = planMesh(loci.filter((l) => l.line.ct === 0 || l.line.cs === 0), a, b);
  const breakpoints = meshBreakpoints(plan, 4, 0);
  const coarse = innerProducts(fs, gs, breakpoints, 40);
  const fine = innerProducts(fs, gs, breakpoints, 60);
  const r = terms.length;
  // Frobenius norms scaled by the largest entry, so that neither 1e-300 (squares underflow) nor 1e307 (squares
  // overflow) loses them.
  let big = 0;
  for (let k = 0; k < r * r; k++) {
    if (!Number.isFinite(fine.re[k]) || !Number.isFinite(fine.im[k])) return null;
    big = Math.max(big, Math.abs(fine.re[k]), Math.abs(fine.im[k]), Math.abs(coarse.re[k]), Math.abs(coarse.im[k]));
  }
  if (!Number.isFinite(big)) return null;
  const unit = big > 0 ? big : 1;
  let dM = 0;
  let normM = 0;
  for (let k = 0; k < r * r; k++) {
    dM += ((fine.re[k] - coarse.re[k]) / unit) ** 2 + ((fine.im[k] - coarse.im[k]) / unit) ** 2;
    normM += (fine.re[k] / unit) ** 2 + (fine.im[k] / unit) ** 2;
  }
  dM = Math.sqrt(dM) * unit;
  normM = Math.sqrt(normM) * unit;
  // A quadrature that has not settled between the two orders is not trusted (factors with singularities).
  if (dM > 1e-8 * Math.max(normM, 1e-300)) return null;
  // The eigenproblem of M/2^m (2^m near the largest entry, so the scaling is exact): entries near 1e300 overflow
  // inside the eigensolver otherwise (its vectors came back NaN; a fuzz run found it); the values are scaled back.
  const m = Math.round(Math.log2(unit));
  const scaledRe = fine.re.map((x) => timesPow2(x, -m));
  const scaledIm = fine.im.map((x) => timesPow2(x, -m));
  const e = generalEigen(scaledRe, scaledIm, r);
  if (!e.converged) return null;
  if (!entriesFinite(e.vectorsRe) || !entriesFinite(e.vectorsIm) || !entriesFinite(e.valuesRe) || !entriesFinite(e.valuesIm)) return null;
  const sv = singularValues(e.vectorsRe, e.vectorsIm, r, r);
  const cond = sv[r - 1] > 0 ? sv[0] / sv[r - 1] : Infinity;
  const amplification = hermitian ? 1 : Math.min(cond, 1e8);
  const floor = 16 * Number.EPSILON * normM * r;
  const out: EigenEstimate[] = [];
  for (let k = 0; k < r; k++) {
    const re = timesPow2(e.valuesRe[k], m);
    const im = timesPow2(e.valuesIm[k], m);
    const error = amplification * dM + floor;
    if (Math.hypot(re, im) <= Math.max(1e3 * floor, 1e-13 * normM)) continue;
    out.push({ re, im: hermitian && Math.abs(im) <= error ? 0 : im, error });
  }
  out.sort((x, y) => Math.hypot(y.re, y.im) - Math.hypot(x.re, x.im) || y.re - x.re);
  return { rank: out.length, eigenvalues: out };
}

export interface SeparableCrossCheck {
  readonly spectrum: SpectrumReport;
  readonly mismatches: { index: number; exact: string; galerkin: string; difference: string; error: string }[];
}

export function crossCheckSeparable(
  ir: IrFunction, domain: readonly [number, number], engine: SpectralResult, options: AnalysisOptions,
): SeparableCrossCheck | null {
  const spectrum = engine.spectrum;
  if (!spectrum) return null;
  const deg = degenerateSpectrum(ir, domain, engine.hermitian, engine.loci.loci);
  if (!deg) return null;
  const mismatches: SeparableCrossCheck['mismatches'] = [];
  const g = spectrum.eigenvalues;
  const normScale = spectrum.norm?.value ?? 1;
  deg.eigenvalues.slice(0, options.eigenCount).forEach((x, k) => {
    let best = -1;
    let bestD = Infinity;
    g.forEach((y, j) => {
      const d = Math.hypot(x.re - y.re, x.im - y.im);
      if (d < bestD) { bestD = d; best = j; }
    });
    const allowed = 3 * (x.error + (best >= 0 ? g[best].error : 0)) + 1e-12 * normScale;
    if (best < 0 || bestD > allowed) {
      const fmt = (v: number) => v.toPrecision(8);
      mismatches.push({
        index: k + 1,
        exact: x.im === 0 ? fmt(x.re) : `${fmt(x.re)} ${x.im < 0 ? '−' : '+'} ${fmt(Math.abs(x.im))}i`,
        galerkin: best < 0 ? 'nothing' : fmt(g[best].re),
        difference: bestD.toExponential(2),
        error: allowed.toExponential(2),
      });
    }
  });
  const eigenvalues = deg.eigenvalues.slice(0, options.eigenCount);
  let norm = spectrum.norm;
  if (engine.hermitian && norm && eigenvalues.length > 0) {
    const top = Math.abs(eigenvalues[0].re);
    norm = { value: top, error: eigenvalues[0].error, lower: top - eigenvalues[0].error, upper: Math.max(norm.upper, top + eigenvalues[0].error) };
  }
  return {
    spectrum: {
      ...spectrum,
      eigenvalues,
      norm,
      eigenfunctions: spectrum.eigenfunctions && {
        ...spectrum.eigenfunctions,
        re: spectrum.eigenfunctions.re.slice(0, eigenvalues.length),
        im: spectrum.eigenfunctions.im ? spectrum.eigenfunctions.im.slice(0, eigenvalues.length) : null,
      },
      method: `degenerate kernel (rank ${deg.rank}, ${deg.eigenvalues.length} nonzero eigenvalue${deg.eigenvalues.length === 1 ? '' : 's'}), cross-checked with ${spectrum.method}`,
    },
    mismatches,
  };
}
