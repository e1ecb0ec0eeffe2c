/**
 * Figures the checks read from the engine's finest Galerkin matrix A (orthonormal piecewise Legendre basis, panel
 * by panel, degree p). The basis functions of degree ≤ p − k on the same panels form a subset of the basis, so
 * the Galerkin matrix of that smaller space is a principal submatrix of A: eigenvalues and traces of the two
 * discretisations can be compared without assembling anything again, which gives error estimates for eigenvalues
 * beyond the leading ones (the same level-to-level argument as the engine's, K. Atkinson, The Numerical Solution
 * of Integral Equations of the Second Kind, 1997, §3.1 on Galerkin methods with nested subspaces).
 */
import type { LevelSolution } from '../numerics/engine/solveLevel';
import { hermitianEigen, singularValues } from '../numerics/linalg';
import { symmetricTridiagonalQl } from '../numerics/linalg/symmetricTridiagonalQl';
import { timesPow2 } from '../numerics/engine/kernelScale';

/** Indices of the basis functions of local degree ≤ maxDegree. */
export function subBasis(level: LevelSolution, maxDegree: number): number[] {
  const d = level.matrix.discretisation;
  const q = d.degree + 1;
  const panels = d.breakpoints.length - 1;
  const idx: number[] = [];
  for (let p = 0; p < panels; p++) for (let j = 0; j <= Math.min(maxDegree, d.degree); j++) idx.push(p * q + j);
  return idx;
}

function submatrix(level: LevelSolution, idx: readonly number[]): { re: Float64Array; im: Float64Array | null; n: number } {
  const { n, re, im } = level.matrix;
  const m = idx.length;
  const sr = new Float64Array(m * m);
  const si = im ? new Float64Array(m * m) : null;
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < m; j++) {
      sr[i * m + j] = re[idx[i] * n + idx[j]];
      if (si && im) si[i * m + j] = im[idx[i] * n + idx[j]];
    }
  }
  return { re: sr, im: si, n: m };
}

/** How many degrees the comparison discretisation drops: 2 (same parity of Legendre degrees) when possible. */
export function comparisonDrop(level: LevelSolution): number {
  const p = level.matrix.discretisation.degree;
  return p >= 4 ? 2 : p >= 1 ? 1 : 0;
}

const subEigenCache = new WeakMap<LevelSolution, Float64Array>();

/**
 * Eigenvalues (descending by value) of the Hermitian part of the Galerkin matrix on the basis of degree
 * p − comparisonDrop: the coarser of the two compared discretisations. Null when there is no smaller space.
 */
export function coarserHermitianEigenvalues(level: LevelSolution): Float64Array | null {
  const known = subEigenCache.get(level);
  if (known) return known;
  const drop = comparisonDrop(level);
  if (drop === 0 || !finiteEntries(level)) return null;
  const s = submatrix(level, subBasis(level, level.matrix.discretisation.degree - drop));
  // Solved scaled by a power of two (exact) so that the largest entry is about 1: the solvers square entries, which
  // overflow for a kernel of size 1e250 and underflow for 1e-250; the values are scaled back.
  const k = unitExponent(s.re, s.im);
  if (k !== 0) {
    for (let i = 0; i < s.re.length; i++) s.re[i] = timesPow2(s.re[i], -k);
    if (s.im) for (let i = 0; i < s.im.length; i++) s.im[i] = timesPow2(s.im[i], -k);
  }
  let values: Float64Array;
  if (s.im) values = hermitianEigen(s.re, s.im, s.n).values;
  else {
    // The flat real solver is the fastest at hand; it wants exactly symmetric input.
    const m = s.n;
    for (let i = 0; i < m; i++) {
      for (let j = i + 1; j < m; j++) {
        const x = 0.5 * (s.re[i * m + j] + s.re[j * m + i]);
        s.re[i * m + j] = x;
        s.re[j * m + i] = x;
      }
    }
    values = symmetricTridiagonalQl(s.re, m).values;
  }
  if (k !== 0) values = values.map((x) => timesPow2(x, k));
  subEigenCache.set(level, values);
  return values;
}

/** The power of two nearest the largest finite entry (0 when it is within 2^±8 of 1, or there is none). */
function unitExponent(re: Float64Array, im: Float64Array | null): number {
  let m = 0;
  for (let i = 0; i < re.length; i++) {
    const x = Math.max(Math.abs(re[i]), im ? Math.abs(im[i]) : 0);
    if (Number.isFinite(x) && x > m) m = x;
  }
  if (!(m > 0)) return 0;
  const k = Math.round(Math.log2(m));
  return Math.abs(k) <= 8 ? 0 : k;
}

/** Eigenvalues of the Hermitian Galerkin matrix, descending by value (allRe is ordered by modulus). */
export function finestHermitianEigenvalues(level: LevelSolution): Float64Array {
  return Float64Array.from(level.allRe).sort().reverse();
}

/** trace(A) restricted to local degrees ≤ maxDegree: the Galerkin approximation of ∫K(t, t) dt on that space. */
export function subTrace(level: LevelSolution, maxDegree: number): number {
  const { n, re } = level.matrix;
  let sum = 0;
  for (const i of subBasis(level, maxDegree)) sum += re[i * n + i];
  return sum;
}

const singularCache = new WeakMap<LevelSolution, Float64Array>();

const finiteCache = new WeakMap<LevelSolution, boolean>();

/**
 * Whether every entry of the level's matrix is finite. A kernel analysed scaled by a power of two (values near
 * 1e308) gets its figures scaled back, and its matrix entries may then overflow: checks that read entries say
 * nothing (undecided) instead of handing infinities to the solvers.
 */
export function finiteEntries(level: LevelSolution): boolean {
  let known = finiteCache.get(level);
  if (known === undefined) {
    const { re, im } = level.matrix;
    known = true;
    for (let i = 0; i < re.length && known; i++) if (!Number.isFinite(re[i]) || (im && !Number.isFinite(im[i]))) known = false;
    finiteCache.set(level, known);
  }
  return known;
}

/** Singular values of A, descending. */
export function galerkinSingularValues(level: LevelSolution): Float64Array {
  let sv = singularCache.get(level);
  if (!sv) {
    const { n, re, im } = level.matrix;
    sv = singularValues(re, im, n, n);
    singularCache.set(level, sv);
  }
  return sv;
}
