/**
 * Small tools the checks share: Gauss–Legendre grids of the domain, point evaluation of a compiled kernel, the
 * geometry of a locus inside the square (where it runs, its normal, how to name it), and how figures are written
 * in messages (a value to the digits its error allows, followed by ± the error).
 */
import { gaussLegendre, mapRule } from '../numerics/quadrature';
import type { CompiledKernel } from '../semantics/evaluator';
import type { Line } from '../numerics/engine/loci';
import { describeLine } from '../numerics/engine/spectralEngine';
import { segmentInSquare } from '../numerics/engine/singularity';

export interface Grid {
  readonly nodes: Float64Array;
  readonly weights: Float64Array;
}

/** The n-point Gauss–Legendre rule on [a, b] (interior points only: never an end, never shared with n ± 1). */
export function gaussGrid(a: number, b: number, n: number): Grid {
  const r = mapRule(gaussLegendre(n), a, b);
  return { nodes: r.nodes, weights: r.weights };
}

/** Evaluates K at one point at a time, without allocating per call. */
export class PointEvaluator {
  private readonly t = new Float64Array(1);
  private readonly s = new Float64Array(1);
  private readonly re = new Float64Array(1);
  private readonly im = new Float64Array(1);

  constructor(private readonly kernel: CompiledKernel) {}

  get complex(): boolean {
    return this.kernel.complex;
  }

  /** K(t, s) as [re, im]. */
  at(t: number, s: number): [number, number] {
    this.t[0] = t;
    this.s[0] = s;
    this.kernel.evaluateColumns([this.t, this.s], this.re, this.kernel.complex ? this.im : null);
    return [this.re[0], this.kernel.complex ? this.im[0] : 0];
  }

  /** |K(t, s)|. */
  abs(t: number, s: number): number {
    const [r, i] = this.at(t, s);
    return Math.hypot(r, i);
  }
}

/** K on the tensor grid ts × ss: re[i * ss.length + j] = Re K(ts[i], ss[j]). */
export function sampleGrid(kernel: CompiledKernel, ts: Float64Array, ss: Float64Array): { re: Float64Array; im: Float64Array | null } {
  const re = new Float64Array(ts.length * ss.length);
  const im = kernel.complex ? new Float64Array(ts.length * ss.length) : null;
  kernel.evaluateGrid(ts, ss, re, im);
  return { re, im };
}

/** Largest finite |K| on a grid (a scale for relative thresholds); 0 for the zero kernel. */
export function kernelScale(kernel: CompiledKernel, a: number, b: number, n = 24): number {
  const g = gaussGrid(a, b, n);
  const v = sampleGrid(kernel, g.nodes, g.nodes);
  let m = 0;
  for (let k = 0; k < v.re.length; k++) {
    const x = Math.hypot(v.re[k], v.im ? v.im[k] : 0);
    if (Number.isFinite(x) && x > m) m = x;
  }
  return m;
}

/** Where a line runs inside the square: its end points, unit normal, and whether it only touches a corner or an edge. */
export interface LineInSquare {
  readonly from: readonly [number, number];
  readonly to: readonly [number, number];
  readonly normal: readonly [number, number];
  /** The line meets the square in one point only. */
  readonly point: boolean;
  /** The line runs along an edge of the square (only one side of it is inside). */
  readonly onEdge: boolean;
}

export function lineInSquare(line: Line, a: number, b: number): LineInSquare | null {
  const seg = segmentInSquare(line, a, b);
  if (!seg) return null;
  const L = b - a;
  const len = Math.hypot(seg[1][0] - seg[0][0], seg[1][1] - seg[0][1]);
  const n = Math.hypot(line.ct, line.cs);
  const tol = 1e-12 * L;
  const along = (k: 0 | 1, x: number) => Math.abs(seg[0][k] - x) <= tol && Math.abs(seg[1][k] - x) <= tol;
  const onEdge = along(0, a) || along(0, b) || along(1, a) || along(1, b);
  return { from: seg[0], to: seg[1], normal: [line.ct / n, line.cs / n], point: len <= tol, onEdge };
}

/** Points at the given fractions along the part of the line inside the square. */
export function pointsAlong(l: LineInSquare, fractions: readonly number[]): [number, number][] {
  return fractions.map((f) => [l.from[0] + f * (l.to[0] - l.from[0]), l.from[1] + f * (l.to[1] - l.from[1])]);
}

/**
 * “the diagonal t = s”, “the line t = 0.5”, “the line t − s = 5”, “the line t + 2·s = 1”, or for a line that only
 * touches the square, “the corner (t, s) = (0, 0)”.
 */
export function describePlace(line: Line, a: number, b: number): string {
  const l = lineInSquare(line, a, b);
  if (l?.point) return `the corner (t, s) = (${fmt(l.from[0])}, ${fmt(l.from[1])})`;
  const { ct, cs, c0 } = line;
  if (ct === 0 || cs === 0 || (ct === -cs && c0 === 0)) return describeLine({ line, kind: 'kink', range: { start: 0, end: 0 } });
  // ct·t + cs·s = −c0, scaled so that t has coefficient 1.
  const k = cs / ct;
  const rhs = -c0 / ct;
  const coefficient = Math.abs(k) === 1 ? '' : `${fmt(Math.abs(k))}·`;
  return `the line t ${k < 0 ? '−' : '+'} ${coefficient}s = ${fmt(rhs)}`;
}

export function inSquare(t: number, s: number, a: number, b: number): boolean {
  return t >= a && t <= b && s >= a && s <= b;
}

// ---------- figures in messages ----------

/** A number with `digits` significant digits, trailing zeros trimmed. */
export function fmt(x: number, digits = 6): string {
  if (Number.isNaN(x)) return 'NaN';
  if (!Number.isFinite(x)) return x > 0 ? '∞' : '-∞';
  if (x === 0) return '0';
  const a = Math.abs(x);
  const written = a < 1e-4 || a >= 1e7 ? x.toExponential(Math.max(0, digits - 1)) : x.toPrecision(digits);
  const [mantissa, exponent] = written.split('e');
  const trimmed = mantissa.includes('.') ? mantissa.replace(/\.?0+$/, '') : mantissa;
  return exponent === undefined ? trimmed : `${trimmed}e${exponent.replace('+', '')}`;
}

/**
 * The product of the factors with `digits` significant digits, also when it lies beyond the double range (a
 * square of 1e154 is written 1.8e308 rather than ∞): exponents are added in base 10.
 */
export function fmtProduct(factors: readonly number[], digits = 6): string {
  const p = factors.reduce((x, y) => x * y, 1);
  if (Number.isFinite(p) && (p === 0 ? factors.some((f) => f === 0) : Math.abs(p) >= 2 ** -1022)) return fmt(p, digits);
  if (factors.some((f) => !Number.isFinite(f))) return fmt(p, digits);
  const negative = factors.filter((f) => f < 0).length % 2 === 1;
  const log = factors.reduce((acc, f) => acc + Math.log10(Math.abs(f)), 0);
  let exponent = Math.floor(log);
  let mantissa = Number((10 ** (log - exponent)).toPrecision(digits));
  if (mantissa >= 10) { mantissa /= 10; exponent += 1; }
  return `${negative ? '-' : ''}${fmt(mantissa, digits)}e${exponent}`;
}

/** `value ± error`, the value to the digits the error allows (plus a guard digit), the error to two digits. */
export function fmtEstimate(value: number, error: number): string {
  if (!Number.isFinite(error)) return `${fmt(value, 4)} ± ?`;
  const m = Math.abs(value);
  let digits = 6;
  if (m > 0 && error > 0) digits = Math.max(2, Math.min(15, Math.floor(Math.log10(m)) - Math.floor(Math.log10(error)) + 2));
  else if (error === 0) digits = 15;
  return `${fmt(value, digits)} ± ${fmt(error, 2)}`;
}

/** A complex number, e.g. `0.5`, `-1i`, `0.25 - 0.5i`. */
export function fmtComplex(re: number, im: number, digits = 6): string {
  if (im === 0) return fmt(re, digits);
  if (re === 0) return `${fmt(im, digits)}i`;
  return `${fmt(re, digits)} ${im < 0 ? '-' : '+'} ${fmt(Math.abs(im), digits)}i`;
}
