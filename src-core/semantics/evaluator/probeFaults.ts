/**
 * Finds where a kernel's values break down on [a, b]²: the compiled kernel is evaluated on a tensor grid and every
 * point with a NaN or infinite value is explained by the interpreter (which node, which kind of fault).
 *
 * Sample points: the n Chebyshev–Gauss points (a+b)/2 + (b−a)/2 · cos((2k−1)π/(2n)), k = 1..n (the zeros of the
 * Chebyshev polynomial T_n: interior points that cluster toward the ends as Gauss–Legendre nodes do), together with
 * a, b and the midpoint. The grid is the product of this set with itself, so it holds the diagonal t = s exactly,
 * all four edges and the corners: the usual homes of singularities.
 *
 * Result: at most `max` faults, ordered by kind (real-domain, complex-where-real, non-finite), then by the source
 * position of the faulty node, then by t and s. When there are more, every distinct (kind, node) gets its first
 * point (smallest t, then s) before any gets a second, so one fault line cannot hide another.
 */
import type { IrFunction } from '../ir';
import type { CompiledKernel, EvalFaultKind, KernelFault } from './evalTypes';
import { interpretWithShape } from './interpret';
import { analyzeIr } from './irShape';

const kindOrder: Readonly<Record<EvalFaultKind, number>> = { 'real-domain': 0, 'complex-where-real': 1, 'non-finite': 2 };

/** The sample points on [a, b], sorted and without repeats. */
export function probePoints(a: number, b: number, n: number): Float64Array {
  const points = new Set<number>([a, b, (a + b) / 2]);
  const mid = (a + b) / 2;
  const half = (b - a) / 2;
  for (let k = 1; k <= n; k++) points.add(mid + half * Math.cos(((2 * k - 1) * Math.PI) / (2 * n)));
  return Float64Array.from([...points].sort((x, y) => x - y));
}

function compareFaults(x: KernelFault, y: KernelFault): number {
  return (
    kindOrder[x.fault.kind] - kindOrder[y.fault.kind] ||
    x.fault.range.start - y.fault.range.start ||
    x.fault.range.end - y.fault.range.end ||
    x.t - y.t ||
    x.s - y.s
  );
}

export function probeFaults(fn: IrFunction, kernel: CompiledKernel, a: number, b: number, n = 32, max = 64): KernelFault[] {
  if (!Number.isFinite(a) || !Number.isFinite(b) || a > b) throw new RangeError(`bad interval [${a}, ${b}]`);
  const count = Math.max(1, Math.floor(n));
  const points = probePoints(a, b, count);
  const m = points.length;
  const re = new Float64Array(m * m);
  const im = kernel.complex ? new Float64Array(m * m) : null;
  kernel.evaluateGrid(points, points, re, im);

  const shape = analyzeIr(fn);
  const all: KernelFault[] = [];
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < m; j++) {
      const k = i * m + j;
      if (Number.isFinite(re[k]) && (im === null || Number.isFinite(im[k]))) continue;
      const t = points[i];
      const s = points[j];
      const r = interpretWithShape(shape, [t, s]);
      if (!r.ok) all.push({ t, s, fault: r.fault });
    }
  }
  all.sort(compareFaults);
  if (all.length <= max) return all;

  // Round robin over the (kind, node) groups, which `all` already lists contiguously and in order.
  const groups: KernelFault[][] = [];
  for (const f of all) {
    const g = groups[groups.length - 1];
    if (g && g[0].fault.kind === f.fault.kind && g[0].fault.range.start === f.fault.range.start && g[0].fault.range.end === f.fault.range.end) g.push(f);
    else groups.push([f]);
  }
  const chosen: KernelFault[] = [];
  for (let round = 0; chosen.length < max; round++) {
    for (const g of groups) {
      if (round < g.length && chosen.length < max) chosen.push(g[round]);
    }
  }
  return chosen.sort(compareFaults);
}
