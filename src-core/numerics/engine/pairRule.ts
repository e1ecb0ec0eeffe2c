/**
 * The 2D quadrature rule for one panel pair P × Q of the Galerkin matrix. Where no locus meets the rectangle, a
 * tensor Gauss–Legendre rule (exponential convergence for analytic integrands). Where oblique loci (the diagonal
 * t = s, t + s = c, ...) cross it, the rectangle is cut along them into convex pieces, each triangulated and
 * integrated with collapsed (Duffy / Stroud conical-product) Gauss rules, so the integrand is smooth on every
 * piece (M. G. Duffy, SIAM J. Numer. Anal. 19 (1982); A. H. Stroud, Approximate Calculation of Multiple Integrals,
 * 1971). Pieces next to a singular locus get rules graded geometrically toward the singular edge or vertex.
 *
 * A singular locus whose kernel grows like d^(−α) with α read exactly from the expression may carry that α
 * (`PowerTailLocus`): its edge rules then replace the innermost graded panel by the power tail of
 * collapsedTriangle.ts, and stop grading at `tailLevels` levels (distances ~6e-9 of the pair's size, where the
 * kernel's black-box values are still accurate; deeper points only add rounding noise). Without it, the part of
 * ∫ d^(−α) below the resolvable distance (δ^(1−α): 2.5 % for α = 0.9 at δ = 1e-16) was lost.
 */
import {
  DEFAULT_GRADING_RATIO, collapsedTriangleRule, gaussLegendre, mapRule, splitConvexPolygon, triangulateConvex, type Vec2,
} from '../quadrature';
import { normaliseLine, type Line, type Locus } from './loci';
import type { SingularityEstimate } from './singularity';

/** A locus with the exact exponent α ∈ (0, 1) of a power singularity along it (see the header). */
export type PowerTailLocus = Locus & { readonly tailExponent?: number };

/** Geometric levels of the edge rules toward a locus with a power tail: σ^10 ≈ 6e-9 for σ = 0.15. */
export const tailLevels = 10;

/**
 * The loci with their power tails: the exponent of a 'power' singularity read from the expression (exponentError
 * 0), for oblique lines only (edge rules are built for those), for every α in (0, 1). The Hilbert–Schmidt norm
 * integrates ∫∫|K|², which grows like d^(−2α), with the rule's second weights (the tail with 2α): at α = 0.49 that
 * integral has 1e-16^(0.02) ≈ 48 % of its value closer than 1e-16, which no graded rule resolves; at α = 0.3 the
 * deep graded levels alone left 2e-7 of it out, beyond the level-to-level error estimate.
 * Others are returned as they are.
 */
export function withPowerTails(loci: readonly Locus[], singularities: readonly SingularityEstimate[]): PowerTailLocus[] {
  return loci.map((l) => {
    const s = singularities.find((e) => e.locus.line.ct === l.line.ct && e.locus.line.cs === l.line.cs && e.locus.line.c0 === l.line.c0);
    if (!s || s.type !== 'power' || s.exponentError !== 0 || !(s.exponent > 0 && s.exponent < 1) || s.point) return l;
    return { ...l, tailExponent: s.exponent };
  });
}

/**
 * The relative error that rounding adds to a figure through the power tails (a floor under the level-to-level
 * estimates, which cannot see it: every level stops at the same `tailLevels`). The tail's constant is read from
 * the carrier panel's points, at distances δ ≈ σ^tailLevels·h from the line (h ≈ (b − a)/4, the coarsest pair),
 * where t − s (or the line's form) is known only to ε·max(|a|, |b|): a relative error ρ = p·α·ε·max(|a|, |b|)/δ in
 * |K|^p. The tail holds the fraction δ^(1 − pα) of the integral (d^(−pα) integrated from 0), so the figure moves by
 * about δ^(1 − pα)·ρ of its size; four times that is returned (the safety factor of errorEstimate.ts). p = 1 for the
 * Galerkin entries (eigenvalues, norm), p = 2 for ∫∫|K|² (the Hilbert–Schmidt norm; 0 when 2α ≥ 1). Derived here
 * from the rounding of the coordinates (common practice for floating-point error bounds), not from a source.
 */
export function tailRoundingFloor(loci: readonly PowerTailLocus[], a: number, b: number, p: 1 | 2): number {
  const delta = DEFAULT_GRADING_RATIO ** tailLevels * ((b - a) / 4);
  if (!(delta > 0)) return 0;
  let worst = 0;
  for (const l of loci) {
    const alpha = l.tailExponent;
    if (alpha === undefined || p * alpha >= 1) continue;
    const norm = Math.hypot(l.line.ct, l.line.cs);
    const rho = (p * alpha * Number.EPSILON * (Math.abs(l.line.ct) + Math.abs(l.line.cs)) * Math.max(Math.abs(a), Math.abs(b))) / (norm * delta);
    worst = Math.max(worst, 4 * (delta / (b - a)) ** (1 - p * alpha) * rho);
  }
  return worst;
}

/** A tensor Gauss rule on the pair (point k = i·ns + j), or a rule on the unit square mapped onto the pair. */
export type PairRule =
  | { readonly tensor: { readonly tNodes: Float64Array; readonly tWeights: Float64Array; readonly sNodes: Float64Array; readonly sWeights: Float64Array } }
  | { readonly unit: UnitPairRule; readonly t0: number; readonly s0: number; readonly ht: number; readonly hs: number };

export interface PairRuleOptions {
  /** Gauss points per direction (tensor) or per collapsed direction (triangles). */
  readonly order: number;
  /** Geometric levels toward singular edges and vertices. */
  readonly singularLevels: number;
  /** Gauss points on each geometrically graded panel. */
  readonly gradedPoints: number;
}

/** A singular line with its power tail exponent, if any. */
type TailLine = Line & { readonly tail?: number };

const lineValue = (l: Line, p: Vec2) => l.ct * p[0] + l.cs * p[1] + l.c0;

function tensorRule(t0: number, t1: number, s0: number, s1: number, order: number): PairRule {
  const g = gaussLegendre(order);
  const rt = mapRule(g, t0, t1);
  const rs = mapRule(g, s0, s1);
  return { tensor: { tNodes: rt.nodes, tWeights: rt.weights, sNodes: rs.nodes, sWeights: rs.weights } };
}

interface Tri { v0: Vec2; v1: Vec2; v2: Vec2; grade: 'none' | 'edge' | 'vertex'; tail?: number }

function onLine(l: Line, p: Vec2, tol: number): boolean {
  return Math.abs(lineValue(l, p)) <= tol;
}

/** Triangles of one convex piece, arranged so that singular edges are v1–v2 and singular vertices are v0. */
function trianglesOfPiece(poly: readonly Vec2[], singular: readonly TailLine[], tol: number): Tri[] {
  const n = poly.length;
  if (n < 3) return [];
  for (const l of singular) {
    for (let i = 0; i < n; i++) {
      const p = poly[i];
      const q = poly[(i + 1) % n];
      if (!onLine(l, p, tol) || !onLine(l, q, tol)) continue;
      // Singular edge p–q: apex m = the vertex farthest from the line.
      let m = -1;
      let best = -1;
      for (let j = 0; j < n; j++) {
        const d = Math.abs(lineValue(l, poly[j]));
        if (d > best) { best = d; m = j; }
      }
      const tris: Tri[] = [{ v0: poly[m], v1: p, v2: q, grade: 'edge', tail: l.tail }];
      for (let j = 0; j < n; j++) {
        const a = poly[j];
        const b = poly[(j + 1) % n];
        if (j === i || j === m || (j + 1) % n === m) continue;
        // Triangle (m, a, b): a vertex on the singular line becomes the apex.
        if (onLine(l, a, tol)) tris.push({ v0: a, v1: b, v2: poly[m], grade: 'vertex' });
        else if (onLine(l, b, tol)) tris.push({ v0: b, v1: poly[m], v2: a, grade: 'vertex' });
        else tris.push({ v0: poly[m], v1: a, v2: b, grade: 'none' });
      }
      return tris;
    }
  }
  for (const l of singular) {
    const i = poly.findIndex((p) => onLine(l, p, tol));
    if (i < 0) continue;
    const tris: Tri[] = [];
    for (let j = 1; j + 1 < n; j++) {
      tris.push({ v0: poly[i], v1: poly[(i + j) % n], v2: poly[(i + j + 1) % n], grade: 'vertex' });
    }
    return tris;
  }
  return triangulateConvex(poly).map(([v0, v1, v2]) => ({ v0, v1, v2, grade: 'none' as const }));
}

export function pairRule(
  t0: number, t1: number, s0: number, s1: number, oblique: readonly PowerTailLocus[], options: PairRuleOptions,
): PairRule {
  const size = Math.max(t1 - t0, s1 - s0);
  const tol = 1e-12 * Math.max(1, Math.abs(t0), Math.abs(t1), Math.abs(s0), Math.abs(s1));
  const corners: Vec2[] = [[t0, s0], [t1, s0], [t1, s1], [t0, s1]];
  const crossing: PowerTailLocus[] = [];
  const touching: TailLine[] = [];
  for (const locus of oblique) {
    const v = corners.map((c) => lineValue(locus.line, c));
    const lo = Math.min(...v);
    const hi = Math.max(...v);
    if (lo < -tol && hi > tol) crossing.push(locus);
    else if (locus.kind === 'singular' && (Math.abs(lo) <= tol || Math.abs(hi) <= tol)) touching.push({ ...locus.line, tail: locus.tailExponent });
  }
  if (crossing.length === 0 && touching.length === 0) return tensorRule(t0, t1, s0, s1, options.order);

  const ht = t1 - t0;
  const hs = s1 - s0;
  // The rule is built once on the unit square for each configuration (the loci mapped there) and reused: graded
  // meshes repeat the same few configurations at every scale.
  const toUnit = (l: Line): Line => normaliseLine({ ct: l.ct * ht, cs: l.cs * hs, c0: l.ct * t0 + l.cs * s0 + l.c0 })!;
  const crossingUnit = crossing.map((l) => ({ line: { ...toUnit(l.line), tail: l.tailExponent } as TailLine, kind: l.kind }));
  const touchingUnit = touching.map((l): TailLine => ({ ...toUnit(l), tail: l.tail }));
  const key = [
    options.order, options.singularLevels, options.gradedPoints,
    ...crossingUnit.map((l) => `${l.kind[0]}${l.line.ct.toPrecision(12)},${l.line.cs.toPrecision(12)},${l.line.c0.toPrecision(12)}~${l.line.tail ?? ''}`),
    ...touchingUnit.map((l) => `v${l.ct.toPrecision(12)},${l.cs.toPrecision(12)},${l.c0.toPrecision(12)}~${l.tail ?? ''}`),
  ].join('|');
  let unit = unitRules.get(key);
  if (!unit) {
    unit = unitRule(crossingUnit, touchingUnit, options);
    unitRules.set(key, unit);
    unitRuleBytes += ruleBytes(unit);
    // Bounded in memory, oldest first out: a long editing session meets ever new configurations.
    while (unitRules.size > 1 && (unitRules.size > 4096 || unitRuleBytes > unitRuleByteLimit)) {
      const oldest = unitRules.keys().next().value as string;
      unitRuleBytes -= ruleBytes(unitRules.get(oldest)!);
      unitRules.delete(oldest);
    }
  } else {
    unitRules.delete(key);
    unitRules.set(key, unit); // most recently used last
  }
  return { unit, t0, s0, ht, hs };
}

export interface UnitPairRule {
  /** Points and weights on the unit square [0, 1]². */
  readonly x: Float64Array;
  readonly y: Float64Array;
  readonly w: Float64Array;
  /**
   * Weights for ∫∫|K|² (the Hilbert–Schmidt norm): the power tail of an edge rule is taken with 2α there
   * (collapsedTriangle.ts); the same array as w when no triangle has a tail.
   */
  readonly wSquare: Float64Array;
  /** True for points within rounding distance of a singular locus (a value there that is not finite counts as 0). */
  readonly nearSingular: Uint8Array;
  /**
   * The rule's points come in blocks of rows (one block per triangle, points start + r·cols + c), four numbers per
   * block: start, rows, cols, and which coordinate is the same for every point of a row (1: x, 2: y, 0: neither).
   * A triangle whose edge opposite the collapsed vertex is vertical has x fixed along each row of its collapsed
   * rule (horizontal: y), which lets the Galerkin projection sum a row before multiplying by the basis in x (y).
   */
  readonly blocks: Int32Array;
}

/** The triangle with its vertices turned so that v1–v2 is an axis-parallel edge, when it has one. */
function axisEdgeLast(v0: Vec2, v1: Vec2, v2: Vec2): [Vec2, Vec2, Vec2] {
  const parallel = (a: Vec2, b: Vec2) => a[0] === b[0] || a[1] === b[1];
  if (parallel(v1, v2)) return [v0, v1, v2];
  if (parallel(v2, v0)) return [v1, v2, v0];
  if (parallel(v0, v1)) return [v2, v0, v1];
  return [v0, v1, v2];
}

/** 1 when x is the same along every row of the block, 2 when y is, else 0 (checked on the points themselves). */
function rowAxis(x: Float64Array, y: Float64Array, start: number, rows: number, cols: number): number {
  let xFixed = true;
  let yFixed = true;
  for (let r = 0; r < rows && (xFixed || yFixed); r++) {
    const k0 = start + r * cols;
    for (let c = 1; c < cols; c++) {
      if (x[k0 + c] !== x[k0]) xFixed = false;
      if (y[k0 + c] !== y[k0]) yFixed = false;
    }
  }
  return xFixed ? 1 : yFixed ? 2 : 0;
}

const unitRules = new Map<string, UnitPairRule>();
let unitRuleBytes = 0;
/** Memory the cached unit-square rules may hold together (their arrays), in bytes. */
const unitRuleByteLimit = 48 * 2 ** 20;

function ruleBytes(r: UnitPairRule): number {
  return r.x.byteLength + r.y.byteLength + r.w.byteLength + (r.wSquare === r.w ? 0 : r.wSquare.byteLength)
    + r.nearSingular.byteLength + r.blocks.byteLength;
}

function unitRule(crossing: readonly { line: TailLine; kind: Locus['kind'] }[], touching: readonly TailLine[], options: PairRuleOptions): UnitPairRule {
  let pieces: Vec2[][] = [[[0, 0], [1, 0], [1, 1], [0, 1]]];
  for (const locus of crossing) {
    const next: Vec2[][] = [];
    for (const poly of pieces) {
      const { below, above } = splitConvexPolygon(poly, locus.line.ct, locus.line.cs, -locus.line.c0);
      if (below.length >= 3) next.push(below);
      if (above.length >= 3) next.push(above);
    }
    pieces = next;
  }
  const singular = [...crossing.filter((l) => l.kind === 'singular').map((l) => l.line), ...touching];
  const xs: number[] = [];
  const ys: number[] = [];
  const ws: number[] = [];
  const ws2: number[] = [];
  let squareDiffers = false;
  const near: number[] = [];
  const blocks: number[] = [];
  for (const poly of pieces) {
    for (const tri of trianglesOfPiece(poly, singular, 1e-12)) {
      // A triangle without a singular edge or vertex may be collapsed toward any vertex: pick one whose opposite
      // edge is axis-parallel, so that the rule's rows share one coordinate (see UnitPairRule.blocks).
      const [v0, v1, v2] = tri.grade === 'none' ? axisEdgeLast(tri.v0, tri.v1, tri.v2) : [tri.v0, tri.v1, tri.v2];
      const rule = collapsedTriangleRule(v0, v1, v2, options.order,
        tri.grade === 'edge'
          ? {
            gradeTowardEdge: tri.tail === undefined
              ? { levels: options.singularLevels, pointsPerPanel: options.gradedPoints, minDistance: 0 }
              : { levels: Math.min(options.singularLevels, tailLevels), pointsPerPanel: options.gradedPoints, minDistance: 0, tailExponent: tri.tail },
          }
          : tri.grade === 'vertex'
            ? { gradeTowardVertex: { levels: options.singularLevels, pointsPerPanel: options.gradedPoints, minDistance: 0 } }
            : undefined);
      if (rule.wSquare !== rule.w) squareDiffers = true;
      const start = xs.length;
      const cols = options.order;
      const rows = rule.w.length / cols;
      blocks.push(start, rows, cols, rowAxis(rule.x, rule.y, 0, rows, cols));
      for (let k = 0; k < rule.w.length; k++) {
        xs.push(rule.x[k]);
        ys.push(rule.y[k]);
        ws.push(rule.w[k]);
        ws2.push(rule.wSquare[k]);
        let d = Infinity;
        for (const l of singular) d = Math.min(d, Math.abs(l.ct * rule.x[k] + l.cs * rule.y[k] + l.c0));
        near.push(d < 1e-6 ? 1 : 0);
      }
    }
  }
  const w = Float64Array.from(ws);
  return {
    x: Float64Array.from(xs), y: Float64Array.from(ys), w, wSquare: squareDiffers ? Float64Array.from(ws2) : w,
    nearSingular: Uint8Array.from(near), blocks: Int32Array.from(blocks),
  };
}
