import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  polygonArea,
  QuadratureInputError,
  signedPolygonArea,
  splitConvexPolygon,
  triangulateConvex,
} from '../../../src-core/numerics/quadrature/index';
import type { Vec2 } from '../../../src-core/numerics/quadrature/index';

const square: Vec2[] = [
  [0, 0],
  [1, 0],
  [1, 1],
  [0, 1],
];

/** No two vertices (cyclically adjacent or not) closer than `gap`. */
function expectDistinct(poly: readonly Vec2[], gap = 1e-12): void {
  for (let i = 0; i < poly.length; i++) {
    for (let j = i + 1; j < poly.length; j++) {
      expect(Math.hypot(poly[i][0] - poly[j][0], poly[i][1] - poly[j][1])).toBeGreaterThan(gap);
    }
  }
}

/** Strictly convex with the orientation of `sign`: every turn has that sign. */
function expectConvex(poly: readonly Vec2[], sign: number): void {
  const m = poly.length;
  for (let i = 0; i < m; i++) {
    const p = poly[i];
    const q = poly[(i + 1) % m];
    const r = poly[(i + 2) % m];
    const turn = (q[0] - p[0]) * (r[1] - q[1]) - (q[1] - p[1]) * (r[0] - q[0]);
    expect(Math.sign(turn)).toBe(sign);
  }
}

describe('polygonArea', () => {
  it('gives the shoelace area with sign by orientation', () => {
    expect(polygonArea(square)).toBe(1);
    expect(signedPolygonArea(square)).toBe(1);
    expect(signedPolygonArea([...square].reverse())).toBe(-1);
    expect(polygonArea([[0, 0], [4, 0], [0, 3]])).toBe(6);
  });
});

describe('splitConvexPolygon', () => {
  it('a line through the middle: two rectangles of area 1/2', () => {
    const { below, above } = splitConvexPolygon(square, 1, 0, 0.5);
    expect(polygonArea(below)).toBeCloseTo(0.5, 15);
    expect(polygonArea(above)).toBeCloseTo(0.5, 15);
    expect(below.length).toBe(4);
    expect(above.length).toBe(4);
    for (const [t] of below) expect(t).toBeLessThanOrEqual(0.5);
    for (const [t] of above) expect(t).toBeGreaterThanOrEqual(0.5);
  });

  it('the diagonal t = s through two vertices: two triangles, no duplicated vertices', () => {
    const { below, above } = splitConvexPolygon(square, 1, -1, 0);
    expect(below.length).toBe(3);
    expect(above.length).toBe(3);
    expect(polygonArea(below)).toBe(0.5);
    expect(polygonArea(above)).toBe(0.5);
    expectDistinct(below);
    expectDistinct(above);
  });

  it('a line along an edge leaves one side empty and the other the whole polygon', () => {
    const { below, above } = splitConvexPolygon(square, 1, 0, 0);
    expect(below).toEqual([]);
    expect(polygonArea(above)).toBe(1);
    expect(above.length).toBe(4);
    const top = splitConvexPolygon(square, 0, 1, 1);
    expect(top.above).toEqual([]);
    expect(top.below.length).toBe(4);
  });

  it('a line touching only a vertex, or missing the polygon, splits nothing off', () => {
    const corner = splitConvexPolygon(square, 1, 1, 0);
    expect(corner.below).toEqual([]);
    expect(polygonArea(corner.above)).toBe(1);
    const away = splitConvexPolygon(square, 1, 0, 5);
    expect(away.above).toEqual([]);
    expect(polygonArea(away.below)).toBe(1);
  });

  it('a line a hair past a vertex leaves no sliver and no near-duplicate vertex', () => {
    // t + s = 2 − 1e-15 cuts a triangle of area 5e-31 off the corner (1, 1): snapped away.
    const { below, above } = splitConvexPolygon(square, 1, 1, 2 - 1e-15);
    expect(above).toEqual([]);
    expect(below.length).toBe(4);
    expect(polygonArea(below)).toBe(1);
    expectDistinct(below);
    // t + s = 1 + 1e-15 runs a hair beside the vertices (1, 0) and (0, 1): two triangles, snapped onto them.
    const anti = splitConvexPolygon(square, 1, 1, 1 + 1e-15);
    expect(anti.below.length).toBe(3);
    expect(anti.above.length).toBe(3);
    expect(polygonArea(anti.below) + polygonArea(anti.above)).toBeCloseTo(1, 15);
    const close = splitConvexPolygon(square, 1, -1, 1e-14); // t − s = 1e-14 passes near (0, 0) and (1, 1)
    expect(close.below.length).toBe(3);
    expect(close.above.length).toBe(3);
    expectDistinct(close.below);
    expectDistinct(close.above);
  });

  it('keeps the input orientation', () => {
    const cw = [...square].reverse();
    const { below, above } = splitConvexPolygon(cw, 2, 1, 1.2);
    expect(signedPolygonArea(below)).toBeLessThan(0);
    expect(signedPolygonArea(above)).toBeLessThan(0);
  });

  it('random lines: areas add up, sides are convex, distinct, and on their side of the line', () => {
    const rect: Vec2[] = [
      [-1, 0.5],
      [2, 0.5],
      [2, 3],
      [-1, 3],
    ];
    const total = polygonArea(rect);
    const num = fc.double({ min: -3, max: 3, noNaN: true });
    fc.assert(
      fc.property(num, num, fc.double({ min: -6, max: 6, noNaN: true }), (a, b, c) => {
        fc.pre(Math.hypot(a, b) > 1e-3);
        const { below, above } = splitConvexPolygon(rect, a, b, c);
        expect(Math.abs(polygonArea(below) + polygonArea(above) - total)).toBeLessThan(1e-12 * total);
        const tol = 1e-11 * (Math.abs(a) + Math.abs(b) + Math.abs(c) + 1);
        for (const side of [below, above]) {
          if (side.length === 0) continue;
          expect(side.length).toBeGreaterThanOrEqual(3);
          expectConvex(side, 1);
          expectDistinct(side, 1e-13);
        }
        for (const [t, s] of below) expect(a * t + b * s - c).toBeLessThanOrEqual(tol);
        for (const [t, s] of above) expect(a * t + b * s - c).toBeGreaterThanOrEqual(-tol);
      }),
      { numRuns: 500 },
    );
  });

  it('lines through vertices of a random convex polygon never create duplicates or slivers', () => {
    // Regular hexagon; lines through pairs of its vertices.
    const hex: Vec2[] = Array.from({ length: 6 }, (_, k) => [Math.cos((k * Math.PI) / 3), Math.sin((k * Math.PI) / 3)]);
    const total = polygonArea(hex);
    for (let i = 0; i < 6; i++) {
      for (let j = i + 1; j < 6; j++) {
        const [p, q] = [hex[i], hex[j]];
        const a = q[1] - p[1];
        const b = p[0] - q[0];
        const c = a * p[0] + b * p[1];
        const { below, above } = splitConvexPolygon(hex, a, b, c);
        expect(Math.abs(polygonArea(below) + polygonArea(above) - total)).toBeLessThan(1e-14);
        for (const side of [below, above]) {
          if (side.length > 0) {
            expectDistinct(side);
            expect(polygonArea(side)).toBeGreaterThan(1e-3);
          }
        }
        // adjacent vertices span an edge: one side is everything
        if (j === i + 1 || (i === 0 && j === 5)) expect(Math.min(below.length, above.length)).toBe(0);
      }
    }
  });

  it('rejects a non-convex polygon and a degenerate line', () => {
    const dart: Vec2[] = [
      [0, 0],
      [2, 1],
      [0, 2],
      [0.5, 1],
    ];
    expect(() => splitConvexPolygon(dart, 1, 0, 0.2)).toThrow(/not convex/);
    expect(() => splitConvexPolygon(square, 0, 0, 1)).toThrow(QuadratureInputError);
    expect(() => splitConvexPolygon([[0, 0], [1, Number.NaN], [0, 1]], 1, 0, 0)).toThrow(/vertex 1/);
  });
});

describe('triangulateConvex', () => {
  it('fans a convex polygon into m − 2 triangles whose areas add up', () => {
    const hex: Vec2[] = Array.from({ length: 6 }, (_, k) => [2 + Math.cos(k), 1 + Math.sin(k)]);
    const tris = triangulateConvex(hex);
    expect(tris.length).toBe(4);
    const sum = tris.reduce((s, t) => s + polygonArea(t), 0);
    expect(Math.abs(sum - polygonArea(hex))).toBeLessThan(1e-15);
  });

  it('drops collinear and repeated vertices, so no triangle is degenerate', () => {
    const withExtras: Vec2[] = [
      [0, 0],
      [0.5, 0],
      [1, 0],
      [1, 0],
      [1, 1],
      [0, 1],
    ];
    const tris = triangulateConvex(withExtras);
    expect(tris.length).toBe(2);
    for (const t of tris) expect(polygonArea(t)).toBeCloseTo(0.5, 15);
  });

  it('returns nothing for a degenerate polygon', () => {
    expect(triangulateConvex([[0, 0], [1, 1], [2, 2]])).toEqual([]);
    expect(triangulateConvex([])).toEqual([]);
  });
});
