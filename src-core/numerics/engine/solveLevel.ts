/**
 * Eigenvalues, eigenvectors and the largest singular value of one Galerkin matrix. A matrix whose Hermitian defect
 * is at rounding level (or that is Hermitian by construction) is solved as Hermitian after replacing it by its
 * Hermitian part (A + Aᴴ)/2, so that eigenvalues are real and eigenvectors orthonormal; otherwise a general
 * eigensolver is used (for a real matrix: values by the Francis QR, the leading vectors by inverse iteration when
 * first read; for a complex one: the complex Schur form) and the norm is the largest singular value.
 */
import {
  generalEigen, hermitianDefect, hermitianEigen, largestSingularValue,
} from '../linalg';
import { hessenbergEigenvalues, hessenbergEigenvector, hessenbergReduce } from '../linalg/realEigenvalues';
import { symmetricTridiagonalQl } from '../linalg/symmetricTridiagonalQl';
import { phaseUnitVector } from '../linalg/eigenvectorPhase';
import type { GalerkinMatrix } from './assemble';

export interface LevelEigenpair {
  readonly re: number;
  readonly im: number;
  /** Coefficients in the orthonormal basis (real and imaginary parts; im null when real). */
  readonly vecRe: Float64Array;
  readonly vecIm: Float64Array | null;
}

export interface LevelSolution {
  readonly matrix: GalerkinMatrix;
  readonly hermitian: boolean;
  /** ‖A − Aᴴ‖_F / ‖A‖_F of the Galerkin matrix. */
  readonly defect: number;
  /** Leading eigenpairs, by decreasing modulus (at most `keep`). */
  readonly pairs: readonly LevelEigenpair[];
  /** All eigenvalues by decreasing modulus (for matching across levels). */
  readonly allRe: Float64Array;
  readonly allIm: Float64Array;
  /** Largest singular value of A (= max |λ| when Hermitian). */
  readonly sigmaMax: number;
  /** ‖A‖_F, the discrete Hilbert–Schmidt norm. */
  readonly frobenius: number;
  readonly converged: boolean;
}

/**
 * Matrices whose Hermitian defect is below this are solved as Hermitian. The assembly mirrors its quadrature across
 * the diagonal, so a Hermitian kernel gives a defect at rounding level (about 1e-16), whatever the quadrature error.
 */
export const hermitianDefectThreshold = 1e-11;

function signFixedRow(rows: Float64Array, n: number, k: number): Float64Array {
  const v = Float64Array.from(rows.subarray(k * n, k * n + n));
  phaseUnitVector(v, new Float64Array(n));
  return v;
}

function column(vectors: Float64Array, n: number, k: number): Float64Array {
  const v = new Float64Array(n);
  for (let i = 0; i < n; i++) v[i] = vectors[i * n + k];
  return v;
}

/**
 * The solvers see the matrix scaled by a power of two (exact, no rounding) so that its largest entry is about 1:
 * iterative deflation tests of the form |e| <= eps·(|a| + |b|) never meet subnormal numbers (a kernel of size
 * 1e-300 made the QR sweeps loop), and products such as AᵀA neither underflow nor overflow. Eigenvalues and
 * singular values are scaled back; eigenvectors do not change.
 */
export function solveLevel(matrix: GalerkinMatrix, keep: number, forceHermitian = false): LevelSolution {
  let maxAbs = 0;
  const { re, im } = matrix;
  for (let k = 0; k < re.length; k++) maxAbs = Math.max(maxAbs, Math.abs(re[k]), im ? Math.abs(im[k]) : 0);
  if (!(maxAbs > 0) || !Number.isFinite(maxAbs)) return solveScaled(matrix, keep, forceHermitian);
  const exponent = Math.round(Math.log2(maxAbs));
  if (Math.abs(exponent) <= 8) return solveScaled(matrix, keep, forceHermitian);
  // Two factors so that neither 2^-exponent nor 2^exponent overflows on its own near the ends of the range.
  const half = Math.trunc(exponent / 2);
  const up = (x: number) => x * 2 ** half * 2 ** (exponent - half);
  const scaled: GalerkinMatrix = {
    ...matrix,
    re: re.map((x) => x * 2 ** -half * 2 ** -(exponent - half)),
    im: im ? im.map((x) => x * 2 ** -half * 2 ** -(exponent - half)) : null,
  };
  const sol = solveScaled(scaled, keep, forceHermitian);
  return { ...sol, matrix, ...scaledFigures(sol, up) };
}

/**
 * The spectral figures of a solution with every eigenvalue and norm mapped by `up` (an exact scaling by a power of
 * two); eigenvectors do not change and stay lazy.
 */
export function scaledFigures(sol: LevelSolution, up: (x: number) => number): Pick<LevelSolution, 'pairs' | 'allRe' | 'allIm' | 'sigmaMax' | 'frobenius'> {
  return {
    pairs: sol.pairs.map((p) => ({
      re: up(p.re), im: up(p.im),
      get vecRe() { return p.vecRe; },
      get vecIm() { return p.vecIm; },
    })),
    allRe: sol.allRe.map(up),
    allIm: sol.allIm.map(up),
    sigmaMax: up(sol.sigmaMax),
    frobenius: up(sol.frobenius),
  };
}

function solveScaled(matrix: GalerkinMatrix, keep: number, forceHermitian: boolean): LevelSolution {
  const { n, re, im } = matrix;
  let frob2 = 0;
  for (let k = 0; k < re.length; k++) frob2 += re[k] * re[k] + (im ? im[k] * im[k] : 0);
  const frobenius = Math.sqrt(frob2);
  const defect = frobenius > 0 ? hermitianDefect(re, im, n) : 0;
  const hermitian = forceHermitian || defect <= hermitianDefectThreshold;
  const count = Math.min(keep, n);

  if (hermitian) {
    const hr = new Float64Array(n * n);
    const hi = im ? new Float64Array(n * n) : null;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        hr[i * n + j] = 0.5 * (re[i * n + j] + re[j * n + i]);
        if (hi && im) hi[i * n + j] = 0.5 * (im[i * n + j] - im[j * n + i]);
      }
    }
    let values: Float64Array;
    let vectorOf: (k: number) => { re: Float64Array; im: Float64Array | null };
    if (hi) {
      const e = hermitianEigen(hr, hi, n);
      values = e.values;
      vectorOf = (k) => ({ re: column(e.vectorsRe, n, k), im: column(e.vectorsIm, n, k) });
    } else {
      // The flat tridiagonal QL (several times faster than ml-matrix's decomposition at these sizes); row k of
      // vectorRows is eigenvector k, its sign fixed so that the entry of largest modulus is positive.
      const e = symmetricTridiagonalQl(hr, n);
      values = e.values;
      vectorOf = (k) => ({ re: signFixedRow(e.vectorRows, n, k), im: null });
    }
    const order = Array.from(values.keys()).sort((x, y) => Math.abs(values[y]) - Math.abs(values[x]) || values[y] - values[x]);
    const allRe = Float64Array.from(order.map((k) => values[k]));
    const pairs = order.slice(0, count).map((k) => {
      const v = vectorOf(k);
      return { re: values[k], im: 0, vecRe: v.re, vecIm: v.im };
    });
    return {
      matrix, hermitian, defect, pairs, allRe, allIm: new Float64Array(n),
      sigmaMax: Math.abs(allRe[0] ?? 0), frobenius, converged: true,
    };
  }

  const sigmaMax = largestSingularValue(re, im, n);
  if (!im) return solveRealGeneral(matrix, count, defect, frobenius, sigmaMax);
  const e = generalEigen(re, im, n);
  const order = Array.from(e.valuesRe.keys()).sort(
    (x, y) => Math.hypot(e.valuesRe[y], e.valuesIm[y]) - Math.hypot(e.valuesRe[x], e.valuesIm[x]),
  );
  const pairs = order.slice(0, count).map((k) => ({
    re: e.valuesRe[k], im: e.valuesIm[k], vecRe: column(e.vectorsRe, n, k), vecIm: column(e.vectorsIm, n, k),
  }));
  return {
    matrix, hermitian, defect, pairs,
    allRe: Float64Array.from(order.map((k) => e.valuesRe[k])),
    allIm: Float64Array.from(order.map((k) => e.valuesIm[k])),
    sigmaMax, frobenius, converged: e.converged,
  };
}

/**
 * A real non-Hermitian matrix: every level needs all eigenvalues (to follow each one from level to level), but only
 * the finest level's leading eigenvectors are ever read. So the values come from the values-only Francis QR on the
 * Hessenberg form, and each leading vector from inverse iteration on that form when it is first read.
 */
function solveRealGeneral(matrix: GalerkinMatrix, count: number, defect: number, frobenius: number, sigmaMax: number): LevelSolution {
  const { n, re } = matrix;
  const form = hessenbergReduce(re, n);
  const values = hessenbergEigenvalues(Float64Array.from(form.h), n);
  const order = Array.from(values.re.keys()).sort(
    (x, y) => Math.hypot(values.re[y], values.im[y]) - Math.hypot(values.re[x], values.im[x])
      || values.re[y] - values.re[x] || values.im[y] - values.im[x],
  );
  const pairs: LevelEigenpair[] = order.slice(0, count).map((k) => {
    const pairRe = values.re[k];
    const pairIm = values.im[k];
    let vec: { re: Float64Array; im: Float64Array } | null = null;
    return {
      re: pairRe,
      im: pairIm,
      get vecRe() { return (vec ??= hessenbergEigenvector(form, pairRe, pairIm)).re; },
      get vecIm() { return (vec ??= hessenbergEigenvector(form, pairRe, pairIm)).im; },
    };
  });
  return {
    matrix, hermitian: false, defect, pairs,
    allRe: Float64Array.from(order.map((k) => values.re[k])),
    allIm: Float64Array.from(order.map((k) => values.im[k])),
    sigmaMax, frobenius, converged: values.converged,
  };
}
