/**
 * Two readings of an expression that loci.ts needs beyond straight lines.
 *
 * Removable singularities: a quotient g/ℓ with ℓ affine and g analytic is analytic across the line ℓ = 0 when g
 * vanishes there (Hadamard's lemma: g = ℓ·h with h analytic; common practice). `isAnalytic` accepts only operations
 * that are analytic on the reals (polynomials, exp, sin, cos, sinh, cosh, tanh, atan, erf, whole powers, division by
 * a constant); `vanishesOn` proves g = 0 on ℓ = 0 symbolically: an affine multiple of ℓ, a product with such a factor,
 * sin, sinh, tan, tanh, atan, erf or a whole power of such a part, a sum of parts that vanish, or, on the diagonal,
 * a − b where b is a with t and s exchanged (sin(t) − sin(s)).
 *
 * Points and edges: a power, log, sqrt or division whose argument g is not affine may still vanish only at a corner
 * of the square (max(t, s), t² + s²) or along a whole edge (sin(t)). `pointLoci` finds them numerically: g is
 * exactly zero (within rounding) at the corner, or at 17 points along the edge. A corner is returned as the line
 * that touches the square at that corner only (t + s = 2a at (a, a), t − s = a − b at (a, b), and so on), which is
 * how the engine already reads log(t + s): its singularity estimate steps into the square from the point, and the
 * mesh grades toward it. The zero set is *explained* (nothing else is left to find) when g has one sign on a 49 × 49
 * grid and every grid point where |g| is within 10⁻³ of its maximum lies within two grid steps of a found corner or
 * edge.
 */
import type { IrNode } from '../../semantics/ir';
import type { Line } from './loci';

type Lookup = (slot: number) => IrNode | undefined;
type AffineOf = (n: IrNode) => { ct: number; cs: number; c0: number } | null;

const analyticCalls = new Set(['sin', 'cos', 'exp', 'sinh', 'cosh', 'tanh', 'atan', 'erf']);
const oddCalls = new Set(['sin', 'sinh', 'tanh', 'atan', 'erf']);

function isConstant(n: IrNode): boolean {
  return n.op === 'const';
}

export function isAnalytic(n: IrNode, lookup: Lookup, depth = 0): boolean {
  if (depth > 200) return false;
  const rec = (m: IrNode) => isAnalytic(m, lookup, depth + 1);
  switch (n.op) {
    case 'const': return true;
    case 'var': {
      if (n.slot < 2) return true;
      const b = lookup(n.slot);
      return b !== undefined && rec(b);
    }
    case 'neg': return rec(n.a);
    case 'let': return rec(n.value) && rec(n.body);
    case 'add': case 'sub': case 'mul': return rec(n.a) && rec(n.b);
    case 'div': return n.b.op === 'const' && (n.b.re !== 0 || n.b.im !== 0) && rec(n.a);
    case 'pow':
      if (n.b.op === 'const' && n.b.im === 0 && Number.isInteger(n.b.re) && n.b.re >= 0) return rec(n.a);
      return n.a.op === 'const' && n.a.im === 0 && n.a.re > 0 && rec(n.b);
    case 'call': return analyticCalls.has(n.fn) && n.args.every(rec);
    default: return false;
  }
}

function sameLine(p: Line, q: Line): boolean {
  const tol = 1e-12;
  return Math.abs(p.ct - q.ct) < tol && Math.abs(p.cs - q.cs) < tol && Math.abs(p.c0 - q.c0) < tol * (1 + Math.abs(p.c0));
}

function normalise(a: { ct: number; cs: number; c0: number }): Line | null {
  const m = Math.max(Math.abs(a.ct), Math.abs(a.cs));
  if (!(m > 0) || !Number.isFinite(m)) return null;
  const lead = Math.abs(a.ct) > 0 ? a.ct : a.cs;
  const k = (lead < 0 ? -1 : 1) / m;
  return { ct: a.ct * k, cs: a.cs * k, c0: a.c0 * k };
}

/** x and y are the same expression with t and s exchanged (bindings followed). */
function swapped(x: IrNode, y: IrNode, lookup: Lookup, depth = 0): boolean {
  if (depth > 200) return false;
  const open = (n: IrNode): IrNode => {
    let m = n;
    for (let k = 0; k < 50 && (m.op === 'var' && m.slot >= 2 || m.op === 'let'); k++) {
      if (m.op === 'let') m = m.body;
      else { const b = lookup(m.slot); if (!b) return m; m = b; }
    }
    return m;
  };
  const p = open(x);
  const q = open(y);
  const rec = (u: IrNode, v: IrNode) => swapped(u, v, lookup, depth + 1);
  if (p.op !== q.op) return false;
  switch (p.op) {
    case 'const': return q.op === 'const' && p.re === q.re && p.im === q.im;
    case 'var': return q.op === 'var' && p.slot < 2 && q.slot === 1 - p.slot;
    case 'neg': case 'not': return (q.op === 'neg' || q.op === 'not') && rec(p.a, q.a);
    case 'call': return q.op === 'call' && p.fn === q.fn && p.args.length === q.args.length && p.args.every((u, k) => rec(u, q.args[k]));
    case 'cond': return q.op === 'cond' && rec(p.test, q.test) && rec(p.then, q.then) && rec(p.otherwise, q.otherwise);
    case 'let': return false;
    default: return 'a' in q && 'b' in q && rec(p.a, q.a) && rec(p.b, q.b);
  }
}

/** A proof that n = 0 on the line (false when no proof is found, not a proof of the contrary). */
export function vanishesOn(n: IrNode, line: Line, affine: AffineOf, lookup: Lookup, depth = 0): boolean {
  if (depth > 200) return false;
  const rec = (m: IrNode) => vanishesOn(m, line, affine, lookup, depth + 1);
  const a = affine(n);
  if (a) {
    if (a.ct === 0 && a.cs === 0) return a.c0 === 0;
    const l = normalise(a);
    return l !== null && sameLine(l, line);
  }
  switch (n.op) {
    case 'const': return n.re === 0 && n.im === 0;
    case 'var': { const b = n.slot >= 2 ? lookup(n.slot) : undefined; return b !== undefined && rec(b); }
    case 'let': return rec(n.body);
    case 'neg': return rec(n.a);
    case 'mul': return rec(n.a) || rec(n.b);
    case 'div': return isConstant(n.b) && rec(n.a);
    case 'add': return rec(n.a) && rec(n.b);
    case 'sub': {
      if (rec(n.a) && rec(n.b)) return true;
      const diagonal = line.ct === 1 && line.cs === -1 && line.c0 === 0;
      return diagonal && swapped(n.a, n.b, lookup);
    }
    case 'pow':
      return n.b.op === 'const' && n.b.im === 0 && Number.isInteger(n.b.re) && n.b.re >= 1 && rec(n.a);
    case 'call': return (oddCalls.has(n.fn) || n.fn === 'tan') && n.args.length === 1 && rec(n.args[0]);
    default: return false;
  }
}

export interface PointLocusFinding {
  readonly evaluate: (t: number, s: number) => { re: number; im: number };
}

/** Corners and edges of [a, b]² where g vanishes, as lines (see the header), and whether they explain all zeros. */
export function pointLoci(g: PointLocusFinding['evaluate'], a: number, b: number): { lines: Line[]; explained: boolean } {
  const m = 49;
  const h = (b - a) / (m - 1);
  const xs = Array.from({ length: m }, (_, k) => (k + 1 === m ? b : a + k * h));
  const values: number[][] = [];
  let scale = 0;
  let pos = false;
  let neg = false;
  let finite = true;
  for (const t of xs) {
    const row: number[] = [];
    for (const s of xs) {
      const v = g(t, s);
      const mag = Math.hypot(v.re, v.im);
      if (!Number.isFinite(mag)) finite = false;
      else scale = Math.max(scale, mag);
      if (v.im === 0 && v.re > 0) pos = true;
      if (v.im === 0 && v.re < 0) neg = true;
      row.push(mag);
    }
    values.push(row);
  }
  if (!(scale > 0)) return { lines: [], explained: false };
  const zero = (t: number, s: number) => {
    const v = g(t, s);
    return Math.hypot(v.re, v.im) <= 1e-13 * scale;
  };
  const lines: Line[] = [];
  const edges: { axis: 0 | 1; at: number }[] = [];
  for (const axis of [0, 1] as const) {
    for (const at of [a, b]) {
      let all = true;
      for (let k = 0; k <= 16 && all; k++) {
        const x = a + ((b - a) * k) / 16;
        all = axis === 0 ? zero(at, x) : zero(x, at);
      }
      if (all) {
        edges.push({ axis, at });
        const l = normalise(axis === 0 ? { ct: 1, cs: 0, c0: -at } : { ct: 0, cs: 1, c0: -at });
        if (l) lines.push(l);
      }
    }
  }
  const corners: [number, number][] = [];
  for (const [t, s] of [[a, a], [a, b], [b, a], [b, b]] as const) {
    const onEdge = edges.some((e) => (e.axis === 0 ? t : s) === e.at);
    if (onEdge || !zero(t, s)) continue;
    corners.push([t, s]);
    const l = normalise(t === s ? { ct: 1, cs: 1, c0: -2 * t } : { ct: 1, cs: -1, c0: s - t });
    if (l) lines.push(l);
  }
  if (lines.length === 0 || !finite || (pos && neg)) return { lines, explained: false };
  let explained = true;
  for (let i = 0; i < m && explained; i++) {
    for (let j = 0; j < m && explained; j++) {
      if (values[i][j] > 1e-3 * scale) continue;
      const t = xs[i];
      const s = xs[j];
      const near = corners.some(([ct, cs]) => Math.max(Math.abs(t - ct), Math.abs(s - cs)) <= 2.01 * h)
        || edges.some((e) => Math.abs((e.axis === 0 ? t : s) - e.at) <= 2.01 * h);
      if (!near) explained = false;
    }
  }
  return { lines, explained };
}
