/**
 * Galerkin matrix of the integral operator (Tf)(t) = ∫ K(t, s) f(s) ds in an L²-orthonormal basis of piecewise
 * Legendre polynomials: A_ij = ∫∫ φ_i(t) K(t, s) φ_j(s) ds dt (K. Atkinson, The Numerical Solution of Integral
 * Equations of the Second Kind, 1997, §3.1 and §3.3). With a real orthonormal basis A is Hermitian exactly when K
 * is, and its eigenvalues are Rayleigh–Ritz values of T. The same quadrature also yields ∫∫ |K|² (Hilbert–Schmidt).
 */
import { panelBasis } from '../quadrature';
import type { UnitPairRule } from './pairRule';
import type { CompiledKernel } from '../../semantics/evaluator';
import type { CancellationToken } from '../../util/cancellation';
import { throwIfCancelled } from '../../util/cancellation';
import type { Locus } from './loci';
import { pairRule, type PairRule } from './pairRule';

export interface Discretisation {
  /** Panel breakpoints, ascending. */
  readonly breakpoints: readonly number[];
  /** Polynomial degree on every panel. */
  readonly degree: number;
  /** Gauss points per direction for regular pairs and triangle pieces. */
  readonly order: number;
  readonly singularLevels: number;
  /** Gauss points on each graded panel of the singular rules. */
  readonly gradedPoints: number;
}

export interface GalerkinMatrix {
  readonly n: number;
  readonly re: Float64Array;
  /** Null for a real kernel. */
  readonly im: Float64Array | null;
  /** ∫∫ |K|² by the assembly quadrature. */
  readonly hsSquared: number;
  readonly evaluations: number;
  /** Quadrature points where K was NaN or infinite (treated as 0). */
  readonly nonFinite: number;
  readonly discretisation: Discretisation;
}

const unitBases = new WeakMap<UnitPairRule, Map<number, { bx: Float64Array; by: Float64Array }>>();

/** The orthonormal Legendre basis of [0, 1] at a unit rule's points (scaled by 1/√h when mapped to a panel). */
function unitBasis(unit: UnitPairRule, degree: number): { bx: Float64Array; by: Float64Array } {
  let perDegree = unitBases.get(unit);
  if (!perDegree) {
    perDegree = new Map();
    unitBases.set(unit, perDegree);
  }
  let b = perDegree.get(degree);
  if (!b) {
    b = { bx: panelBasis(unit.x, 0, 1, degree), by: panelBasis(unit.y, 0, 1, degree) };
    perDegree.set(degree, b);
  }
  return b;
}

const mirrors = new WeakMap<UnitPairRule, UnitPairRule>();

/** The rule of pair (Q, P) turned into a rule of pair (P, Q): t and s exchange roles. */
function mirrored(rule: PairRule): PairRule {
  if ('tensor' in rule) {
    const { tNodes, tWeights, sNodes, sWeights } = rule.tensor;
    return { tensor: { tNodes: sNodes, tWeights: sWeights, sNodes: tNodes, sWeights: tWeights } };
  }
  let unit = mirrors.get(rule.unit);
  if (!unit) {
    unit = { x: rule.unit.y, y: rule.unit.x, w: rule.unit.w, nearSingular: rule.unit.nearSingular };
    mirrors.set(rule.unit, unit);
  }
  return { unit, t0: rule.s0, s0: rule.t0, ht: rule.hs, hs: rule.ht };
}

export function basisSize(d: Discretisation): number {
  return (d.breakpoints.length - 1) * (d.degree + 1);
}

export function assembleGalerkin(
  kernel: CompiledKernel,
  d: Discretisation,
  oblique: readonly Locus[],
  token?: CancellationToken,
): GalerkinMatrix {
  const panels = d.breakpoints.length - 1;
  const q = d.degree + 1;
  const n = panels * q;
  const re = new Float64Array(n * n);
  const im = kernel.complex ? new Float64Array(n * n) : null;
  let hsSquared = 0;
  let evaluations = 0;
  let nonFinite = 0;
  const local = new Float64Array(q * q);
  const localIm = new Float64Array(q * q);
  const basisCache = new Map<string, Float64Array>();
  const basisAt = (nodes: Float64Array, p: number): Float64Array => {
    const key = `${p}:${nodes.length}:${nodes[0]}`;
    let b = basisCache.get(key);
    if (!b) {
      b = panelBasis(nodes, d.breakpoints[p], d.breakpoints[p + 1], d.degree);
      basisCache.set(key, b);
    }
    return b;
  };

  for (let P = 0; P < panels; P++) {
    throwIfCancelled(token);
    for (let Q = 0; Q < panels; Q++) {
      // Below the diagonal, use the mirror image of the rule above it, so that a Hermitian kernel gives a Galerkin
      // matrix that is Hermitian to rounding, whatever the quadrature error.
      const rule: PairRule = P <= Q
        ? pairRule(d.breakpoints[P], d.breakpoints[P + 1], d.breakpoints[Q], d.breakpoints[Q + 1], oblique,
          { order: d.order, singularLevels: d.singularLevels, gradedPoints: d.gradedPoints })
        : mirrored(pairRule(d.breakpoints[Q], d.breakpoints[Q + 1], d.breakpoints[P], d.breakpoints[P + 1], oblique,
          { order: d.order, singularLevels: d.singularLevels, gradedPoints: d.gradedPoints }));
      local.fill(0);
      localIm.fill(0);
      if ('tensor' in rule) {
        const { tNodes, tWeights, sNodes, sWeights } = rule.tensor;
        const mt = tNodes.length;
        const ms = sNodes.length;
        const kr = new Float64Array(mt * ms);
        const ki = im ? new Float64Array(mt * ms) : null;
        kernel.evaluateGrid(tNodes, sNodes, kr, ki);
        evaluations += mt * ms;
        const bt = basisAt(tNodes, P);
        const bs = basisAt(sNodes, Q);
        // Z = diag(wt) K diag(ws) Bs  (mt × q), then local = Btᵀ Z.
        const zr = new Float64Array(mt * q);
        const zi = ki ? new Float64Array(mt * q) : null;
        for (let a = 0; a < mt; a++) {
          for (let b = 0; b < ms; b++) {
            let vr = kr[a * ms + b];
            let vi = ki ? ki[a * ms + b] : 0;
            if (!Number.isFinite(vr) || !Number.isFinite(vi)) { nonFinite++; vr = 0; vi = 0; }
            const w = tWeights[a] * sWeights[b];
            hsSquared += w * (vr * vr + vi * vi);
            const cr = w * vr;
            const ci = w * vi;
            const rowB = b * q;
            const rowZ = a * q;
            for (let j = 0; j < q; j++) zr[rowZ + j] += cr * bs[rowB + j];
            if (zi) for (let j = 0; j < q; j++) zi[rowZ + j] += ci * bs[rowB + j];
          }
        }
        for (let a = 0; a < mt; a++) {
          const rowZ = a * q;
          const rowB = a * q;
          for (let i = 0; i < q; i++) {
            const bti = bt[rowB + i];
            if (bti === 0) continue;
            const base = i * q;
            for (let j = 0; j < q; j++) local[base + j] += bti * zr[rowZ + j];
            if (zi) for (let j = 0; j < q; j++) localIm[base + j] += bti * zi[rowZ + j];
          }
        }
      } else {
        const { unit, t0, s0, ht, hs } = rule;
        const m = unit.w.length;
        const tq = new Float64Array(m);
        const sq = new Float64Array(m);
        for (let k = 0; k < m; k++) {
          tq[k] = t0 + ht * unit.x[k];
          sq[k] = s0 + hs * unit.y[k];
        }
        const kr = new Float64Array(m);
        const ki = im ? new Float64Array(m) : null;
        kernel.evaluateColumns([tq, sq], kr, ki);
        evaluations += m;
        const { bx, by } = unitBasis(unit, d.degree);
        const area = ht * hs;
        const scale = Math.sqrt(area);
        for (let k = 0; k < m; k++) {
          let vr = kr[k];
          let vi = ki ? ki[k] : 0;
          if (!Number.isFinite(vr) || !Number.isFinite(vi)) {
            // On a singular locus to within rounding: a set of measure zero for an integrable singularity.
            if (!unit.nearSingular[k]) nonFinite++;
            vr = 0; vi = 0;
          }
          const w = unit.w[k];
          hsSquared += area * w * (vr * vr + vi * vi);
          const cr = scale * w * vr;
          const row = k * q;
          for (let i = 0; i < q; i++) {
            const fr = cr * bx[row + i];
            const base = i * q;
            for (let j = 0; j < q; j++) local[base + j] += fr * by[row + j];
          }
          if (im) {
            const ci = scale * w * vi;
            for (let i = 0; i < q; i++) {
              const fi = ci * bx[row + i];
              const base = i * q;
              for (let j = 0; j < q; j++) localIm[base + j] += fi * by[row + j];
            }
          }
        }
      }
      for (let i = 0; i < q; i++) {
        const row = (P * q + i) * n + Q * q;
        for (let j = 0; j < q; j++) {
          re[row + j] = local[i * q + j];
          if (im) im[row + j] = localIm[i * q + j];
        }
      }
    }
  }
  return { n, re, im, hsSquared, evaluations, nonFinite, discretisation: d };
}
