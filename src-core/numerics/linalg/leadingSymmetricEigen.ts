/**
 * A few eigenpairs of largest |λ| of a real symmetric operator known only through its product x ↦ A x.
 *
 * Method: thick-restart Lanczos (Wu & Simon, "Thick-restart Lanczos method for large symmetric eigenvalue
 * problems", SIAM J. Matrix Anal. Appl. 22 (2000) 602–616; Golub & Van Loan, Matrix Computations, 4th ed. 2013,
 * §10.1 and §10.3 for the Lanczos process and full reorthogonalization). A Krylov basis of `dim` vectors is built
 * with every new vector orthogonalized against all previous ones (classical Gram–Schmidt, repeated once when the
 * first pass cancelled much of the vector — Daniel, Gragg, Kaufman & Stewart 1976), the Rayleigh
 * quotient H = Vᵀ A V is diagonalized, and the Ritz pairs of largest |θ| are kept as the start of the next basis
 * (the arrow-shaped H of Wu & Simon), together with the last Lanczos vector. The residual of a Ritz pair (θ, V s) is
 * β·|s_last| (Golub & Van Loan §10.1); pairs count as converged when it is at most tol·‖A‖, ‖A‖ estimated by the
 * largest |θ| seen. If the Krylov space becomes invariant, the basis continues with a fresh random vector.
 *
 * When n ≤ dim the operator is small enough to be assembled from n products and solved densely, which is exact.
 *
 * Output: the k pairs sorted by decreasing |λ| (ties: positive first); vectors n×k row-major, column j the unit Ritz
 * vector of values[j]; residuals[j] = ‖A v − λ v‖₂ measured with one extra product per pair. `converged` is false
 * when maxIterations products were used before every pair met the tolerance; the best approximations are returned.
 * The budget is checked between restart cycles, so a cycle in progress is completed (at most dim more products).
 *
 * Like every single-vector Krylov method, a repeated eigenvalue shows its multiplicity only through rounding and
 * restarts; in tests a double eigenvalue well apart from the rest is found twice, but this is not guaranteed.
 *
 * The operator must be symmetric (this is not checked) and `matvec(x, y)` must write A x into y without modifying x.
 */

import { checkDimension } from './dense';
import { seededUniform } from './seededRandom';
import { symmetricTridiagonalQl } from './symmetricTridiagonalQl';

export interface LeadingEigen {
  /** The k eigenvalues of largest modulus, by decreasing |λ|. */
  values: Float64Array;
  /** n×k row-major; column j is the unit eigenvector of values[j]. */
  vectors: Float64Array;
  /** True when every pair met ‖A v − λ v‖ ≤ tol·‖A‖ within the product budget. */
  converged: boolean;
  /** ‖A v − λ v‖₂ for each pair, measured after the iteration. */
  residuals: Float64Array;
}

export interface LeadingEigenOptions {
  /** Relative residual tolerance: ‖A v − λ v‖ ≤ tol·‖A‖. Default 1e-10. */
  tol?: number;
  /** Maximum number of products A x (Lanczos steps). Default: enough for 300 restarts, 300·(dim − kept) + dim. */
  maxIterations?: number;
  /** Seed of the random start vector. Default 1. */
  seed?: number;
  /** Size of the Krylov basis between restarts. Default min(n, max(3k + 20, 50)). */
  dim?: number;
}

type MatVec = (x: Float64Array, y: Float64Array) => void;

export function leadingSymmetricEigen(matvec: MatVec, n: number, k: number, options: LeadingEigenOptions = {}): LeadingEigen {
  const caller = 'leadingSymmetricEigen';
  if (typeof matvec !== 'function') throw new TypeError(`${caller}: matvec must be a function (x, y) => void`);
  checkDimension(caller, 'n', n);
  checkDimension(caller, 'k', k);
  if (k > n) throw new RangeError(`${caller}: k = ${k} exceeds the dimension n = ${n}`);
  const tol = options.tol ?? 1e-10;
  if (!(tol > 0 && tol < 1)) throw new RangeError(`${caller}: tol must lie in (0, 1), got ${String(tol)}`);
  const dim = options.dim ?? Math.min(n, Math.max(3 * k + 20, 50));
  if (!Number.isInteger(dim) || dim < Math.min(n, k + 2) || dim > n) {
    const low = Math.min(n, k + 2);
    throw new RangeError(`${caller}: dim must be an integer in [${low}, ${n}] (at least min(n, k + 2)), got ${String(dim)}`);
  }
  const maxIterations = options.maxIterations ?? 300 * (dim - keptOnRestart(dim, k)) + dim;
  checkDimension(caller, 'maxIterations', maxIterations);
  const seed = options.seed ?? 1;
  if (!Number.isInteger(seed)) throw new RangeError(`${caller}: seed must be an integer, got ${String(seed)}`);

  const apply = checkedProduct(matvec, n);
  if (dim >= n) return denseCase(apply, n, k, tol);
  return thickRestart(apply, n, k, dim, tol, maxIterations, seededUniform(seed));
}

/** Ritz vectors kept at a restart: the k wanted and half of the others, so the next cycle starts rich (Wu & Simon §4). */
function keptOnRestart(m: number, k: number): number {
  return Math.min(m - 1, k + Math.floor((m - k) / 2));
}

/** Wraps the user's product: zeroes y first and rejects non-finite output with the offending index. */
function checkedProduct(matvec: MatVec, n: number): (x: Float64Array, y: Float64Array) => void {
  return (x, y) => {
    y.fill(0);
    matvec(x, y);
    for (let i = 0; i < n; i++) {
      if (!Number.isFinite(y[i])) {
        throw new RangeError(`leadingSymmetricEigen: matvec wrote ${String(y[i])} to y[${i}]; products must be finite`);
      }
    }
  };
}

function thickRestart(
  apply: MatVec,
  n: number,
  k: number,
  m: number,
  tol: number,
  maxIterations: number,
  random: () => number,
): LeadingEigen {
  const basis = new Float64Array((m + 1) * n); // row j = Lanczos vector j
  const h = new Float64Array(m * m); // projected matrix (column j filled at step j)
  const coef = new Float64Array(m + 1);
  const w = new Float64Array(n);
  const scratch = new Float64Array(m * n);
  randomUnitOrthogonal(basis, 0, n, random);
  let kept = 0;
  let products = 0;
  let anorm = 0;
  const keep = keptOnRestart(m, k);
  for (;;) {
    let beta = 0;
    for (let j = kept; j < m; j++) {
      apply(basis.subarray(j * n, j * n + n), w);
      products++;
      const scale = Math.max(anorm, norm2(w, n));
      beta = orthogonalize(basis, j + 1, w, n, coef);
      for (let i = 0; i <= j; i++) h[i * m + j] = coef[i];
      if (beta <= 1e-13 * scale) {
        // Invariant subspace: continue with a fresh direction; the coupling is exactly zero.
        beta = 0;
        randomUnitOrthogonal(basis, j + 1, n, random);
      } else {
        for (let i = 0; i < n; i++) basis[(j + 1) * n + i] = w[i] / beta;
      }
      if (j + 1 < m) h[(j + 1) * m + j] = beta;
    }
    const ritz = ritzPairs(h, m);
    anorm = Math.max(anorm, Math.abs(ritz.values[0]));
    let done = true;
    for (let i = 0; i < k; i++) {
      if (beta * Math.abs(ritz.vectorRows[i * m + m - 1]) > tol * anorm) done = false;
    }
    if (done || products >= maxIterations) {
      return finish(apply, basis, ritz.values, ritz.vectorRows, n, m, k, tol, anorm, done);
    }
    // Restart: V[0..keep) ← V S[:, 0..keep), V[keep] ← V[m]; H ← arrow matrix.
    combine(basis, ritz.vectorRows, n, m, keep, scratch);
    basis.set(scratch.subarray(0, keep * n), 0);
    basis.copyWithin(keep * n, m * n, m * n + n);
    h.fill(0);
    for (let i = 0; i < keep; i++) {
      h[i * m + i] = ritz.values[i];
      const s = beta * ritz.vectorRows[i * m + m - 1];
      h[keep * m + i] = s;
      h[i * m + keep] = s;
    }
    kept = keep;
  }
}

/**
 * Classical Gram–Schmidt of w against basis rows 0..count−1, with a second pass when the first removed more than
 * 1 − 1/√2 of the norm (the "twice is enough" test of Daniel, Gragg, Kaufman & Stewart, Math. Comp. 30 (1976)).
 * coef receives the projection coefficients (coef[i] = v_iᵀ A v_j); the norm of what remains is returned.
 */
function orthogonalize(basis: Float64Array, count: number, w: Float64Array, n: number, coef: Float64Array): number {
  coef.fill(0);
  let before = norm2(w, n);
  for (let pass = 0; pass < 2; pass++) {
    projectOut(basis, count, w, n, coef);
    const after = norm2(w, n);
    if (after > Math.SQRT1_2 * before) return after;
    before = after;
  }
  return before;
}

/** One classical Gram–Schmidt pass: c = Vᵀ w, w ← w − V c, coef += c; four basis rows at a time. */
function projectOut(basis: Float64Array, count: number, w: Float64Array, n: number, coef: Float64Array): void {
  let i = 0;
  for (; i + 4 <= count; i += 4) {
    const o0 = i * n;
    const o1 = o0 + n;
    const o2 = o1 + n;
    const o3 = o2 + n;
    let s0 = 0;
    let s1 = 0;
    let s2 = 0;
    let s3 = 0;
    for (let t = 0; t < n; t++) {
      const x = w[t];
      s0 += basis[o0 + t] * x;
      s1 += basis[o1 + t] * x;
      s2 += basis[o2 + t] * x;
      s3 += basis[o3 + t] * x;
    }
    coef[i] += s0;
    coef[i + 1] += s1;
    coef[i + 2] += s2;
    coef[i + 3] += s3;
    for (let t = 0; t < n; t++) {
      w[t] -= s0 * basis[o0 + t] + s1 * basis[o1 + t] + s2 * basis[o2 + t] + s3 * basis[o3 + t];
    }
  }
  for (; i < count; i++) {
    const off = i * n;
    let s = 0;
    for (let t = 0; t < n; t++) s += basis[off + t] * w[t];
    coef[i] += s;
    for (let t = 0; t < n; t++) w[t] -= s * basis[off + t];
  }
}

function norm2(w: Float64Array, n: number): number {
  let s = 0;
  for (let t = 0; t < n; t++) s += w[t] * w[t];
  return Math.sqrt(s);
}

/** Fills basis row `row` with a random unit vector orthogonal to rows 0..row−1. */
function randomUnitOrthogonal(basis: Float64Array, row: number, n: number, random: () => number): void {
  const v = basis.subarray(row * n, row * n + n);
  const coef = new Float64Array(row + 1);
  for (let attempt = 0; attempt < 10; attempt++) {
    for (let i = 0; i < n; i++) v[i] = random() * 2 - 1;
    const before = Math.sqrt(v.reduce((s, x) => s + x * x, 0));
    const len = orthogonalize(basis, row, v, n, coef);
    if (len > 1e-8 * before) {
      for (let i = 0; i < n; i++) v[i] /= len;
      return;
    }
  }
  throw new Error('leadingSymmetricEigen: could not extend the Krylov basis (it already spans the space)');
}

/** Eigenpairs of the symmetric part of h (m×m), ordered by decreasing |θ| (ties: positive first). */
function ritzPairs(h: Float64Array, m: number): { values: Float64Array; vectorRows: Float64Array } {
  const sym = new Float64Array(m * m);
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < m; j++) sym[i * m + j] = 0.5 * (h[i * m + j] + h[j * m + i]);
  }
  const eig = symmetricTridiagonalQl(sym, m);
  const order = byModulus(eig.values);
  const values = new Float64Array(m);
  const vectorRows = new Float64Array(m * m);
  for (let i = 0; i < m; i++) {
    values[i] = eig.values[order[i]];
    vectorRows.set(eig.vectorRows.subarray(order[i] * m, order[i] * m + m), i * m);
  }
  return { values, vectorRows };
}

function byModulus(values: Float64Array): number[] {
  return Array.from({ length: values.length }, (_, i) => i).sort((a, b) => {
    const d = Math.abs(values[b]) - Math.abs(values[a]);
    return d !== 0 ? d : values[b] - values[a];
  });
}

/** Rows 0..count−1 of `out` become Σ_j S[i][j] · basis row j (j < m); four basis rows at a time. */
function combine(basis: Float64Array, sRows: Float64Array, n: number, m: number, count: number, out: Float64Array): void {
  out.fill(0, 0, count * n);
  for (let i = 0; i < count; i++) {
    const o = i * n;
    const si = i * m;
    let j = 0;
    for (; j + 4 <= m; j += 4) {
      const a0 = sRows[si + j];
      const a1 = sRows[si + j + 1];
      const a2 = sRows[si + j + 2];
      const a3 = sRows[si + j + 3];
      const b0 = j * n;
      const b1 = b0 + n;
      const b2 = b1 + n;
      const b3 = b2 + n;
      for (let t = 0; t < n; t++) {
        out[o + t] += a0 * basis[b0 + t] + a1 * basis[b1 + t] + a2 * basis[b2 + t] + a3 * basis[b3 + t];
      }
    }
    for (; j < m; j++) {
      const a = sRows[si + j];
      const b = j * n;
      for (let t = 0; t < n; t++) out[o + t] += a * basis[b + t];
    }
  }
}

function finish(
  apply: MatVec,
  basis: Float64Array,
  theta: Float64Array,
  sRows: Float64Array,
  n: number,
  m: number,
  k: number,
  tol: number,
  anorm: number,
  estimatesMet: boolean,
): LeadingEigen {
  const rows = new Float64Array(k * n);
  combine(basis, sRows, n, m, k, rows);
  return packResult(apply, rows, theta, n, k, tol, anorm, estimatesMet);
}

/** Normalizes the k vector rows, measures true residuals, and lays the result out as promised. */
function packResult(
  apply: MatVec,
  rows: Float64Array,
  theta: Float64Array,
  n: number,
  k: number,
  tol: number,
  anorm: number,
  estimatesMet: boolean,
): LeadingEigen {
  const values = new Float64Array(k);
  const vectors = new Float64Array(n * k);
  const residuals = new Float64Array(k);
  const y = new Float64Array(n);
  let converged = estimatesMet;
  for (let j = 0; j < k; j++) {
    const v = rows.subarray(j * n, j * n + n);
    let len = 0;
    let big = 0;
    for (let t = 0; t < n; t++) {
      len += v[t] * v[t];
      if (Math.abs(v[t]) > Math.abs(big)) big = v[t];
    }
    const f = (big < 0 ? -1 : 1) / Math.sqrt(len);
    for (let t = 0; t < n; t++) v[t] *= f;
    apply(v, y);
    let r = 0;
    for (let t = 0; t < n; t++) {
      const d = y[t] - theta[j] * v[t];
      r += d * d;
      vectors[t * k + j] = v[t];
    }
    values[j] = theta[j];
    residuals[j] = Math.sqrt(r);
    // Allow for the rounding in forming V·s: the measured residual may exceed the estimate slightly.
    if (residuals[j] > 10 * tol * Math.max(anorm, Math.abs(theta[0]))) converged = false;
  }
  return { values, vectors, converged, residuals };
}

/** n ≤ dim: assemble A from n products with unit vectors and solve it densely (exact up to rounding). */
function denseCase(apply: MatVec, n: number, k: number, tol: number): LeadingEigen {
  const a = new Float64Array(n * n);
  const e = new Float64Array(n);
  const y = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    e.fill(0);
    e[j] = 1;
    apply(e, y);
    for (let i = 0; i < n; i++) a[i * n + j] = y[i];
  }
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const s = 0.5 * (a[i * n + j] + a[j * n + i]);
      a[i * n + j] = s;
      a[j * n + i] = s;
    }
  }
  const eig = symmetricTridiagonalQl(a, n);
  const order = byModulus(eig.values);
  const theta = new Float64Array(n);
  const rows = new Float64Array(k * n);
  for (let i = 0; i < n; i++) theta[i] = eig.values[order[i]];
  for (let i = 0; i < k; i++) rows.set(eig.vectorRows.subarray(order[i] * n, order[i] * n + n), i * n);
  const anorm = Math.abs(theta[0]);
  return packResult(apply, rows, theta, n, k, tol, anorm, eig.converged);
}
