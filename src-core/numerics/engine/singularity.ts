/**
 * How fast |K| grows toward each singular locus: |K| ~ d^(−α) at distance d from the line (or log(1/d)), and what
 * that says about the operator on L²[a, b]. Standard facts (common practice; R. Kress, Linear Integral Equations,
 * 3rd ed. 2014, §2.3 on weakly singular kernels; P. R. Halmos & V. S. Sunder, Bounded Integral Operators on L²
 * Spaces, 1978, §5), by the geometry of the locus:
 *  - an oblique line (t = s, t + s = 1: both variables move along it): ∫|K| ds is bounded uniformly for α < 1, so
 *    Schur's test bounds T; for α ≥ 1, K is not integrable across the line (unbounded; a kernel of one sign near the
 *    line, tested with an indicator function there); ∫∫|K|² is finite iff α < 1/2;
 *  - an axis-parallel line t = c (or s = c): K ≈ |t − c|^(−α)·h(t, s) with h(c, ·) ≠ 0 where measured, so
 *    Tf ≈ |t − c|^(−α)·∫h(c, s) f(s) ds, which is in L² iff α < 1/2 (a test function f supported where h(c, ·) has
 *    one sign); bounded iff Hilbert–Schmidt iff α < 1/2 (so (t·s)^(−0.6) is unbounded: t^(−0.6) ∉ L²);
 *  - a point (a corner, or a line that touches the square there only): if |K| ≤ C·r^(−α) in every direction, ∫∫|K|²
 *    is finite for α < 1 (polar coordinates), and for α ≤ 1 T is dominated by C/(t + s), bounded by Hilbert's
 *    inequality (G. H. Hardy, J. E. Littlewood & G. Pólya, Inequalities, 1934, §9.1); if |K| ≥ c·r^(−α) along the
 *    diagonal direction, f_ε = ε^(−1/2) on [ε, (1 + δ)ε] gives ⟨Kf_ε, f_ε⟩ ~ ε^(1−α) (unbounded for α > 1) and |K|²
 *    is not integrable for α ≥ 1. The upper exponent is the largest over five directions, the lower one the diagonal's
 *    or, where two neighbouring directions both grow, the sector's between them (the same arguments in that sector).
 * The exponent is measured by log–log slopes of |K| at distances 10⁻⁴ … 10⁻⁷ of the domain length (on both sides of a
 * line, at three points along it), with an error of three times the difference between the slopes of the two halves
 * (at least 0.002). Where the expression states it (Locus.written) and the measurement agrees, the written value is
 * used exactly. A verdict is 'holds' or 'fails' only when the exponent's interval lies on one side of the threshold;
 * otherwise 'undecided'.
 */
import type { CompiledKernel } from '../../semantics/evaluator';
import type { Line, Locus } from './loci';

export type LocalVerdict = 'holds' | 'fails' | 'undecided';

export type LocusGeometry = 'point' | 'axis' | 'oblique';

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
  /** False only when the operator is surely unbounded (the engine then computes no spectrum). */
  readonly integrable: boolean;
  /** True only when the singularity is surely square-integrable (the engine then estimates ‖K‖_HS). */
  readonly squareIntegrable: boolean;
  readonly geometry: LocusGeometry;
  /** Error of the exponent: 0 when it is read from the expression. */
  readonly exponentError: number;
  /** True when the exponent (or the logarithm) was read from the expression and confirmed by the measurement. */
  readonly written: boolean;
  readonly bounded: LocalVerdict;
  readonly hilbertSchmidt: LocalVerdict;
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


interface Growth {
  readonly type: SingularityEstimate['type'];
  readonly exponent: number;
  readonly error: number;
}

/** The growth of |K| from a point p into the square along the unit direction (dt, ds); null when not measurable. */
function growthAlong(absK: (t: number, s: number) => number, p: readonly [number, number], dt: number, ds: number,
  a: number, b: number): Growth | null {
  const L = b - a;
  const ys: number[] = [];
  for (const e of [4, 5, 6, 7]) {
    const d = L * 10 ** -e;
    const t = p[0] + d * dt;
    const s = p[1] + d * ds;
    if (!(t >= a && t <= b && s >= a && s <= b)) return null;
    ys.push(absK(t, s));
  }
  if (!ys.every(Number.isFinite)) return null;
  const logs = ys.map((y) => Math.log(Math.max(y, 1e-300)));
  const slope1 = (logs[2] - logs[0]) / (2 * Math.LN10);
  const slope2 = (logs[3] - logs[1]) / (2 * Math.LN10); // α ≈ d log|K| / d log(1/d)
  const d1 = ys[2] - ys[1];
  const d2 = ys[3] - ys[2];
  const linearInLog = d1 > 0 && Math.abs(d2 - d1) <= 0.05 * Math.abs(d1);
  const error = Math.max(3 * Math.abs(slope2 - slope1), 2e-3);
  if (linearInLog && slope2 < 0.3) return { type: 'log', exponent: 0, error: 0 };
  if (slope2 > 0.03) return { type: 'power', exponent: slope2, error };
  return { type: 'none', exponent: 0, error: 0 };
}

function rankOf(g: Growth): number {
  return g.type === 'power' ? 2 + g.exponent : g.type === 'log' ? 1 : 0;
}

function verdict(holdsIf: boolean, failsIf: boolean): LocalVerdict {
  return holdsIf ? 'holds' : failsIf ? 'fails' : 'undecided';
}

const verdictRank: Record<LocalVerdict, number> = { holds: 0, undecided: 1, fails: 2 };

/**
 * The growth toward a locus, and toward the corners of the square where it ends: a line on which K stays bounded
 * may still end in a point singularity (`t > s ? 1/t : 0`, Hardy's averaging operator, is 0 along t = 0 and grows
 * like 1/t into the corner (0, 0) from the side t > s). The worse of the line's and the corners' verdicts is
 * returned; a corner that is worse makes the estimate a point estimate there.
 */
export function estimateSingularity(kernel: CompiledKernel, locus: Locus, a: number, b: number): SingularityEstimate | null {
  const seg = segmentInSquare(locus.line, a, b);
  if (!seg) return null;
  const line = estimateAlong(kernel, locus, seg, a, b);
  if (line.point) return line;
  const L = b - a;
  const isCorner = (p: readonly [number, number]) => [p[0], p[1]].every((x) => Math.abs(x - a) <= 1e-12 * L || Math.abs(x - b) <= 1e-12 * L);
  let worst = line;
  for (const end of [seg[0], seg[1]]) {
    if (!isCorner(end)) continue;
    const corner = estimateAlong(kernel, locus, [end, end], a, b);
    const worse = verdictRank[corner.bounded] > verdictRank[worst.bounded]
      || (corner.bounded === worst.bounded && verdictRank[corner.hilbertSchmidt] > verdictRank[worst.hilbertSchmidt]);
    if (worse) worst = corner;
  }
  return worst;
}

function estimateAlong(kernel: CompiledKernel, locus: Locus, seg: [readonly [number, number], readonly [number, number]], a: number, b: number): SingularityEstimate {
  const L = b - a;
  const point = Math.hypot(seg[1][0] - seg[0][0], seg[1][1] - seg[0][1]) <= 1e-12 * L;
  const geometry: LocusGeometry = point ? 'point' : locus.line.ct === 0 || locus.line.cs === 0 ? 'axis' : 'oblique';
  const tBuf = new Float64Array(1);
  const sBuf = new Float64Array(1);
  const re = new Float64Array(1);
  const im = new Float64Array(1);
  const absK = (t: number, s: number) => {
    tBuf[0] = t; sBuf[0] = s;
    kernel.evaluateColumns([tBuf, sBuf], re, kernel.complex ? im : null);
    return Math.hypot(re[0], kernel.complex ? im[0] : 0);
  };
  const none = { type: 'none' as const, exponent: 0, error: 0 };
  let worst: Growth = none;
  let at: [number, number] = [seg[0][0], seg[0][1]];
  let upper = 0; // the largest α + error over all measurements (growth is at most this)
  let lower = -Infinity; // the lower end of the exponent where growth is surely at least that (diagonal direction at a point)
  const measured: Growth[] = [];
  // At a point: the directions in order (null where not measured), for the sectors between neighbours.
  const directions: (Growth | null)[] = [];
  if (point) {
    const p = seg[0];
    const ut = p[0] <= a + 1e-12 * L ? 1 : -1;
    const us = p[1] <= a + 1e-12 * L ? 1 : -1;
    for (const theta of [0, Math.PI / 8, Math.PI / 4, (3 * Math.PI) / 8, Math.PI / 2]) {
      const g = growthAlong(absK, p, ut * Math.cos(theta), us * Math.sin(theta), a, b);
      directions.push(g);
      if (!g) continue;
      measured.push(g);
      if (g.type === 'power') upper = Math.max(upper, g.exponent + g.error);
      if (theta === Math.PI / 4 && g.type === 'power') lower = g.exponent - g.error;
      if (rankOf(g) > rankOf(worst)) { worst = g; at = [p[0], p[1]]; }
    }
  } else {
    const norm = Math.hypot(locus.line.ct, locus.line.cs);
    const nt = locus.line.ct / norm;
    const ns = locus.line.cs / norm;
    for (const f of [0.23, 0.5, 0.77]) {
      const p: [number, number] = [seg[0][0] + f * (seg[1][0] - seg[0][0]), seg[0][1] + f * (seg[1][1] - seg[0][1])];
      for (const side of [1, -1]) {
        const g = growthAlong(absK, p, side * nt, side * ns, a, b);
        if (!g) continue;
        measured.push(g);
          if (g.type === 'power') {
          upper = Math.max(upper, g.exponent + g.error);
          lower = Math.max(lower, g.exponent - g.error);
        }
        if (rankOf(g) > rankOf(worst)) { worst = g; at = p; }
      }
    }
  }
  // A sector of directions at a point where |K| grows at least like r^(−α) (two neighbouring directions): ∫∫|K|²
  // diverges there for α ≥ 1 (polar coordinates), and test functions concentrated in it show T unbounded for α > 1.
  let sector = -Infinity;
  for (let i = 0; i + 1 < directions.length; i++) {
    const g = directions[i];
    const h = directions[i + 1];
    if (g?.type === 'power' && h?.type === 'power') sector = Math.max(sector, Math.min(g.exponent - g.error, h.exponent - h.error));
  }
  // The written exponent, when every measurement of a power agrees with it (within its error and 0.02); directions
  // or sides where K stays bounded (a kernel that is zero on one side) do not contradict it.
  let written = false;
  const w = locus.written;
  if (w && w.type === 'power' && worst.type === 'power' && measured.length > 0
    && measured.every((g) => g.type === 'none' || (g.type === 'power' && Math.abs(g.exponent - w.exponent) <= g.error + 0.02))) {
    worst = { type: 'power', exponent: w.exponent, error: 0 };
    upper = w.exponent;
    if (!point || directions[2]?.type === 'power') lower = w.exponent;
    if (sector > -Infinity) sector = w.exponent;
    written = true;
  } else if (w && w.type === 'log' && worst.type === 'log') {
    written = true;
  }
  const power = worst.type === 'power';
  const hiBound = upper;
  let bounded: LocalVerdict;
  let hilbertSchmidt: LocalVerdict;
  if (!power) {
    // A logarithm (or no growth) is square-integrable in every geometry.
    bounded = 'holds';
    hilbertSchmidt = 'holds';
  } else if (geometry === 'oblique') {
    bounded = verdict(hiBound < 1, lower >= 1);
    hilbertSchmidt = verdict(hiBound < 0.5, lower >= 0.5);
  } else if (geometry === 'axis') {
    bounded = verdict(hiBound < 0.5, lower >= 0.5);
    hilbertSchmidt = bounded;
  } else {
    bounded = verdict(hiBound <= 1, Math.max(lower, sector) > 1);
    hilbertSchmidt = verdict(hiBound < 1, Math.max(lower, sector) >= 1);
  }
  return {
    locus, type: worst.type, exponent: worst.exponent, point, at,
    integrable: bounded !== 'fails',
    squareIntegrable: hilbertSchmidt === 'holds',
    geometry, exponentError: worst.error, written, bounded, hilbertSchmidt,
  };
}
