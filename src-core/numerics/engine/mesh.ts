/**
 * The panels of a discretisation level. Breakpoints include every axis-parallel locus (t = c or s = c: the same
 * panels serve t and s, so that the Galerkin matrix of a Hermitian kernel stays Hermitian); panels are graded
 * geometrically toward points where the kernel is singular (the h-part of hp-refinement: W. Gui & I. Babuška,
 * Numer. Math. 49 (1986); C. Schwab, p- and hp-Finite Element Methods, 1998, ch. 4), because eigenfunctions of
 * weakly singular kernels are themselves singular there (at the ends of the interval for a diagonal singularity).
 *
 * An oblique kink or jump (on a line such as t − s = c) is integrated exactly by the cut quadrature of pairRule.ts,
 * but it leaves a trace in the eigenfunctions: where the line enters or leaves the square at s = a (say, at t = a + c),
 * (Tφ)(t) = ∫ K(t, s) φ(s) ds changes the number of smooth pieces it integrates over, so Tφ, and with it every
 * eigenfunction, loses smoothness at t = a + c (a jump in the second derivative behind a kink, in the first behind a
 * jump). Applying T again carries that point along the line to a + 2c, two derivatives smoother behind a kink (one
 * behind a jump). Breakpoints at the entry points and at their first images (three generations behind a jump)
 * keep every panel's eigenfunction pieces smooth enough for p-refinement to converge quickly (the same reason
 * panels respect axis-parallel loci; common practice for piecewise-polynomial Galerkin methods, stated here from
 * the argument above rather than from a source).
 */
import { gradedPanels } from '../quadrature';
import type { Line, Locus } from './loci';

export interface MeshPlan {
  readonly a: number;
  readonly b: number;
  /** Breakpoints forced by loci, ascending, with a and b. */
  readonly base: readonly number[];
  /** Points toward which panels are graded. */
  readonly gradePoints: readonly number[];
}

function uniqueSorted(xs: number[], scale: number): number[] {
  const s = [...xs].sort((x, y) => x - y);
  const out: number[] = [];
  for (const x of s) if (out.length === 0 || x - out[out.length - 1] > 1e-13 * scale) out.push(x);
  return out;
}

/** Coordinates (t or s) where a line meets the boundary of the square [a, b]². */
function boundaryCoordinates(l: Line, a: number, b: number): number[] {
  const out: number[] = [];
  const inside = (x: number) => x >= a - 1e-12 * (b - a) && x <= b + 1e-12 * (b - a);
  for (const edge of [a, b]) {
    if (l.cs !== 0) {
      const s = -(l.ct * edge + l.c0) / l.cs; // on t = edge
      if (inside(s)) out.push(edge, s);
    }
    if (l.ct !== 0) {
      const t = -(l.cs * edge + l.c0) / l.ct; // on s = edge
      if (inside(t)) out.push(edge, t);
    }
  }
  return out.map((x) => Math.min(b, Math.max(a, x)));
}

/**
 * Points where the eigenfunctions of a kernel with a kink or jump on the oblique line l lose smoothness: where l
 * meets the boundary of the square, and those points carried along l in either direction (t ↦ s and s ↦ t) for
 * `generations` steps. Each step gains one derivative behind a jump and two behind a kink, so jumps are followed
 * further; at most 24 points per line.
 */
export function obliqueTracePoints(l: Line, a: number, b: number, generations = 1): number[] {
  const inside = (x: number) => x > a + 1e-12 * (b - a) && x < b - 1e-12 * (b - a);
  let front = boundaryCoordinates(l, a, b).filter(inside);
  const out = [...front];
  for (let g = 0; g < generations && front.length > 0 && out.length < 24; g++) {
    const next: number[] = [];
    for (const x of front) {
      next.push(-(l.cs * x + l.c0) / l.ct); // the line at s = x
      next.push(-(l.ct * x + l.c0) / l.cs); // the line at t = x
    }
    front = next.filter((x) => inside(x) && !out.some((y) => Math.abs(y - x) <= 1e-12 * (b - a)));
    out.push(...front);
  }
  return out.slice(0, 24);
}

export function planMesh(loci: readonly Locus[], a: number, b: number): MeshPlan {
  const scale = b - a;
  const base = [a, b];
  const grade: number[] = [];
  for (const { line, kind } of loci) {
    const axis = line.cs === 0 ? -line.c0 / line.ct : line.ct === 0 ? -line.c0 / line.cs : null;
    if (axis !== null) {
      if (axis > a && axis < b) base.push(axis);
      if (kind === 'singular') grade.push(Math.min(b, Math.max(a, axis)));
    } else if (kind === 'singular') {
      grade.push(...boundaryCoordinates(line, a, b));
    } else {
      base.push(...obliqueTracePoints(line, a, b, kind === 'jump' ? 3 : 1));
    }
  }
  const baseSorted = uniqueSorted(base, scale);
  // Grade points are snapped to the base breakpoints they coincide with (grading happens inside base intervals).
  const gradeSnapped = uniqueSorted(grade, scale).map((g) => {
    const near = baseSorted.find((x) => Math.abs(x - g) <= 1e-12 * scale);
    return near ?? g;
  });
  const extra = gradeSnapped.filter((g) => !baseSorted.some((x) => Math.abs(x - g) <= 1e-12 * scale));
  return { a, b, base: uniqueSorted([...baseSorted, ...extra], scale), gradePoints: gradeSnapped };
}

/**
 * Breakpoints of a level: each base interval is split into equal parts no longer than the longest base interval
 * divided by `split` (so short intervals between nearby loci are not cut further while the long ones are), and
 * graded with `levels` geometric levels toward each grade point at its ends.
 */
export function meshBreakpoints(plan: MeshPlan, split: number, levels: number): number[] {
  const scale = plan.b - plan.a;
  const isGrade = (x: number) => plan.gradePoints.some((g) => Math.abs(g - x) <= 1e-12 * scale);
  const out: number[] = [plan.base[0]];
  let longest = 0;
  for (let k = 0; k + 1 < plan.base.length; k++) longest = Math.max(longest, plan.base[k + 1] - plan.base[k]);
  for (let k = 0; k + 1 < plan.base.length; k++) {
    const x0 = plan.base[k];
    const x1 = plan.base[k + 1];
    const towardA = levels > 0 && isGrade(x0);
    const towardB = levels > 0 && isGrade(x1);
    const pieces = split > 1 ? Math.max(1, Math.ceil((split * (x1 - x0)) / longest - 1e-9)) : 1;
    for (let j = 0; j < pieces; j++) {
      const y0 = x0 + ((x1 - x0) * j) / pieces;
      const y1 = j + 1 === pieces ? x1 : x0 + ((x1 - x0) * (j + 1)) / pieces;
      const ga = towardA && j === 0;
      const gb = towardB && j === pieces - 1;
      const pts = ga || gb ? gradedPanels(y0, y1, { towardA: ga, towardB: gb, levels }) : [y0, y1];
      for (let i = 1; i < pts.length; i++) out.push(pts[i]);
    }
  }
  return out;
}
