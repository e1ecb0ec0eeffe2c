/**
 * Conical-product (collapsed, Duffy) Gauss rules on a triangle, optionally graded toward the edge v1–v2 or the
 * vertex v0.
 *
 * Method: the square [0, 1]² is mapped onto the triangle by collapsing the side u = 0 onto v0,
 *   P(u, v) = v0 + u [(1 − v)(v1 − v0) + v (v2 − v0)],   dA = 2|T| u du dv,
 * and a tensor Gauss–Legendre rule is used in (u, v). A polynomial of total degree d becomes a polynomial of degree
 * d + 1 in u and d in v, so n points per direction integrate degree ≤ 2n − 2 exactly; all weights are positive and
 * sum to the area. A. H. Stroud, Approximate Calculation of Multiple Integrals, Prentice-Hall, 1971 (conical product
 * rules); M. G. Duffy, "Quadrature over a pyramid or cube of integrands with a singularity at a vertex", SIAM J.
 * Numer. Anal. 19 (1982) (the Jacobian u cancels a 1/r singularity at v0).
 *
 * Grading: the distance to the edge v1–v2 is (1 − u)·h with h the height over that edge, and the distance to v0 is
 * u·|(1 − v)(v1 − v0) + v(v2 − v0)|, so singularities along the edge or at the vertex are one-dimensional in u.
 * The u-rule is then a composite Gauss rule on a geometric mesh toward u = 1 (edge) and/or u = 0 (vertex)
 * (gradedPanels.ts), which integrates d^(−α) and log d at an exponential rate in the number of levels.
 *
 * Floating point: the physical coordinates of a point at distance d ≪ ε·|P| from the edge round onto it, so an
 * integrand evaluated from (x, y) cannot see distances below ~1e-16; for d^(−α) that caps the accuracy near
 * ε^(1−α). The rule therefore also returns each point's distance to the edge and to v0, computed from the collapsed
 * coordinates without cancellation; integrands that can use them reach full accuracy.
 *
 * Power tail (option `tailExponent` α of the edge grading): for d^(−α) with α near 1 the part of the integral below
 * any distance a black-box integrand can resolve is not small (∫₀^δ d^(−α) dd / ∫₀¹ d^(−α) dd = δ^(1−α): 2.5 % at
 * δ = 1e-16 for α = 0.9). With the exponent known, the innermost panel [0, δ] is not sampled; its integral is
 * taken from the next panel's points under the model F(s) = C·s^(−α) (C smooth): ∫₀^δ F = C δ^(1−α)/(1 − α), with
 * C ≈ F(s_j)·s_j^α averaged over that panel with its Gauss weights. Exact for C constant; for smooth C the
 * relative error of the tail is O(δ / panel size), the same idea as product integration with a singular weight
 * (K. E. Atkinson, The Numerical Solution of Integral Equations of the Second Kind, 1997, §4.2).
 * The same points also carry weights `wSquare` for |F|², which grows like s^(−2α): the tail there is
 * C' δ^(1−2α)/(1 − 2α) with C' ≈ |F(s_j)|² s_j^(2α) (for 2α < 1; beyond, ∫∫|F|² is infinite and wSquare = w).
 * At α = 0.497 the part of ∫ s^(−2α) below δ = 6e-9 is δ^0.006 ≈ 89 % of the whole, so without this tail a
 * Hilbert–Schmidt norm near the threshold loses most of its value.
 */
import { gaussLegendre } from './gaussLegendre';
import { DEFAULT_GRADING_LEVELS, DEFAULT_GRADING_RATIO, gradedPanels } from './gradedPanels';
import { QuadratureInputError, requireInteger, type Rule2D, type Vec2 } from './types';

/** Geometric grading of the collapsed coordinate. */
export interface TriangleGrading {
  /** Number of geometric levels; default 12. */
  readonly levels?: number;
  /** Ratio between consecutive panel sizes; default 0.15. */
  readonly ratio?: number;
  /** Gauss points on each graded panel in u; default the rule's n. About 20 keeps σ = 0.15 panels at 1e-14. */
  readonly pointsPerPanel?: number;
  /**
   * Levels whose panels would come closer than this distance to the singular edge or vertex are not refined.
   * Default 1024 ε · (largest coordinate magnitude of that edge or vertex), so that no point's (x, y) rounds onto
   * the singularity; pass 0 when the integrand uses edgeDistance / vertexDistance instead of (x, y).
   */
  readonly minDistance?: number;
  /**
   * Edge grading only: the integrand behaves like d^(−α) toward the edge with this α ∈ (0, 1); the innermost panel
   * is replaced by the power tail (see the header). Undefined: the innermost panel is sampled like the others.
   */
  readonly tailExponent?: number;
}

export interface CollapsedTriangleOptions {
  /** Grade toward the edge v1–v2 (integrands singular like d^(−α) or log d, d = distance to that edge). */
  readonly gradeTowardEdge?: TriangleGrading;
  /** Grade toward the vertex v0 (point singularities r^(−α), α < 2, beyond the 1/r the Duffy map already cancels). */
  readonly gradeTowardVertex?: TriangleGrading;
}

/** A triangle rule with, per point, the distances to the edge v1–v2 and to the vertex v0 (accurate when tiny). */
export interface TriangleRule extends Rule2D {
  readonly edgeDistance: Float64Array;
  readonly vertexDistance: Float64Array;
  /** Weights for |f|² when the edge grading has a power tail (see the header); otherwise the same array as w. */
  readonly wSquare: Float64Array;
}

/**
 * A rule for ∫∫_T f dA over the triangle (v0, v1, v2) with n Gauss points in each collapsed direction (n² points
 * without grading). Either orientation of the vertices is accepted; weights are non-negative and sum to the area.
 */
export function collapsedTriangleRule(
  v0: Vec2,
  v1: Vec2,
  v2: Vec2,
  n: number,
  options: CollapsedTriangleOptions = {},
): TriangleRule {
  requireInteger(n, 'collapsedTriangleRule: n', 1);
  for (const [name, v] of [['v0', v0], ['v1', v1], ['v2', v2]] as const) {
    if (v.length !== 2 || !Number.isFinite(v[0]) || !Number.isFinite(v[1])) {
      throw new QuadratureInputError(`collapsedTriangleRule: ${name} must be two finite numbers, got [${v.join(', ')}]`);
    }
  }
  const e1x = v1[0] - v0[0];
  const e1y = v1[1] - v0[1];
  const e2x = v2[0] - v0[0];
  const e2y = v2[1] - v0[1];
  const twiceArea = Math.abs(e1x * e2y - e1y * e2x);
  const edgeLength = Math.hypot(v2[0] - v1[0], v2[1] - v1[1]);
  const height = edgeLength > 0 ? twiceArea / edgeLength : 0;

  const edgeScale = Math.max(Math.abs(v1[0]), Math.abs(v1[1]), Math.abs(v2[0]), Math.abs(v2[1]));
  const vertexScale = Math.max(Math.abs(v0[0]), Math.abs(v0[1]));
  const rayLength = Math.max(Math.hypot(e1x, e1y), Math.hypot(e2x, e2y));
  // Floors in the collapsed coordinates: s·height is the edge distance, u·|ray| ≤ u·rayLength the vertex distance.
  const floors = {
    s: floorOf(options.gradeTowardEdge, edgeScale, height, 'gradeTowardEdge'),
    u: floorOf(options.gradeTowardVertex, vertexScale, rayLength, 'gradeTowardVertex'),
  };
  const ru = collapsedRule(n, options, floors);
  const rv = gaussLegendre(n);
  const nu = ru.u.length;
  const size = nu * n;
  const x = new Float64Array(size);
  const y = new Float64Array(size);
  const w = new Float64Array(size);
  const wSquare = ru.wSquare === ru.w ? w : new Float64Array(size);
  const edgeDistance = new Float64Array(size);
  const vertexDistance = new Float64Array(size);
  let k = 0;
  for (let i = 0; i < nu; i++) {
    const u = ru.u[i];
    const s = ru.s[i];
    const wu = ru.w[i] * u * twiceArea;
    const wu2 = ru.wSquare[i] * u * twiceArea;
    for (let j = 0; j < n; j++) {
      const v = (rv.nodes[j] + 1) / 2;
      const wv = rv.weights[j] / 2;
      // Ray direction (1 − v)·e1 + v·e2 from v0 to the edge point E(v) = v1 + v (v2 − v1).
      const dx = e1x + v * (e2x - e1x);
      const dy = e1y + v * (e2y - e1y);
      if (u <= 0.5) {
        x[k] = v0[0] + u * dx;
        y[k] = v0[1] + u * dy;
      } else {
        // Near the edge, start from the edge point so that the small offset s keeps its precision.
        x[k] = v1[0] + v * (v2[0] - v1[0]) - s * dx;
        y[k] = v1[1] + v * (v2[1] - v1[1]) - s * dy;
      }
      w[k] = wu * wv;
      if (wSquare !== w) wSquare[k] = wu2 * wv;
      edgeDistance[k] = s * height;
      vertexDistance[k] = u * Math.hypot(dx, dy);
      k++;
    }
  }
  return { x, y, w, edgeDistance, vertexDistance, wSquare };
}

/** The rule in the collapsed coordinate, with u (0 at v0) and s = 1 − u (0 on the edge) both kept accurate. */
interface CollapsedRule {
  readonly u: Float64Array;
  readonly s: Float64Array;
  readonly w: Float64Array;
  /** Weights for the square of the integrand (the power tail with 2α); the same array as w without a tail. */
  readonly wSquare: Float64Array;
}

/** One panel: [uLo, uLo + length] in u, which is [sLo, sLo + length] in s = 1 − u. */
interface Panel {
  readonly uLo: number;
  readonly sLo: number;
  readonly length: number;
  readonly points: number;
}

function collapsedRule(
  n: number,
  options: CollapsedTriangleOptions,
  floors: { readonly s: number; readonly u: number },
): CollapsedRule {
  const edge = options.gradeTowardEdge;
  const vertex = options.gradeTowardVertex;
  const panels: Panel[] = [];
  const split = edge && vertex ? 0.5 : edge ? 0 : 1; // u below `split` is the vertex part, above it the edge part
  if (vertex) {
    const points = gradingPoints(vertex, n, 'gradeTowardVertex');
    const breaks = aboveFloor(gradedPanels(0, split, gradingOf(vertex, true)), floors.u);
    for (let i = 0; i + 1 < breaks.length; i++) {
      panels.push({ uLo: breaks[i], sLo: 1 - breaks[i + 1], length: breaks[i + 1] - breaks[i], points });
    }
  }
  if (edge) {
    const points = gradingPoints(edge, n, 'gradeTowardEdge');
    const breaks = aboveFloor(gradedPanels(0, 1 - split, gradingOf(edge, true)), floors.s); // in s, toward s = 0
    for (let i = 0; i + 1 < breaks.length; i++) {
      panels.push({ uLo: 1 - breaks[i + 1], sLo: breaks[i], length: breaks[i + 1] - breaks[i], points });
    }
  }
  if (!edge && !vertex) panels.push({ uLo: 0, sLo: 0, length: 1, points: n });

  // The power tail: the innermost edge panel (s from 0) is dropped and its integral carried by the next one's points.
  const alpha = edge?.tailExponent;
  const tail = alpha !== undefined && alpha > 0 && alpha < 1 ? panels.findIndex((p) => p.sLo === 0 && p.length < 1) : -1;
  if (alpha !== undefined && !(alpha > 0 && alpha < 1)) {
    throw new QuadratureInputError(`collapsedTriangleRule: tailExponent must lie in (0, 1), got ${alpha}`);
  }
  const carrier = tail >= 0 ? panels.findIndex((p) => p.sLo === panels[tail].length) : -1;
  const total = panels.reduce((sum, p, i) => sum + (i === tail && carrier >= 0 ? 0 : p.points), 0);
  const u = new Float64Array(total);
  const s = new Float64Array(total);
  const w = new Float64Array(total);
  const square = tail >= 0 && carrier >= 0 && 2 * alpha! < 1;
  const wSquare = square ? new Float64Array(total) : w;
  let k = 0;
  panels.forEach((p, i) => {
    if (i === tail && carrier >= 0) return;
    const g = gaussLegendre(p.points);
    for (let j = 0; j < p.points; j++) {
      // Node ξ_j maps to u = uLo + L(1 + ξ)/2 and s = sLo + L(1 − ξ)/2; each is formed from its own panel end.
      u[k] = p.uLo + (p.length * (1 + g.nodes[j])) / 2;
      s[k] = p.sLo + (p.length * (1 - g.nodes[j])) / 2;
      w[k] = (p.length * g.weights[j]) / 2;
      if (i === carrier) {
        // ∫₀^δ C s^(−α) ds = C δ^(1−α)/(1 − α), C ≈ Σ_j β_j F(s_j) s_j^α with β_j = g.weights[j]/2 (sum 1).
        const delta = panels[tail].length;
        const base = w[k];
        w[k] += (g.weights[j] / 2) * s[k] ** alpha! * delta ** (1 - alpha!) / (1 - alpha!);
        if (square) wSquare[k] = base + (g.weights[j] / 2) * s[k] ** (2 * alpha!) * delta ** (1 - 2 * alpha!) / (1 - 2 * alpha!);
      } else if (square) {
        wSquare[k] = w[k];
      }
      k++;
    }
  });
  return { u, s, w, wSquare };
}

function gradingOf(g: TriangleGrading, towardA: boolean) {
  return {
    towardA,
    towardB: !towardA,
    ratio: g.ratio ?? DEFAULT_GRADING_RATIO,
    levels: g.levels ?? DEFAULT_GRADING_LEVELS,
  };
}

function gradingPoints(g: TriangleGrading, n: number, name: string): number {
  const points = g.pointsPerPanel ?? n;
  requireInteger(points, `collapsedTriangleRule: ${name}.pointsPerPanel`, 1);
  return points;
}

/** The grading floor in the collapsed coordinate: minDistance (default 1024 ε · scale) divided by `length`. */
function floorOf(g: TriangleGrading | undefined, scale: number, length: number, name: string): number {
  if (!g) return 0;
  const minDistance = g.minDistance ?? 1024 * Number.EPSILON * scale;
  if (!(minDistance >= 0) || !Number.isFinite(minDistance)) {
    throw new QuadratureInputError(`collapsedTriangleRule: ${name}.minDistance must be finite and ≥ 0, got ${minDistance}`);
  }
  return length > 0 ? minDistance / length : 0;
}

/** Drops interior breakpoints below `floor` (the first panel then starts at 0 and ends at the first kept one). */
function aboveFloor(breaks: number[], floor: number): number[] {
  return breaks.filter((t, i) => i === 0 || i === breaks.length - 1 || t >= floor);
}
