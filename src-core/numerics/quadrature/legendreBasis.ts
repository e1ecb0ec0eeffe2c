/**
 * The L²-orthonormal Legendre basis p_k(x) = √((2k+1)/2) P_k(x) on [-1, 1], its derivatives, and the panel variant
 * orthonormal on [a, b].
 *
 * Method: Bonnet's three-term recurrence (k+1)P_{k+1} = (2k+1)x P_k − k P_{k−1}, forward-stable on [-1, 1]
 * (|P_k| ≤ 1 there), and for derivatives P'_{k+1} = x P'_k + (k+1) P_k (Abramowitz & Stegun, Handbook of
 * Mathematical Functions, 1964, ch. 22: the recurrence §22.7, the derivative relation follows from §22.8; the
 * orthonormal scaling is ∫ P_k² = 2/(2k+1), §22.2).
 *
 * Layout: a row-major Float64Array with one row per point and degree+1 columns, entry [i·(degree+1) + k] = p_k(x_i).
 */
import { QuadratureInputError, requireInteger } from './types';

function checkArgs(x: Float64Array, degree: number, fn: string): void {
  requireInteger(degree, `${fn}: degree`, 0);
  for (let i = 0; i < x.length; i++) {
    if (!Number.isFinite(x[i])) throw new QuadratureInputError(`${fn}: point ${i} is not finite (${x[i]})`);
  }
}

/** Values p_k(x_i) of the orthonormal Legendre polynomials, k = 0..degree (rows = points). */
export function legendreMatrix(x: Float64Array, degree: number): Float64Array {
  checkArgs(x, degree, 'legendreMatrix');
  return fillValues(x, degree, (v) => v);
}

/** Derivatives p_k'(x_i) of the orthonormal Legendre polynomials, k = 0..degree (rows = points). */
export function legendreDerivative(x: Float64Array, degree: number): Float64Array {
  checkArgs(x, degree, 'legendreDerivative');
  return fillDerivatives(x, degree, (v) => v, 1);
}

/**
 * Values of the basis orthonormal on the panel [a, b]: q_k(x) = √(2/(b − a)) p_k(t), t = (2x − a − b)/(b − a).
 */
export function panelBasis(x: Float64Array, a: number, b: number, degree: number): Float64Array {
  checkArgs(x, degree, 'panelBasis');
  const scale = checkPanel(a, b, 'panelBasis');
  const out = fillValues(x, degree, (v) => (2 * v - a - b) / (b - a));
  for (let i = 0; i < out.length; i++) out[i] *= scale;
  return out;
}

/** Derivatives d/dx of the panel basis q_k on [a, b] (chain rule factor 2/(b − a)). */
export function panelBasisDerivative(x: Float64Array, a: number, b: number, degree: number): Float64Array {
  checkArgs(x, degree, 'panelBasisDerivative');
  const scale = checkPanel(a, b, 'panelBasisDerivative');
  return fillDerivatives(x, degree, (v) => (2 * v - a - b) / (b - a), (scale * 2) / (b - a));
}

function checkPanel(a: number, b: number, fn: string): number {
  if (!Number.isFinite(a) || !Number.isFinite(b) || !(b > a)) {
    throw new QuadratureInputError(`${fn}: need a finite panel with a < b, got [${a}, ${b}]`);
  }
  return Math.sqrt(2 / (b - a));
}

function fillValues(x: Float64Array, degree: number, toReference: (v: number) => number): Float64Array {
  const m = degree + 1;
  const out = new Float64Array(x.length * m);
  const norm = new Float64Array(m);
  for (let k = 0; k < m; k++) norm[k] = Math.sqrt((2 * k + 1) / 2);
  for (let i = 0; i < x.length; i++) {
    const t = toReference(x[i]);
    const row = i * m;
    let pPrev = 0;
    let p = 1;
    for (let k = 0; k < m; k++) {
      out[row + k] = norm[k] * p;
      const pNext = ((2 * k + 1) * t * p - k * pPrev) / (k + 1);
      pPrev = p;
      p = pNext;
    }
  }
  return out;
}

function fillDerivatives(
  x: Float64Array,
  degree: number,
  toReference: (v: number) => number,
  factor: number,
): Float64Array {
  const m = degree + 1;
  const out = new Float64Array(x.length * m);
  for (let i = 0; i < x.length; i++) {
    const t = toReference(x[i]);
    const row = i * m;
    let pPrev = 0;
    let p = 1;
    let dp = 0;
    for (let k = 0; k < m; k++) {
      out[row + k] = factor * Math.sqrt((2 * k + 1) / 2) * dp;
      // P'_{k+1} = t P'_k + (k+1) P_k, then advance P.
      dp = t * dp + (k + 1) * p;
      const pNext = ((2 * k + 1) * t * p - k * pPrev) / (k + 1);
      pPrev = p;
      p = pNext;
    }
  }
  return out;
}
