/**
 * Points on a curve the expression analysis could not place on a straight line (the zero set of a non-affine
 * expression g(t, s), such as t² + s² − 1 or t − s²). The square is scanned on a 33 × 33 grid; on every grid edge
 * where g changes sign the crossing is found by bisection, and the curve's unit normal there is the normalised
 * gradient of g (central differences). A few crossings spread over the curve are kept.
 */
import type { IrNode } from '../semantics/ir';
import { compileKernel } from '../semantics/evaluator';
import { mayBeComplex } from '../semantics/lower';
import { slotCountOf } from '../semantics/irTools';

export interface CurvePoint {
  readonly t: number;
  readonly s: number;
  /** Unit normal of the curve at the point. */
  readonly normal: readonly [number, number];
}

/**
 * The same zero set through a simpler expression: abs, sqrt, conj, negation and positive constant powers are peeled
 * off (abs(g) never changes sign, g does), inside the `let` bindings that close the expression over its variables.
 */
export function signChangingPart(node: IrNode): IrNode {
  switch (node.op) {
    case 'let': return { ...node, body: signChangingPart(node.body) };
    case 'neg': return signChangingPart(node.a);
    case 'call':
      return node.fn === 'abs' || node.fn === 'sqrt' || node.fn === 'conj' ? signChangingPart(node.args[0]) : node;
    case 'pow':
      return node.b.op === 'const' && node.b.im === 0 && node.b.re > 0 ? signChangingPart(node.a) : node;
    default: return node;
  }
}

export function findCrossings(zeroOf: IrNode, a: number, b: number, max = 6): CurvePoint[] {
  const node = signChangingPart(zeroOf);
  const slots = slotCountOf(node);
  const complex = mayBeComplex(node, slots);
  if (complex) return [];
  const g = compileKernel({ root: node, arity: 2, slotCount: slots, complex: false });
  const tb = new Float64Array(1);
  const sb = new Float64Array(1);
  const out = new Float64Array(1);
  const at = (t: number, s: number) => {
    tb[0] = t; sb[0] = s;
    g.evaluateColumns([tb, sb], out, null);
    return out[0];
  };
  const m = 33;
  const h = (b - a) / (m - 1);
  const xs = Array.from({ length: m }, (_, k) => (k + 1 === m ? b : a + k * h));
  const values: number[][] = xs.map((t) => xs.map((s) => at(t, s)));
  const found: CurvePoint[] = [];
  const bisect = (t0: number, s0: number, t1: number, s1: number, v0: number) => {
    let lo = 0;
    let hi = 1;
    for (let it = 0; it < 60; it++) {
      const mid = 0.5 * (lo + hi);
      const v = at(t0 + mid * (t1 - t0), s0 + mid * (s1 - s0));
      if (!Number.isFinite(v)) break;
      if (Math.sign(v) === Math.sign(v0)) lo = mid;
      else hi = mid;
    }
    const x = 0.5 * (lo + hi);
    const t = t0 + x * (t1 - t0);
    const s = s0 + x * (s1 - s0);
    const d = 1e-6 * (b - a);
    let gt = (at(t + d, s) - at(t - d, s)) / (2 * d);
    let gs = (at(t, s + d) - at(t, s - d)) / (2 * d);
    let n = Math.hypot(gt, gs);
    if (!(n > 0) || !Number.isFinite(n)) {
      // Along the grid edge that crosses the curve, when the gradient is not available.
      gt = t1 - t0; gs = s1 - s0; n = Math.hypot(gt, gs);
    }
    found.push({ t, s, normal: [gt / n, gs / n] });
  };
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < m; j++) {
      const v = values[i][j];
      if (!Number.isFinite(v) || v === 0) continue;
      for (const [di, dj] of [[1, 0], [0, 1]] as const) {
        if (i + di >= m || j + dj >= m) continue;
        const w = values[i + di][j + dj];
        if (Number.isFinite(w) && w !== 0 && Math.sign(w) !== Math.sign(v)) bisect(xs[i], xs[j], xs[i + di], xs[j + dj], v);
      }
    }
  }
  if (found.length <= max) return found;
  const step = found.length / max;
  return Array.from({ length: max }, (_, k) => found[Math.floor((k + 0.5) * step)]);
}

/**
 * Isolated zeros of g on the square where g does not change sign (an interior point such as (1/2, 1/2) of
 * (t − 1/2)² + (s − 1/2)², which no sign change reveals): the smallest |g| on the 33 × 33 grid and on the diagonal,
 * refined by shrinking a 5 × 5 pattern around the best point 40 times; kept when |g| there is below 10⁻¹² of max |g|.
 */
export function findIsolatedZeros(zeroOf: IrNode, a: number, b: number): { t: number; s: number }[] {
  const node = signChangingPart(zeroOf);
  const slots = slotCountOf(node);
  const complex = mayBeComplex(node, slots);
  const g = compileKernel({ root: node, arity: 2, slotCount: slots, complex });
  const tb = new Float64Array(1);
  const sb = new Float64Array(1);
  const re = new Float64Array(1);
  const im = new Float64Array(1);
  const at = (t: number, s: number) => {
    tb[0] = Math.min(b, Math.max(a, t)); sb[0] = Math.min(b, Math.max(a, s));
    g.evaluateColumns([tb, sb], re, complex ? im : null);
    return Math.hypot(re[0], complex ? im[0] : 0);
  };
  const m = 33;
  const h = (b - a) / (m - 1);
  let best = { t: a, s: a, v: Infinity };
  let scale = 0;
  const consider = (t: number, s: number) => {
    const v = at(t, s);
    if (!Number.isFinite(v)) return;
    scale = Math.max(scale, v);
    if (v < best.v) best = { t, s, v };
  };
  for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) consider(a + i * h, a + j * h);
  for (let i = 0; i < 4 * m; i++) { const x = a + ((b - a) * (i + 0.5)) / (4 * m); consider(x, x); }
  if (!(scale > 0) || !Number.isFinite(best.v)) return [];
  let step = h;
  for (let it = 0; it < 40; it++) {
    const centre = best;
    for (let i = -2; i <= 2; i++) for (let j = -2; j <= 2; j++) consider(centre.t + (i * step) / 2, centre.s + (j * step) / 2);
    step /= 2;
  }
  const t = Math.min(b, Math.max(a, best.t));
  const s = Math.min(b, Math.max(a, best.s));
  return at(t, s) <= 1e-12 * scale ? [{ t, s }] : [];
}
