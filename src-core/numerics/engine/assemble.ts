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
  /**
   * The assembly's work, counted rather than timed (multiply-adds of the projection, plus 20 per kernel
   * evaluation; doubled for a complex kernel), so that budgets built on it give the same result on every machine.
   */
  readonly work: number;
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
    const blocks = Int32Array.from(rule.unit.blocks);
    for (let b = 3; b < blocks.length; b += 4) blocks[b] = blocks[b] === 1 ? 2 : blocks[b] === 2 ? 1 : 0;
    unit = { x: rule.unit.y, y: rule.unit.x, w: rule.unit.w, wSquare: rule.unit.wSquare, nearSingular: rule.unit.nearSingular, blocks };
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
  let evaluations = 0;
  let work = 0;
  // [∫∫ |K|², count of non-finite values]: the projection functions add to it.
  const tally = new Float64Array(2);
  const local = new Float64Array(q * q);
  const localIm = im ? new Float64Array(q * q) : null;
  const basisCache = new Map<string, Float64Array>();
  // The loci with t and s exchanged: the rule of pair (P, Q) is the mirror image of the rule of (Q, P) for these.
  const swapped: Locus[] = oblique.map((l) => ({ ...l, line: { ct: l.line.cs, cs: l.line.ct, c0: l.line.c0 } }));
  const basisAt = (nodes: Float64Array, p: number): Float64Array => {
    const key = `${p}:${nodes.length}:${nodes[0]}`;
    let b = basisCache.get(key);
    if (!b) {
      b = panelBasis(nodes, d.breakpoints[p], d.breakpoints[p + 1], d.degree);
      basisCache.set(key, b);
    }
    return b;
  };
  const scratch = new Scratch(!!im);
  const ruleOptions = { order: d.order, singularLevels: d.singularLevels, gradedPoints: d.gradedPoints };

  for (let P = 0; P < panels; P++) {
    throwIfCancelled(token);
    for (let Q = 0; Q < panels; Q++) {
      // Below the diagonal, use the mirror image of the rule for the mirrored loci above it, so that a Hermitian
      // kernel (whose loci are symmetric in t and s) gives a Galerkin matrix that is Hermitian to rounding, whatever
      // the quadrature error, while a rule still follows loci that are not symmetric (t − s = c).
      const rule: PairRule = P <= Q
        ? pairRule(d.breakpoints[P], d.breakpoints[P + 1], d.breakpoints[Q], d.breakpoints[Q + 1], oblique, ruleOptions)
        : mirrored(pairRule(d.breakpoints[Q], d.breakpoints[Q + 1], d.breakpoints[P], d.breakpoints[P + 1], swapped, ruleOptions));
      local.fill(0);
      if (localIm) localIm.fill(0);
      // The kernel is called once per pair, outside the projection loops: every analysed kernel is a different
      // generated function, and keeping those calls out of the hot loops keeps the loops' optimised code valid
      // from one kernel to the next.
      if ('tensor' in rule) {
        const { tNodes, tWeights, sNodes, sWeights } = rule.tensor;
        const m = tNodes.length * sNodes.length;
        const kr = scratch.values(m);
        const ki = scratch.valuesIm(m);
        kernel.evaluateGrid(tNodes, sNodes, kr, ki);
        evaluations += m;
        work += m * q + tNodes.length * q * q;
        projectTensor(kr, ki, tWeights, sWeights, basisAt(tNodes, P), basisAt(sNodes, Q), q,
          scratch.z(tNodes.length * q), scratch.zIm(tNodes.length * q), local, localIm, tally);
      } else {
        const { unit, t0, s0, ht, hs } = rule;
        const m = unit.w.length;
        const tq = scratch.tPoints(m);
        const sq = scratch.sPoints(m);
        mapUnitPoints(unit.x, unit.y, t0, s0, ht, hs, tq, sq);
        const kr = scratch.values(m);
        const ki = scratch.valuesIm(m);
        kernel.evaluateColumns([tq, sq], kr, ki);
        evaluations += m;
        work += unitWork(unit.blocks, q);
        const { bx, by } = unitBasis(unit, d.degree);
        projectUnit(kr, ki, unit, bx, by, q, ht * hs, local, localIm, tally, scratch.z(q), scratch.zIm(q));
      }
      scatterBlock(local, localIm, re, im, n, q, P, Q);
    }
  }
  const factor = im ? 2 : 1;
  return {
    n, re, im, hsSquared: tally[0], evaluations, nonFinite: tally[1], discretisation: d,
    work: factor * (work + 20 * evaluations),
  };
}

/** Multiply-adds of projectUnit for a rule with these blocks. */
function unitWork(blocks: Int32Array, q: number): number {
  let w = 0;
  for (let b = 0; b < blocks.length; b += 4) {
    const rows = blocks[b + 1];
    const cols = blocks[b + 2];
    w += blocks[b + 3] === 0 ? rows * cols * q * q : rows * (cols * q + q * q);
  }
  return w;
}

/** Reusable work arrays of one assembly (views of the needed length over buffers that only grow). */
class Scratch {
  private buffers: Float64Array[] = [new Float64Array(0), new Float64Array(0), new Float64Array(0), new Float64Array(0), new Float64Array(0), new Float64Array(0)];
  constructor(private readonly complex: boolean) {}
  private take(slot: number, length: number, zero: boolean): Float64Array {
    if (this.buffers[slot].length < length) this.buffers[slot] = new Float64Array(Math.max(length, 2 * this.buffers[slot].length));
    const view = this.buffers[slot].subarray(0, length);
    if (zero) view.fill(0);
    return view;
  }
  values(m: number): Float64Array { return this.take(0, m, false); }
  valuesIm(m: number): Float64Array | null { return this.complex ? this.take(1, m, false) : null; }
  z(m: number): Float64Array { return this.take(2, m, true); }
  zIm(m: number): Float64Array | null { return this.complex ? this.take(3, m, true) : null; }
  tPoints(m: number): Float64Array { return this.take(4, m, false); }
  sPoints(m: number): Float64Array { return this.take(5, m, false); }
}

function mapUnitPoints(
  x: Float64Array, y: Float64Array, t0: number, s0: number, ht: number, hs: number, tq: Float64Array, sq: Float64Array,
): void {
  for (let k = 0; k < tq.length; k++) {
    tq[k] = t0 + ht * x[k];
    sq[k] = s0 + hs * y[k];
  }
}

/**
 * Tensor rule: local += Btᵀ diag(wt) K diag(ws) Bs, through Z = diag(wt) K diag(ws) Bs (mt × q). Adds ∫∫ |K|² to
 * tally[0] and the number of non-finite values (taken as 0) to tally[1].
 */
function projectTensor(
  kr: Float64Array, ki: Float64Array | null, tWeights: Float64Array, sWeights: Float64Array,
  bt: Float64Array, bs: Float64Array, q: number, zr: Float64Array, zi: Float64Array | null,
  local: Float64Array, localIm: Float64Array | null, tally: Float64Array,
): void {
  const mt = tWeights.length;
  const ms = sWeights.length;
  let hs2 = 0;
  let bad = 0;
  for (let a = 0; a < mt; a++) {
    const rowZ = a * q;
    for (let b = 0; b < ms; b++) {
      let vr = kr[a * ms + b];
      let vi = ki ? ki[a * ms + b] : 0;
      if (!Number.isFinite(vr) || !Number.isFinite(vi)) { bad++; vr = 0; vi = 0; }
      const w = tWeights[a] * sWeights[b];
      hs2 += w * (vr * vr + vi * vi);
      const cr = w * vr;
      const rowB = b * q;
      for (let j = 0; j < q; j++) zr[rowZ + j] += cr * bs[rowB + j];
      if (zi) {
        const ci = w * vi;
        for (let j = 0; j < q; j++) zi[rowZ + j] += ci * bs[rowB + j];
      }
    }
  }
  for (let a = 0; a < mt; a++) {
    const row = a * q;
    for (let i = 0; i < q; i++) {
      const bti = bt[row + i];
      if (bti === 0) continue;
      const base = i * q;
      for (let j = 0; j < q; j++) local[base + j] += bti * zr[row + j];
      if (zi && localIm) for (let j = 0; j < q; j++) localIm[base + j] += bti * zi[row + j];
    }
  }
  tally[0] += hs2;
  tally[1] += bad;
}

/**
 * Rule on the unit square mapped onto the pair (area = ht·hs): local += Σ_k w_k K_k b_x(k) b_y(k)ᵀ, the basis scaled
 * by 1/√h per direction. A value that is not finite within rounding of a singular locus counts as 0 (a set of
 * measure zero for an integrable singularity); elsewhere it is also counted in tally[1].
 *
 * Rows of points that share x (or y) are summed first: Σ_c w K b_y over the row, then one outer product with the
 * row's b_x, which costs cols·q + q² per row instead of cols·q² (the rule's blocks say which rows allow it).
 */
function projectUnit(
  kr: Float64Array, ki: Float64Array | null, unit: UnitPairRule,
  bx: Float64Array, by: Float64Array, q: number, area: number,
  local: Float64Array, localIm: Float64Array | null, tally: Float64Array,
  zr: Float64Array, zi: Float64Array | null,
): void {
  const { w, wSquare, nearSingular, blocks } = unit;
  const scale = Math.sqrt(area);
  let hs2 = 0;
  let bad = 0;
  // Weighted values c_k = √area · w_k · K_k, written over kr / ki (the caller's scratch), non-finite ones as 0.
  for (let k = 0; k < w.length; k++) {
    let vr = kr[k];
    let vi = ki ? ki[k] : 0;
    if (!Number.isFinite(vr) || !Number.isFinite(vi)) {
      if (!nearSingular[k]) bad++;
      vr = 0; vi = 0;
    }
    hs2 += area * wSquare[k] * (vr * vr + vi * vi);
    kr[k] = scale * w[k] * vr;
    if (ki) ki[k] = scale * w[k] * vi;
  }
  for (let b = 0; b < blocks.length; b += 4) {
    const start = blocks[b];
    const rows = blocks[b + 1];
    const cols = blocks[b + 2];
    const axis = blocks[b + 3];
    if (axis === 0) {
      rankOneUpdates(kr, bx, by, q, start, start + rows * cols, local);
      if (ki && localIm) rankOneUpdates(ki, bx, by, q, start, start + rows * cols, localIm);
      continue;
    }
    // axis 1: b_x is the row's; sum c·b_y along the row. axis 2: the other way round (local[i][j] += z_i b_y,row[j]).
    const along = axis === 1 ? by : bx;
    const fixed = axis === 1 ? bx : by;
    for (let r = 0; r < rows; r++) {
      const k0 = start + r * cols;
      rowSum(kr, along, q, k0, cols, zr);
      if (axis === 1) outerAdd(fixed, k0 * q, zr, 0, q, local);
      else outerAdd(zr, 0, fixed, k0 * q, q, local);
      if (ki && localIm && zi) {
        rowSum(ki, along, q, k0, cols, zi);
        if (axis === 1) outerAdd(fixed, k0 * q, zi, 0, q, localIm);
        else outerAdd(zi, 0, fixed, k0 * q, q, localIm);
      }
    }
  }
  tally[0] += hs2;
  tally[1] += bad;
}

/** local += Σ_{k in [from, to)} c_k b_x(k) b_y(k)ᵀ. */
function rankOneUpdates(c: Float64Array, bx: Float64Array, by: Float64Array, q: number, from: number, to: number, local: Float64Array): void {
  for (let k = from; k < to; k++) {
    const ck = c[k];
    if (ck === 0) continue;
    const row = k * q;
    for (let i = 0; i < q; i++) {
      const f = ck * bx[row + i];
      const base = i * q;
      for (let j = 0; j < q; j++) local[base + j] += f * by[row + j];
    }
  }
}

/** z = Σ_{c < cols} v_{k0+c} · basis(k0 + c) (q entries). */
function rowSum(v: Float64Array, basis: Float64Array, q: number, k0: number, cols: number, z: Float64Array): void {
  z.fill(0, 0, q);
  for (let c = 0; c < cols; c++) {
    const f = v[k0 + c];
    const row = (k0 + c) * q;
    for (let j = 0; j < q; j++) z[j] += f * basis[row + j];
  }
}

/** local[i][j] += a[aOff + i] · b[bOff + j]. */
function outerAdd(a: Float64Array, aOff: number, b: Float64Array, bOff: number, q: number, local: Float64Array): void {
  for (let i = 0; i < q; i++) {
    const f = a[aOff + i];
    if (f === 0) continue;
    const base = i * q;
    for (let j = 0; j < q; j++) local[base + j] += f * b[bOff + j];
  }
}

function scatterBlock(
  local: Float64Array, localIm: Float64Array | null, re: Float64Array, im: Float64Array | null,
  n: number, q: number, P: number, Q: number,
): void {
  for (let i = 0; i < q; i++) {
    const row = (P * q + i) * n + Q * q;
    for (let j = 0; j < q; j++) {
      re[row + j] = local[i * q + j];
      if (im && localIm) im[row + j] = localIm[i * q + j];
    }
  }
}
