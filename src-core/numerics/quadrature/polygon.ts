/**
 * Convex polygons cut by a straight line: splitting, fan triangulation and area.
 *
 * Method: one pass of Sutherland–Hodgman clipping against each of the two half-planes a·t + b·s ≤ c and ≥ c
 * (I. E. Sutherland and G. W. Hodgman, "Reentrant polygon clipping", Comm. ACM 17 (1974)), with the signed
 * distances snapped to zero within a tolerance relative to the polygon's size, so that a line through a vertex
 * or along an edge produces no duplicate vertices and no slivers. The shoelace formula gives the area.
 *
 * Used to split a panel rectangle along a kink locus a·t + b·s = c before triangulating each side for the
 * collapsed triangle rules.
 */
import { QuadratureInputError, type Vec2 } from './types';

/** The two sides of a split; either may be empty (the line misses the polygon or only touches it). */
export interface PolygonSplit {
  /** The part where a·t + b·s ≤ c. */
  readonly below: Vec2[];
  /** The part where a·t + b·s ≥ c. */
  readonly above: Vec2[];
}

/** Signed distances within this fraction of the polygon's diameter count as on the line. */
const SNAP = 1e-12;
/** Pieces with less than this fraction of the polygon's area are dropped. */
const SLIVER = 1e-15;

/** Shoelace area, positive for counter-clockwise vertex order. */
export function signedPolygonArea(poly: readonly Vec2[]): number {
  let s = 0;
  const m = poly.length;
  for (let i = 0; i < m; i++) {
    const p = poly[i];
    const q = poly[(i + 1) % m];
    s += p[0] * q[1] - q[0] * p[1];
  }
  return s / 2;
}

/** Area of a simple polygon (either orientation). */
export function polygonArea(poly: readonly Vec2[]): number {
  return Math.abs(signedPolygonArea(poly));
}

/**
 * Splits the convex polygon by the line a·t + b·s = c. Each side is a convex polygon in the input orientation,
 * without repeated or collinear vertices, or empty when its area is below 1e-15 of the polygon's area.
 */
export function splitConvexPolygon(poly: readonly Vec2[], a: number, b: number, c: number): PolygonSplit {
  if (!Number.isFinite(a) || !Number.isFinite(b) || !Number.isFinite(c) || (a === 0 && b === 0)) {
    throw new QuadratureInputError(`splitConvexPolygon: need finite a, b, c with (a, b) ≠ (0, 0), got ${a}, ${b}, ${c}`);
  }
  const clean = checkConvex(poly, 'splitConvexPolygon');
  if (clean.length === 0) return { below: [], above: [] };
  const total = polygonArea(clean);
  const diameter = diameterOf(clean);
  const norm = Math.hypot(a, b);
  const tol = SNAP * diameter;
  const dist = clean.map((p) => {
    const d = (a * p[0] + b * p[1] - c) / norm;
    return Math.abs(d) <= tol ? 0 : d;
  });
  const below: Vec2[] = [];
  const above: Vec2[] = [];
  const m = clean.length;
  for (let i = 0; i < m; i++) {
    const p = clean[i];
    const q = clean[(i + 1) % m];
    const dp = dist[i];
    const dq = dist[(i + 1) % m];
    if (dp <= 0) below.push(p);
    if (dp >= 0) above.push(p);
    if ((dp < 0 && dq > 0) || (dp > 0 && dq < 0)) {
      const t = dp / (dp - dq);
      const cut: Vec2 = [p[0] + t * (q[0] - p[0]), p[1] + t * (q[1] - p[1])];
      below.push(cut);
      above.push(cut);
    }
  }
  return {
    below: tidy(below, diameter, total),
    above: tidy(above, diameter, total),
  };
}

/** Fan triangulation from the first vertex of a convex polygon; degenerate triangles are skipped. */
export function triangulateConvex(poly: readonly Vec2[]): [Vec2, Vec2, Vec2][] {
  const clean = checkConvex(poly, 'triangulateConvex');
  const total = polygonArea(clean);
  const out: [Vec2, Vec2, Vec2][] = [];
  for (let i = 1; i + 1 < clean.length; i++) {
    const tri: [Vec2, Vec2, Vec2] = [clean[0], clean[i], clean[i + 1]];
    if (polygonArea(tri) > SLIVER * total) out.push(tri);
  }
  return out;
}

function diameterOf(poly: readonly Vec2[]): number {
  let minX = Infinity;
  let maxX = -Infinity;
  let minY = Infinity;
  let maxY = -Infinity;
  for (const [x, y] of poly) {
    minX = Math.min(minX, x);
    maxX = Math.max(maxX, x);
    minY = Math.min(minY, y);
    maxY = Math.max(maxY, y);
  }
  return Math.hypot(maxX - minX, maxY - minY);
}

/**
 * Validates the vertices (finite pairs), removes repeated and collinear vertices, and checks convexity.
 * Returns [] for a polygon of zero area.
 */
function checkConvex(poly: readonly Vec2[], fn: string): Vec2[] {
  for (let i = 0; i < poly.length; i++) {
    const p = poly[i];
    if (p.length !== 2 || !Number.isFinite(p[0]) || !Number.isFinite(p[1])) {
      throw new QuadratureInputError(`${fn}: vertex ${i} must be two finite numbers, got [${p.join(', ')}]`);
    }
  }
  if (poly.length < 3) return [];
  const diameter = diameterOf(poly);
  const clean = removeRedundant(poly.slice(), diameter);
  if (clean.length < 3) return [];
  const orientation = Math.sign(signedPolygonArea(clean));
  const m = clean.length;
  for (let i = 0; i < m; i++) {
    if (Math.sign(cross(clean[i], clean[(i + 1) % m], clean[(i + 2) % m])) !== orientation) {
      throw new QuadratureInputError(`${fn}: the polygon is not convex (turn at vertex ${(i + 1) % m})`);
    }
  }
  return clean;
}

/** Cross product (q − p) × (r − q): the turn at q. */
function cross(p: Vec2, q: Vec2, r: Vec2): number {
  return (q[0] - p[0]) * (r[1] - q[1]) - (q[1] - p[1]) * (r[0] - q[0]);
}

/** Drops vertices that repeat their predecessor or lie on the segment joining their neighbours. */
function removeRedundant(pts: Vec2[], diameter: number): Vec2[] {
  const near = SNAP * diameter;
  let changed = true;
  while (changed && pts.length >= 3) {
    changed = false;
    for (let i = 0; i < pts.length && pts.length >= 3; i++) {
      const prev = pts[(i - 1 + pts.length) % pts.length];
      const cur = pts[i];
      const next = pts[(i + 1) % pts.length];
      const repeated = Math.hypot(cur[0] - prev[0], cur[1] - prev[1]) <= near;
      const chord = Math.hypot(next[0] - prev[0], next[1] - prev[1]);
      // Distance of cur from the line prev–next (a turn of less than `near` in position counts as straight).
      const straight = !repeated && chord > 0 && Math.abs(cross(prev, cur, next)) / chord <= near;
      if (repeated || straight) {
        pts.splice(i, 1);
        changed = true;
        i--;
      }
    }
  }
  return pts.length >= 3 ? pts : [];
}

function tidy(pts: Vec2[], diameter: number, total: number): Vec2[] {
  const clean = removeRedundant(pts, diameter);
  if (clean.length < 3 || polygonArea(clean) <= SLIVER * total) return [];
  return clean;
}

