/**
 * Non-smooth places whose zero set is not a straight line are kept only when numerical sampling shows that set
 * meets the square: the expression changes sign, or comes close to zero, on a grid of the square with its
 * diagonal. (A denominator 1 + (t − s)² never vanishes, so it needs no special treatment.)
 */
import { compileKernel } from '../../semantics/evaluator';
import { mayBeComplex } from '../../semantics/lower';
import { slotCountOf } from '../../semantics/irTools';
import type { LociResult } from './loci';

export function confirmUnknownLoci(unknown: LociResult['unknown'], domain: readonly [number, number]): LociResult['unknown'] {
  const [a, b] = domain;
  const m = 49;
  const ts = new Float64Array(m * m + m);
  const ss = new Float64Array(m * m + m);
  let k = 0;
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < m; j++) {
      ts[k] = a + ((b - a) * i) / (m - 1);
      ss[k] = a + ((b - a) * j) / (m - 1);
      k++;
    }
  }
  for (let i = 0; i < m; i++, k++) {
    ts[k] = a + ((b - a) * (i + 0.5)) / m;
    ss[k] = ts[k];
  }
  return unknown.filter((u) => {
    if (u.node.op === 'const') return true;
    const slots = slotCountOf(u.node);
    const fn = { root: u.node, arity: 2, slotCount: slots, complex: mayBeComplex(u.node, slots) };
    const kernel = compileKernel(fn);
    const re = new Float64Array(ts.length);
    const im = new Float64Array(ts.length);
    kernel.evaluateColumns([ts, ss], re, fn.complex ? im : null);
    let pos = false;
    let neg = false;
    let minAbs = Infinity;
    let maxAbs = 0;
    for (let i = 0; i < re.length; i++) {
      const v = fn.complex ? Math.hypot(re[i], im[i]) : re[i];
      if (!Number.isFinite(v)) return true;
      if (v > 0) pos = true;
      if (v < 0) neg = true;
      minAbs = Math.min(minAbs, Math.abs(v));
      maxAbs = Math.max(maxAbs, Math.abs(v));
    }
    return (pos && neg) || minAbs <= 1e-3 * maxAbs;
  });
}
