/**
 * Evaluation faults of a kernel as diagnostics: a real function outside its domain (sqrt or log of a negative
 * number in a real kernel), a complex value where a real one is needed, and values that are NaN or infinite.
 * Domain faults block the numerical analysis of that kernel; NaN or infinite values (often on a line such as the
 * diagonal of a singular kernel) do not: the spectral engine judges whether they matter.
 *
 * A NaN or infinite value at a point of a singular locus of the expression (log(abs(t − s)) at t = s, 1/(t + s) at
 * the corner) is not reported: that is the singularity itself, and the boundedness check says whether it is
 * integrable. The loci are the engine's (loci.ts): straight lines exactly, other curves where the expression whose
 * zero set they are vanishes at the point.
 */
import type { Diagnostic } from '../diagnostics/types';
import { makeDiagnostic } from '../diagnostics/make';
import { compileKernel, probeFaults, type KernelFault } from '../semantics/evaluator';
import type { KernelSymbol } from '../semantics/model';
import { formatComplex, formatNumber } from '../semantics/values';
import { findLoci } from '../numerics/engine/loci';
import { mayBeComplex } from '../semantics/lower';
import { slotCountOf } from '../semantics/irTools';

export interface FaultResult {
  readonly diagnostics: Diagnostic[];
  /** True when the kernel cannot be analysed (a real-domain or complex-where-real fault). */
  readonly blocking: boolean;
  readonly faults: readonly KernelFault[];
}

/** A test for points that lie on a singular locus of the kernel's expression. */
export function onSingularLocus(k: KernelSymbol): (t: number, s: number) => boolean {
  if (!k.ir || !k.domain) return () => false;
  const { a, b } = k.domain;
  const loci = findLoci(k.ir, [a, b]);
  const scale = Math.max(1, Math.abs(a), Math.abs(b));
  // A removable singularity (sin(t − s)/(t − s)) is 0/0 on its line: NaN there is not a fault of the kernel.
  const lines = loci.loci.filter((l) => l.kind === 'singular' || l.removable).map((l) => l.line);
  const curves = loci.unknown.filter((u) => u.kind === 'singular' && u.node.op !== 'const').map((u) => {
    const slots = slotCountOf(u.node);
    return compileKernel({ root: u.node, arity: 2, slotCount: slots, complex: mayBeComplex(u.node, slots) });
  });
  return (t, s) => lines.some((l) => Math.abs(l.ct * t + l.cs * s + l.c0) <= 1e-12 * scale)
    || curves.some((g) => {
      const v = g.evaluate([t, s]);
      return Math.hypot(v.re, v.im) <= 1e-12 * scale;
    });
}

export function faultDiagnostics(k: KernelSymbol, skip: (t: number, s: number) => boolean = onSingularLocus(k)): FaultResult {
  if (!k.ir || !k.domain) return { diagnostics: [], blocking: false, faults: [] };
  const compiled = compileKernel(k.ir);
  const faults = probeFaults(k.ir, compiled, k.domain.a, k.domain.b)
    .filter((f) => f.fault.kind !== 'non-finite' || !skip(f.t, f.s));
  const diagnostics: Diagnostic[] = [];
  let blocking = false;
  const seen = new Set<string>();
  for (const f of faults) {
    const key = `${f.fault.kind}:${f.fault.range.start}:${f.fault.range.end}`;
    if (seen.has(key)) continue;
    seen.add(key);
    const at = { t: formatNumber(f.t), s: formatNumber(f.s) };
    const figures = { t: f.t, s: f.s };
    const arg = formatComplex({ re: f.fault.argRe, im: f.fault.argIm });
    if (f.fault.kind === 'real-domain') {
      blocking = true;
      diagnostics.push(makeDiagnostic('real-domain-fault', f.fault.range, { fn: f.fault.fn ?? 'this operation', arg, ...at }, { figures }));
    } else if (f.fault.kind === 'complex-where-real') {
      blocking = true;
      diagnostics.push(makeDiagnostic('complex-where-real', f.fault.range, { what: f.fault.fn ?? 'This operation', value: arg, ...at }, { figures }));
    } else {
      const value = formatComplex({ re: f.fault.valueRe, im: f.fault.valueIm });
      diagnostics.push(makeDiagnostic('non-finite-value', f.fault.range, { name: k.name, value, ...at }, { figures }));
    }
  }
  return { diagnostics, blocking, faults };
}
