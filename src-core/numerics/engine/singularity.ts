/**
 * How fast |K| grows toward each singular locus: |K| ~ d^(−α) at distance d from the line (or log(1/d)). The
 * exponent decides the operator's class by standard facts (common practice; e.g. R. Kress, Linear Integral
 * Equations, 3rd ed. 2014, §2.3 on weakly singular kernels): along a line, ∫|K| is finite iff α < 1 (then Schur's
 * test bounds the operator), ∫∫|K|² is finite iff α < 1/2 (Hilbert–Schmidt); a logarithm is both. At an isolated
 * point of the square the 2D integrals are finite for α < 2 and α < 1 respectively.
 * The exponent is read from a log–log fit of |K| at distances 10⁻⁴ … 10⁻⁷ of the domain length on both sides of
 * the locus, at several points along it.
 */
import type { CompiledKernel } from '../../semantics/evaluator';
import type { Line, Locus } from './loci';

export interface SingularityEstimate {
  readonly locus: Locus;
  /** 'power' with exponent α > 0, 'log' for logarithmic growth, 'none' when |K| stays bounded. */
  readonly type: 'power' | 'log' | 'none';
  /** α for 'power'; 0 for 'log' and 'none'. */
  readonly exponent: number;
  /** True when the line meets the square in one point only (a corner). */
  readonly point: boolean;
  /** A point on the locus where the growth was measured. */
  readonly at: readonly [number, number];
  readonly integrable: boolean;
  readonly squareIntegrable: boolean;
}

/** End points of the segment where the line meets the square [a, b]², or null. */
export function segmentInSquare(l: Line, a: number, b: number): [[number, number], [number, number]] | null {
  const pts: [number, number][] = [];
  const eps = 1e-12 * (b - a);
  const push = (t: number, s: number) => {
    if (t < a - eps || t > b + eps || s < a - eps || s > b + eps) return;
    const p: [number, number] = [Math.min(b, Math.max(a, t)), Math.min(b, Math.max(a, s))];
    if (!pts.some((q) => Math.abs(q[0] - p[0]) <= eps && Math.abs(q[1] - p[1]) <= eps)) pts.push(p);
  };
  for (const e of [a, b]) {
    if (l.cs !== 0) push(e, -(l.ct * e + l.c0) / l.cs);
    if (l.ct !== 0) push(-(l.cs * e + l.c0) / l.ct, e);
  }
  if (pts.length === 0) return null;
  if (pts.length === 1) return [pts[0], pts[0]];
  pts.sort((p, q) => p[0] - q[0] || p[1] - q[1]);
  return [pts[0], pts[pts.length - 1]];
}

export function estimateSingularity(kernel: CompiledKernel, locus: Locus, a: number, b: number): SingularityEstimate | null {
  const seg = segmentInSquare(locus.line, a, b);
  if (!seg) return null;
  const L = b - a;
  const point = Math.hypot(seg[1][0] - seg[0][0], seg[1][1] - seg[0][1]) <= 1e-12 * L;
  const norm = Math.hypot(locus.line.ct, locus.line.cs);
  const nt = locus.line.ct / norm;
  const ns = locus.line.cs / norm;
  const fractions = point ? [0] : [0.23, 0.5, 0.77];
  const exps = [4, 5, 6, 7];
  let best: { type: SingularityEstimate['type']; exponent: number; at: [number, number] } = { type: 'none', exponent: 0, at: seg[0] };
  const inside = (t: number, s: number) => t >= a && t <= b && s >= a && s <= b;
  const tBuf = new Float64Array(1);
  const sBuf = new Float64Array(1);
  const re = new Float64Array(1);
  const im = new Float64Array(1);
  const absK = (t: number, s: number) => {
    tBuf[0] = t; sBuf[0] = s;
    kernel.evaluateColumns([tBuf, sBuf], re, kernel.complex ? im : null);
    return Math.hypot(re[0], kernel.complex ? im[0] : 0);
  };
  for (const f of fractions) {
    const p: [number, number] = [seg[0][0] + f * (seg[1][0] - seg[0][0]), seg[0][1] + f * (seg[1][1] - seg[0][1])];
    for (const side of [1, -1]) {
      // For a corner point, step into the square along the diagonal direction away from the corner instead.
      let dt = side * nt;
      let ds = side * ns;
      if (point) {
        dt = p[0] <= a ? 1 : -1;
        ds = p[1] <= a ? 1 : -1;
        if (side < 0) continue;
        const h = Math.SQRT1_2;
        dt *= h; ds *= h;
      }
      const ys: number[] = [];
      for (const e of exps) {
        const d = L * 10 ** -e;
        const t = p[0] + d * dt;
        const s = p[1] + d * ds;
        if (!inside(t, s)) break;
        ys.push(absK(t, s));
      }
      if (ys.length < exps.length || !ys.every(Number.isFinite)) continue;
      const logs = ys.map((y) => Math.log(Math.max(y, 1e-300)));
      const slope = (logs[3] - logs[1]) / (2 * Math.LN10); // α ≈ d log|K| / d log(1/d)
      const d1 = ys[2] - ys[1];
      const d2 = ys[3] - ys[2];
      const linearInLog = d1 > 0 && Math.abs(d2 - d1) <= 0.05 * Math.abs(d1);
      let type: SingularityEstimate['type'] = 'none';
      let exponent = 0;
      if (linearInLog && slope < 0.3) type = 'log';
      else if (slope > 0.03) { type = 'power'; exponent = Math.round(slope * 100) / 100; }
      const rankOf = (x: { type: string; exponent: number }) => (x.type === 'power' ? 2 + x.exponent : x.type === 'log' ? 1 : 0);
      if (rankOf({ type, exponent }) > rankOf(best)) best = { type, exponent, at: p };
    }
  }
  // Along a line: bounded iff α < 1 (Schur's test), Hilbert–Schmidt iff α < 1/2. At a corner point the operator
  // is bounded iff α ≤ 1 (α = 1 is the scale-invariant case of Hilbert's inequality for 1/(t + s); G. H. Hardy,
  // J. E. Littlewood & G. Pólya, Inequalities, 1934, §9.1) and Hilbert–Schmidt iff α < 1.
  const power = best.type === 'power';
  return {
    locus, type: best.type, exponent: best.exponent, point, at: best.at,
    integrable: !power || (point ? best.exponent <= 1 + 1e-6 : best.exponent < 1 - 1e-6),
    squareIntegrable: !power || best.exponent < (point ? 1 : 0.5) - 1e-6,
  };
}
