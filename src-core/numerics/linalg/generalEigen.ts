/**
 * All eigenvalues and eigenvectors of a general (non-symmetric, possibly complex) square matrix.
 *
 * Method, real input: ml-matrix's EigenvalueDecomposition — Hessenberg reduction and the real double-shift Francis
 * QR iteration (Golub & Van Loan, Matrix Computations, 4th ed. 2013, §7.5; EISPACK orthes/hqr2). Its real storage of
 * a conjugate pair (columns k, k+1 holding the real and imaginary parts of the vector of d[k] + i·e[k], e[k] > 0) is
 * converted to two complex vectors.
 *
 * Method, complex input: Householder reduction to Hessenberg form (complexHessenberg), single-shift complex QR with
 * Wilkinson shifts and deflation to the Schur form (complexSchur), eigenvectors by back-substitution on the
 * triangular factor and back-transformation (schurEigenvectors); Golub & Van Loan §7.4–7.6, EISPACK comqr2.
 *
 * Output: eigenvalues sorted by decreasing modulus (ties: larger real part first, then larger imaginary part);
 * vectorsRe/vectorsIm n×n row-major, column k the unit eigenvector of eigenvalue k, phase fixed so that its largest
 * entry is real and positive. For a defective matrix the vectors of a repeated eigenvalue are (nearly) parallel, as
 * they must be. `converged` is false when the QR iteration did not finish within its step bound; the values are then
 * approximations and the call still returns.
 */

import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { normalizeColumns, schurEigenvectors } from './complexEigenvectors';
import { complexHessenberg } from './complexHessenberg';
import { complexSchur } from './complexSchur';
import { checkSquareComplex, isRealPart } from './dense';

export interface GeneralEigen {
  valuesRe: Float64Array;
  valuesIm: Float64Array;
  /** Real parts of the eigenvectors: n×n row-major, column k belongs to eigenvalue k. */
  vectorsRe: Float64Array;
  vectorsIm: Float64Array;
  /** False when the QR iteration hit its step bound (values then approximate). */
  converged: boolean;
}

export function generalEigen(re: Float64Array, im: Float64Array | null, n: number): GeneralEigen {
  checkSquareComplex('generalEigen', re, im, n);
  const raw = isRealPart(im) ? realCase(re, n) : complexCase(re, im as Float64Array, n);
  return sortByModulus(raw, n);
}

function realCase(re: Float64Array, n: number): GeneralEigen {
  const a = new Matrix(n, n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) a.set(i, j, re[i * n + j]);
  const evd = new EigenvalueDecomposition(a);
  const d = evd.realEigenvalues;
  const e = evd.imaginaryEigenvalues;
  const v = evd.eigenvectorMatrix;
  const vectorsRe = new Float64Array(n * n);
  const vectorsIm = new Float64Array(n * n);
  for (let k = 0; k < n; k++) {
    if (e[k] > 0 && k + 1 < n) {
      for (let i = 0; i < n; i++) {
        const x = v.get(i, k);
        const y = v.get(i, k + 1);
        vectorsRe[i * n + k] = x;
        vectorsIm[i * n + k] = y;
        vectorsRe[i * n + k + 1] = x;
        vectorsIm[i * n + k + 1] = -y;
      }
      k++;
    } else {
      for (let i = 0; i < n; i++) vectorsRe[i * n + k] = v.get(i, k);
    }
  }
  normalizeColumns(vectorsRe, vectorsIm, n);
  let converged = true;
  for (let k = 0; k < n; k++) if (!Number.isFinite(d[k]) || !Number.isFinite(e[k])) converged = false;
  for (let p = 0; p < n * n; p++) if (!Number.isFinite(vectorsRe[p]) || !Number.isFinite(vectorsIm[p])) converged = false;
  return {
    valuesRe: Float64Array.from(d),
    valuesIm: Float64Array.from(e),
    vectorsRe,
    vectorsIm,
    converged,
  };
}

function complexCase(re: Float64Array, im: Float64Array, n: number): GeneralEigen {
  const hRe = Float64Array.from(re);
  const hIm = Float64Array.from(im);
  const q = complexHessenberg(hRe, hIm, n);
  const schur = complexSchur(hRe, hIm, q.re, q.im, n);
  const valuesRe = new Float64Array(n);
  const valuesIm = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    valuesRe[k] = hRe[k * n + k];
    valuesIm[k] = hIm[k * n + k];
  }
  const vec = schurEigenvectors(hRe, hIm, q.re, q.im, n);
  return { valuesRe, valuesIm, vectorsRe: vec.re, vectorsIm: vec.im, converged: schur.converged };
}

function sortByModulus(raw: GeneralEigen, n: number): GeneralEigen {
  const { valuesRe: r, valuesIm: i } = raw;
  const order = Array.from({ length: n }, (_, k) => k).sort((a, b) => {
    const ma = Math.hypot(r[a], i[a]);
    const mb = Math.hypot(r[b], i[b]);
    if (ma !== mb) return mb - ma;
    if (r[a] !== r[b]) return r[b] - r[a];
    return i[b] - i[a];
  });
  const out: GeneralEigen = {
    valuesRe: new Float64Array(n),
    valuesIm: new Float64Array(n),
    vectorsRe: new Float64Array(n * n),
    vectorsIm: new Float64Array(n * n),
    converged: raw.converged,
  };
  for (let k = 0; k < n; k++) {
    const src = order[k];
    out.valuesRe[k] = r[src];
    out.valuesIm[k] = i[src];
    for (let row = 0; row < n; row++) {
      out.vectorsRe[row * n + k] = raw.vectorsRe[row * n + src];
      out.vectorsIm[row * n + k] = raw.vectorsIm[row * n + src];
    }
  }
  return out;
}
