/**
 * Eigenfunctions on a uniform grid of the domain from the Galerkin coefficient vectors: φ(x) = Σ c_j φ_j(x) with the
 * piecewise orthonormal Legendre basis, so unit coefficient vectors give L²-normalised functions (orthonormal for
 * Hermitian kernels). Each function's phase is fixed so that its value of largest modulus is real and positive.
 */
import { panelBasis } from '../quadrature';
import type { Eigenfunctions } from '../../analysis/types';
import type { LevelSolution } from './solveLevel';

/** Basis values at the points x (rows = points), panel by panel; `panelOf[k]` is the panel of point k. */
export function basisAtPoints(breakpoints: readonly number[], degree: number, x: Float64Array): { values: Float64Array; panelOf: Int32Array } {
  const q = degree + 1;
  const panels = breakpoints.length - 1;
  const values = new Float64Array(x.length * q);
  const panelOf = new Int32Array(x.length);
  let p = 0;
  for (let k = 0; k < x.length; k++) {
    while (p + 1 < panels && x[k] > breakpoints[p + 1]) p++;
    while (p > 0 && x[k] < breakpoints[p]) p--;
    panelOf[k] = p;
  }
  for (let p2 = 0; p2 < panels; p2++) {
    const idx: number[] = [];
    for (let k = 0; k < x.length; k++) if (panelOf[k] === p2) idx.push(k);
    if (idx.length === 0) continue;
    const pts = Float64Array.from(idx, (k) => Math.min(breakpoints[p2 + 1], Math.max(breakpoints[p2], x[k])));
    const b = panelBasis(pts, breakpoints[p2], breakpoints[p2 + 1], degree);
    idx.forEach((k, r) => values.set(b.subarray(r * q, r * q + q), k * q));
  }
  return { values, panelOf };
}

export function evaluateExpansion(
  basis: { values: Float64Array; panelOf: Int32Array }, degree: number, coefRe: Float64Array, coefIm: Float64Array | null,
): { re: Float64Array; im: Float64Array | null } {
  const q = degree + 1;
  const m = basis.panelOf.length;
  const re = new Float64Array(m);
  const im = coefIm ? new Float64Array(m) : null;
  for (let k = 0; k < m; k++) {
    const off = basis.panelOf[k] * q;
    let sr = 0;
    let si = 0;
    for (let j = 0; j < q; j++) {
      const b = basis.values[k * q + j];
      sr += coefRe[off + j] * b;
      if (coefIm) si += coefIm[off + j] * b;
    }
    re[k] = sr;
    if (im) im[k] = si;
  }
  return { re, im };
}

export function sampleEigenfunctions(level: LevelSolution, a: number, b: number, points: number, count: number): Eigenfunctions {
  const m = Math.max(2, points);
  const grid = new Float64Array(m);
  for (let k = 0; k < m; k++) grid[k] = k + 1 === m ? b : a + ((b - a) * k) / (m - 1);
  const d = level.matrix.discretisation;
  const basis = basisAtPoints(d.breakpoints, d.degree, grid);
  const re: number[][] = [];
  const im: number[][] = [];
  let complex = false;
  for (const pair of level.pairs.slice(0, count)) {
    const v = evaluateExpansion(basis, d.degree, pair.vecRe, pair.vecIm);
    // Phase: make the value of largest modulus real and positive.
    let best = 0;
    let bestAbs = -1;
    for (let k = 0; k < m; k++) {
      const abs = Math.hypot(v.re[k], v.im ? v.im[k] : 0);
      if (abs > bestAbs) { bestAbs = abs; best = k; }
    }
    const pr = v.re[best] / (bestAbs || 1);
    const pi = v.im ? v.im[best] / (bestAbs || 1) : 0;
    // multiply by conj(phase)
    const outRe: number[] = [];
    const outIm: number[] = [];
    for (let k = 0; k < m; k++) {
      const xr = v.re[k];
      const xi = v.im ? v.im[k] : 0;
      outRe.push(xr * pr + xi * pi);
      outIm.push(xi * pr - xr * pi);
    }
    if (outIm.some((y) => Math.abs(y) > 1e-12 * (bestAbs || 1))) complex = true;
    re.push(outRe);
    im.push(outIm);
  }
  return { grid: Array.from(grid), re, im: complex ? im : null };
}
