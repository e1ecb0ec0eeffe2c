/**
 * Gauss–Jacobi quadrature on [-1, 1] for the weight (1 − x)^α (1 + x)^β, α, β > −1.
 *
 * Method: G. H. Golub and J. H. Welsch, "Calculation of Gauss quadrature rules", Math. Comp. 23 (1969):
 * the nodes are the eigenvalues of the symmetric tridiagonal Jacobi matrix of the orthonormal Jacobi polynomials
 * (recurrence coefficients as in W. Gautschi, "Orthogonal Polynomials: Computation and Approximation", 2004,
 * Table 1.1). Each eigenvalue is then polished by Newton's method on the same three-term recurrence, and each
 * weight is taken from the Christoffel function, w_k = 1 / Σ_{j<n} p_j(x_k)² with p_j orthonormal, which keeps
 * small weights at relative accuracy (the eigenvector formula w = μ₀ v₀² only has absolute accuracy). Observed
 * accuracy: nodes to a few 1e-16, weights to ~3e-14 relative for n ≤ 200 (gaussLegendre.ts is more accurate and
 * should be preferred when α = β = 0).
 * μ₀ = ∫ (1 − x)^α (1 + x)^β dx = 2^{α+β+1} Γ(α+1) Γ(β+1) / Γ(α+β+2).
 *
 * Used for endpoint singularities: ∫_{-1}^{1} (1 − x)^α g(x) dx with smooth g is exact for g of degree ≤ 2n − 1.
 * Cost is O(n³) (dense symmetric eigensolver); rules are cached per (n, α, β) and returned as copies.
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { gamma, lgamma } from 'mathjs';
import { QuadratureInputError, requireInteger, type Rule1D } from './types';

export const GAUSS_JACOBI_MAX_POINTS = 1000;

const cache = new Map<string, Rule1D>();

/** The n-point Gauss–Jacobi rule for ∫_{-1}^{1} (1 − x)^α (1 + x)^β f(x) dx; nodes ascending. */
export function gaussJacobi(n: number, alpha: number, beta: number): Rule1D {
  requireInteger(n, 'gaussJacobi: number of points n', 1, GAUSS_JACOBI_MAX_POINTS);
  if (!(alpha > -1) || !(beta > -1) || !Number.isFinite(alpha) || !Number.isFinite(beta)) {
    throw new QuadratureInputError(`gaussJacobi: need finite α > −1 and β > −1, got α = ${alpha}, β = ${beta}`);
  }
  const key = `${n}|${alpha}|${beta}`;
  let rule = cache.get(key);
  if (!rule) {
    rule = computeGaussJacobi(n, alpha, beta);
    cache.set(key, rule);
    // Exponents come from kernels, so a long session meets ever new ones: keep the most recent 256 rules.
    if (cache.size > 256) cache.delete(cache.keys().next().value as string);
  }
  return { nodes: rule.nodes.slice(), weights: rule.weights.slice() };
}

/** μ₀ = ∫_{-1}^{1} (1 − x)^α (1 + x)^β dx. */
export function jacobiWeightIntegral(alpha: number, beta: number): number {
  const s = alpha + beta + 2;
  if (s < 170) return (2 ** (s - 1) * gamma(alpha + 1) * gamma(beta + 1)) / gamma(s);
  return Math.exp((s - 1) * Math.LN2 + lgamma(alpha + 1) + lgamma(beta + 1) - lgamma(s));
}

/** Diagonal a_j (j = 0..n−1) and off-diagonal b_j (j = 1..n, b[0] unused) of the orthonormal recurrence. */
function recurrence(n: number, alpha: number, beta: number): { a: Float64Array; b: Float64Array } {
  const a = new Float64Array(n);
  const b = new Float64Array(n + 1);
  const ab = alpha + beta;
  a[0] = (beta - alpha) / (ab + 2);
  for (let j = 1; j < n; j++) {
    const t = 2 * j + ab;
    a[j] = ((beta - alpha) * (beta + alpha)) / (t * (t + 2));
  }
  // b_1 written without the (α+β+1)/(α+β+1) factor that the general formula has.
  b[1] = Math.sqrt((4 * (1 + alpha) * (1 + beta)) / ((2 + ab) * (2 + ab) * (3 + ab)));
  for (let j = 2; j <= n; j++) {
    const t = 2 * j + ab;
    b[j] = Math.sqrt((4 * j * (j + alpha) * (j + beta) * (j + ab)) / (t * t * (t + 1) * (t - 1)));
  }
  return { a, b };
}

/** p_n(x), p_n'(x), K(x) = Σ_{j<n} p_j(x)² and K'(x) for the orthonormal polynomials with p_0 = 1/√μ₀. */
function evaluate(
  x: number,
  n: number,
  a: Float64Array,
  b: Float64Array,
  p0: number,
): { p: number; dp: number; christoffelSum: number; christoffelSlope: number } {
  let pPrev = 0;
  let p = p0;
  let dpPrev = 0;
  let dp = 0;
  let sum = 0;
  let slope = 0;
  for (let j = 0; j < n; j++) {
    sum += p * p;
    slope += 2 * p * dp;
    const pNext = ((x - a[j]) * p - b[j] * pPrev) / b[j + 1];
    const dpNext = (p + (x - a[j]) * dp - b[j] * dpPrev) / b[j + 1];
    pPrev = p;
    p = pNext;
    dpPrev = dp;
    dp = dpNext;
  }
  return { p, dp, christoffelSum: sum, christoffelSlope: slope };
}

function computeGaussJacobi(n: number, alpha: number, beta: number): Rule1D {
  const mu0 = jacobiWeightIntegral(alpha, beta);
  const { a, b } = recurrence(n, alpha, beta);
  const p0 = 1 / Math.sqrt(mu0);
  let eig: number[];
  if (n === 1) {
    eig = [a[0]];
  } else {
    const J = Matrix.zeros(n, n);
    for (let j = 0; j < n; j++) {
      J.set(j, j, a[j]);
      if (j + 1 < n) {
        J.set(j, j + 1, b[j + 1]);
        J.set(j + 1, j, b[j + 1]);
      }
    }
    eig = new EigenvalueDecomposition(J, { assumeSymmetric: true }).realEigenvalues.slice();
    eig.sort((u, v) => u - v);
  }
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    let x = Math.min(1, Math.max(-1, eig[k]));
    // Newton polish: the eigenvalues are accurate to a few ulps of ‖J‖ ≤ 1, so accept only tiny corrections;
    // a large step would mean the recurrence is not trustworthy there, and the eigenvalue is kept.
    for (let iter = 0; iter < 3; iter++) {
      const { p, dp } = evaluate(x, n, a, b, p0);
      const step = p / dp;
      if (!Number.isFinite(step) || Math.abs(step) > 1e-10) break;
      x -= step;
      if (Math.abs(step) <= 1e-17) break;
    }
    // Weight at the true zero x* = x − p/p' rather than at the rounded x: near ±1 the Christoffel function is
    // steep enough that the rounding of x alone costs ~1e-13, so take one first-order step along K'/K.
    const e = evaluate(x, n, a, b, p0);
    const shift = Number.isFinite(e.p / e.dp) ? -e.p / e.dp : 0;
    nodes[k] = x;
    weights[k] = (1 / e.christoffelSum) * (1 - (e.christoffelSlope / e.christoffelSum) * shift);
  }
  return { nodes, weights };
}
