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
  if (drop === 0) return null;
  const s = submatrix(level, subBasis(level, level.matrix.discretisation.degree - drop));
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
  subEigenCache.set(level, values);
  return values;
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
