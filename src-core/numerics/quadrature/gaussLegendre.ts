/**
 * Gauss–Legendre quadrature on [-1, 1] by Newton's method on the three-term recurrence.
 *
 * Method: the n nodes are the zeros of the Legendre polynomial P_n. Each positive zero is found by Newton's
 * iteration started from Tricomi's asymptotic guess
 *   x_k ≈ (1 − 1/(8n²) + 1/(8n³)) cos(π(4k − 1)/(4n + 2)),
 * with P_n evaluated by Bonnet's recurrence (k+1)P_{k+1} = (2k+1)x P_k − k P_{k−1}, written in y = 1 − x so that
 * nodes crowding at ±1 keep full relative accuracy in 1 − x; the weight is w = 2 / ((1 − x²) P_n'(x)²).
 * Negative nodes follow by symmetry, so the rule is exactly symmetric.
 * References: F. G. Tricomi, "Sugli zeri dei polinomi sferici ed ultrasferici", Ann. Mat. Pura Appl. 31 (1950)
 * (the initial guess); N. Hale and A. Townsend, "Fast and accurate computation of Gauss–Legendre and Gauss–Jacobi
 * quadrature nodes and weights", SIAM J. Sci. Comput. 35 (2013) (Newton on the recurrence as the baseline
 * O(n²) method, accurate for the n ≤ 1000 used here).
 *
 * Rules are cached per n; callers receive copies, so the cache can never be altered.
 */
import { QuadratureInputError, requireInteger, type Rule1D } from './types';

/** Largest n served; the O(n²) Newton method stays fast and accurate up to here. */
export const GAUSS_LEGENDRE_MAX_POINTS = 4000;

const cache = new Map<number, Rule1D>();

/** The n-point Gauss–Legendre rule on [-1, 1]: nodes ascending, exact for polynomials of degree ≤ 2n − 1. */
export function gaussLegendre(n: number): Rule1D {
  requireInteger(n, 'gaussLegendre: number of points n', 1, GAUSS_LEGENDRE_MAX_POINTS);
  let rule = cache.get(n);
  if (!rule) {
    rule = computeGaussLegendre(n);
    cache.set(n, rule);
  }
  return { nodes: rule.nodes.slice(), weights: rule.weights.slice() };
}

/** The rule for ∫_a^b: nodes a + (b − a)(x + 1)/2 and weights scaled by (b − a)/2 (a > b reverses orientation). */
export function mapRule(rule: Rule1D, a: number, b: number): Rule1D {
  if (!Number.isFinite(a) || !Number.isFinite(b)) {
    throw new QuadratureInputError(`mapRule: interval ends must be finite, got [${a}, ${b}]`);
  }
  const half = (b - a) / 2;
  const mid = (a + b) / 2;
  const n = rule.nodes.length;
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    nodes[i] = mid + half * rule.nodes[i];
    weights[i] = half * rule.weights[i];
  }
  return { nodes, weights };
}

/**
 * P_n(1 − y) and the difference D_n = P_n − P_{n−1} by Bonnet's recurrence rewritten in y = 1 − x:
 *   (k+1) D_{k+1} = k D_k − (2k+1) y P_k,  P_{k+1} = P_k + D_{k+1},
 * which avoids the cancellation of the plain recurrence near x = 1 (the idea of Reinsch's modification of
 * Clenshaw's method, see e.g. Gentleman, Comput. J. 12 (1969)). Working in y also keeps the node's distance to
 * the endpoint at full relative precision, which the weight 2/((1 − x²)P_n'²) needs.
 */
function legendreFromOne(n: number, y: number): [number, number] {
  let p = 1; // P_0
  let d = -y; // D_1 = P_1 − P_0 = x − 1
  p += d; // P_1
  for (let k = 1; k < n; k++) {
    d = (k * d - (2 * k + 1) * y * p) / (k + 1);
    p += d;
  }
  return [p, d];
}

/** P_n'(x) at x = 1 − y: (1 − x²)P_n' = n(P_{n−1} − xP_n) = n(y P_n − D_n). */
function derivativeFromOne(n: number, y: number, pn: number, dn: number): number {
  return (n * (y * pn - dn)) / (y * (2 - y));
}

function computeGaussLegendre(n: number): Rule1D {
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  const half = Math.floor(n / 2);
  const shrink = 1 - 1 / (8 * n * n) + 1 / (8 * n * n * n);
  // k = 1 .. half are the positive zeros, largest first; Newton runs on y = 1 − x.
  for (let k = 1; k <= half; k++) {
    const theta = (Math.PI * (4 * k - 1)) / (4 * n + 2);
    // 1 − shrink·cos θ = (1 − shrink) + shrink·2 sin²(θ/2), without cancellation.
    const sinHalf = Math.sin(theta / 2);
    let y = 1 - shrink + shrink * 2 * sinHalf * sinHalf;
    let finalStep = false;
    for (let iter = 0; iter < 100; iter++) {
      const [pn, dn] = legendreFromOne(n, y);
      const dy = pn / derivativeFromOne(n, y, pn, dn);
      y += dy;
      if (finalStep) break;
      // Quadratic convergence: once the step is below 1e-9·y the next one lands at rounding level.
      if (Math.abs(dy) < 1e-9 * y) finalStep = true;
    }
    const [pn, dn] = legendreFromOne(n, y);
    const dp = derivativeFromOne(n, y, pn, dn);
    const w = 2 / (y * (2 - y) * dp * dp);
    const x = 1 - y;
    nodes[n - k] = x;
    nodes[k - 1] = -x;
    weights[n - k] = w;
    weights[k - 1] = w;
  }
  if (n % 2 === 1) {
    // Middle node x = 0 (y = 1): P_n'(0) = n P_{n−1}(0) = n (P_n(0) − D_n) with P_n(0) = 0.
    const [pn, dn] = legendreFromOne(n, 1);
    const dp = n * (pn - dn);
    nodes[half] = 0;
    weights[half] = 2 / (dp * dp);
  }
  return { nodes, weights };
}
