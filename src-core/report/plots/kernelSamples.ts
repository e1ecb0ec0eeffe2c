/**
 * K sampled for its pictures: values at the centres of an n × n grid of cells covering the square (the compiled
 * evaluator, the same code the spectral engine integrates), and the straight lines where K is not smooth, read from
 * the expression by the engine's `findLoci` and clipped to the square. Lines of the same place are drawn once, with
 * the strongest kind (singular over jump over kink).
 */
import { findLoci, sameLine, type Locus, type LocusKind } from '../../numerics/engine/loci';
import { segmentInSquare } from '../../numerics/engine/singularity';
import { describePlace } from '../../checks/sampling';
import { compileKernel } from '../../semantics/evaluator';
import type { IrFunction } from '../../semantics/ir';
import type { KernelSymbol } from '../../semantics/model';
import type { KernelSamples, LocusSegment } from './plotTypes';

/** Default cells per axis: fine enough to show the shape, small enough for an SVG of a few hundred kilobytes. */
export const defaultSamplePoints = 48;

const strength: Record<LocusKind, number> = { kink: 0, jump: 1, singular: 2 };

function cellCentres(a: number, b: number, n: number): Float64Array {
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = a + ((b - a) * (i + 0.5)) / n;
  return out;
}

function finiteOrNull(x: number): number | null {
  return Number.isFinite(x) ? x : null;
}

/** The distinct straight non-smooth lines of K that meet the square, each clipped to it. */
export function lociSegments(ir: IrFunction, a: number, b: number): LocusSegment[] {
  const kept: Locus[] = [];
  for (const locus of findLoci(ir, [a, b]).loci) {
    const k = kept.findIndex((l) => sameLine(l.line, locus.line));
    if (k < 0) kept.push(locus);
    else if (strength[locus.kind] > strength[kept[k].kind]) kept[k] = locus;
  }
  const out: LocusSegment[] = [];
  for (const locus of kept) {
    const seg = segmentInSquare(locus.line, a, b);
    if (!seg) continue;
    out.push({ kind: locus.kind, label: describePlace(locus.line, a, b), from: seg[0], to: seg[1] });
  }
  return out;
}

/** Samples K on its square; null when the kernel has errors (no IR) or no valid domain. */
export function kernelSamples(kernel: KernelSymbol, points: number = defaultSamplePoints): KernelSamples | null {
  if (!kernel.ir || !kernel.domain) return null;
  const { a, b } = kernel.domain;
  if (!(Number.isFinite(a) && Number.isFinite(b) && b > a)) return null;
  const n = Math.max(2, Math.min(400, Math.round(points)));
  const grid = cellCentres(a, b, n);
  const compiled = compileKernel(kernel.ir);
  const re = new Float64Array(n * n);
  const im = compiled.complex ? new Float64Array(n * n) : null;
  compiled.evaluateGrid(grid, grid, re, im);
  return {
    domain: [a, b],
    points: n,
    grid: Array.from(grid),
    re: Array.from(re, finiteOrNull),
    im: im ? Array.from(im, finiteOrNull) : null,
    loci: lociSegments(kernel.ir, a, b),
  };
}
