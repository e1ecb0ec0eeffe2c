/**
 * The numerical analysis of one kernel: the spectral engine's result as report data and diagnostics, cached by the
 * hash of the kernel's resolved definition and the options, so editing one kernel does not recompute the others.
 */
import type { Diagnostic } from '../diagnostics/types';
import { makeDiagnostic } from '../diagnostics/make';
import type { KernelSymbol } from '../semantics/model';
import type { CancellationToken } from '../util/cancellation';
import { forgetHashes } from '../util/hashCache';
import { runSpectralEngine, type SpectralResult } from '../numerics/engine/spectralEngine';
import { crossCheckSeparable } from '../numerics/engine/degenerate';
import { describeTriangular, detectTriangularSupport, triangularOnGrid } from '../numerics/engine/triangular';
import { compileKernel } from '../semantics/evaluator';
import { nodeAtPosition, positionOfRange } from '../semantics/irTools';
import type { IrFunction } from '../semantics/ir';
import type { AnalysisOptions, SpectrumReport } from './types';

export interface KernelNumerics {
  readonly result: SpectralResult;
  readonly spectrum: SpectrumReport | null;
  readonly diagnostics: Diagnostic[];
}

const cacheLimit = 256;
/** Memory the cached results may hold together (their matrices and vectors), in bytes: a long session stays bounded. */
const cacheByteLimit = 160 * 2 ** 20;
interface CacheEntry {
  readonly result: SpectralResult;
  readonly spectrum: SpectrumReport | null;
  readonly notes: ((k: KernelSymbol) => Diagnostic)[];
  readonly bytes: number;
}
const cache = new Map<string, CacheEntry>();
let cacheBytes = 0;

export function clearSpectralCache(): void {
  cache.clear();
  cacheBytes = 0;
}

/** The typed arrays an entry keeps alive (the finest level's matrix and vectors), plus a small allowance for the rest. */
function entryBytes(result: SpectralResult): number {
  const f = result.finest;
  if (!f) return 4096;
  let bytes = 4096 + f.matrix.re.byteLength + (f.matrix.im?.byteLength ?? 0) + f.allRe.byteLength + f.allIm.byteLength;
  for (const p of f.pairs) bytes += p.vecRe.byteLength + (p.vecIm?.byteLength ?? 0);
  return bytes;
}

function evictOldest(): void {
  while (cache.size > 1 && (cache.size > cacheLimit || cacheBytes > cacheByteLimit)) {
    const oldest = cache.keys().next().value as string;
    cacheBytes -= cache.get(oldest)!.bytes;
    cache.delete(oldest);
  }
}

/** Drops the cached results of the kernels with these definition hashes (whatever the options). */
export function forgetSpectra(hashes: ReadonlySet<string>): void {
  forgetHashes(cache, hashes);
  cacheBytes = 0;
  for (const e of cache.values()) cacheBytes += e.bytes;
}

function optionsKey(o: AnalysisOptions): string {
  return `${o.eigenCount}|${o.timeBudgetMs}|${o.maxResolution}|${o.targetAccuracy}|${o.gridPoints}`;
}

function compute(k: KernelSymbol, options: AnalysisOptions, token?: CancellationToken) {
  const ir = k.ir!;
  const domain: [number, number] = [k.domain!.a, k.domain!.b];
  const result = runSpectralEngine(k.name, ir, domain, options, token);
  const notes: ((k: KernelSymbol) => Diagnostic)[] = [];
  for (const cap of result.caps) {
    if (cap.kind === 'integer-lines') {
      const lines = cap.lines < 1e6 ? String(cap.lines) : `about ${cap.lines.toExponential(1)}`;
      // The entry is shared by every kernel with this definition hash, in any document: the range is found again
      // in the kernel at hand (a fuzz run found the first document's range reported in a second one).
      const position = positionOfRange(ir.root, cap.range);
      const rangeIn = (sym: KernelSymbol) => (sym.ir ? nodeAtPosition(sym.ir.root, position)?.range : undefined) ?? sym.nameRange;
      notes.push((sym) => makeDiagnostic('jump-lines-capped', rangeIn(sym), { name: sym.name, lines, cap: cap.cap },
        { figures: { lines: cap.lines, cap: cap.cap } }));
    } else {
      notes.push((sym) => makeDiagnostic('loci-capped', sym.nameRange, {
        name: sym.name, loci: cap.loci, followed: cap.followed, maxResolution: cap.maxResolution,
      }, { figures: { loci: cap.loci, followed: cap.followed } }));
    }
  }
  let spectrum = result.spectrum;
  if (!spectrum) {
    const reason = result.reason ?? 'unknown reason';
    notes.push((sym) => makeDiagnostic('spectrum-unavailable', sym.nameRange, { name: sym.name, reason }));
    return { result, spectrum, notes };
  }
  const separable = crossCheckSeparable(ir, domain, result, options);
  if (separable) {
    spectrum = separable.spectrum;
    for (const m of separable.mismatches) {
      notes.push((sym) => makeDiagnostic('methods-disagree', sym.nameRange, { name: sym.name, ...m }));
    }
  }
  let reachedFigure = result.reached;
  const volterra = quasinilpotentSpectrum(ir, domain, result, spectrum);
  if (volterra) {
    spectrum = volterra.spectrum;
    reachedFigure = volterra.reached;
  } else {
    const unproven = unprovenTriangular(ir, domain, result, spectrum);
    if (unproven) {
      spectrum = unproven.spectrum;
      reachedFigure = Math.max(reachedFigure, unproven.reached);
    }
  }
  if (!spectrum.converged) {
    const reached = reachedFigure.toExponential(1);
    const target = result.target.toExponential(0);
    notes.push((sym) => makeDiagnostic('not-converged', sym.nameRange, {
      name: sym.name, reached, target, budget: options.timeBudgetMs,
    }, { figures: { reached: reachedFigure, target: result.target } }));
  }
  return { result, spectrum, notes };
}

/**
 * A Volterra-type kernel (triangular support, see triangular.ts) that is bounded, or singular only on the diagonal
 * and weakly so (|K| ≤ C|t − s|^(−α), α < 1), is quasinilpotent: the Galerkin eigenvalues are spurious, so none is
 * reported, and the accuracy reached is that of the norm alone. (Bounded: ‖Tⁿ‖ ≤ Mⁿ(b − a)ⁿ/n!; weakly singular:
 * R. Kress, Linear Integral Equations, 1989, ch. 3 and 9 on Volterra and Abel equations, from memory.) A singularity
 * off the diagonal voids the argument: `t > s ? 1/t : 0` is the Hardy averaging operator, whose spectrum is a disk.
 * Null for every other kernel.
 */
function quasinilpotentSpectrum(ir: IrFunction, domain: readonly [number, number], result: SpectralResult, spectrum: SpectrumReport) {
  if (result.hermitian || result.loci.unknown.length > 0) return null;
  const onDiagonal = (l: { line: { ct: number; cs: number; c0: number } }) => l.line.ct !== 0 && l.line.ct + l.line.cs === 0 && l.line.c0 === 0;
  const singular = result.loci.loci.filter((l) => l.kind === 'singular');
  if (!singular.every(onDiagonal) || singular.length !== result.singularities.length) return null;
  if (!result.singularities.every((s) => !s.point && s.integrable && (s.type !== 'power' || s.exponent + (s.exponentError ?? 0) < 1))) return null;
  const support = detectTriangularSupport(ir, domain, () => compileKernel(ir));
  if (!support) return null;
  const norm = spectrum.norm;
  const reached = norm && norm.value > 0 ? norm.error / norm.value : norm ? 0 : Infinity;
  const reason = `${describeTriangular(support.side)} (a Volterra operator, checked at ${support.checkedPoints} points)${singular.length > 0 ? ', weakly singular on the diagonal only' : ' with a bounded kernel'}, so T is quasinilpotent: σ(T) = {0}, no nonzero eigenvalue, spectral radius 0`;
  const next: SpectrumReport = {
    ...spectrum, eigenvalues: [], eigenfunctions: null, converged: reached <= result.target,
    quasinilpotent: { side: support.side, reason },
  };
  return { spectrum: next, reached };
}

/**
 * A non-Hermitian kernel that vanishes at every grid point of one triangle although its expression does not show
 * it (`floor(t - s + 1) * cos(t - s)`): its Galerkin eigenvalues may be the wandering ones of a Volterra operator,
 * whose true spectrum is {0}, so no eigenvalue is taken as converged: each error is at least its modulus (it covers
 * 0 as well as the value) and the accuracy note says how far the figures are from settled.
 */
function unprovenTriangular(ir: IrFunction, domain: readonly [number, number], result: SpectralResult, spectrum: SpectrumReport) {
  if (result.hermitian || spectrum.eigenvalues.length === 0) return null;
  if (!triangularOnGrid(compileKernel(ir), domain)) return null;
  const eigenvalues = spectrum.eigenvalues.map((e) => ({ ...e, error: Math.max(e.error, Math.hypot(e.re, e.im)) }));
  const normValue = spectrum.norm?.value ?? 0;
  const reached = normValue > 0 ? Math.max(...eigenvalues.map((e) => e.error)) / normValue : Infinity;
  return { spectrum: { ...spectrum, eigenvalues, converged: false }, reached };
}

export function analyzeKernelNumerics(k: KernelSymbol, options: AnalysisOptions, token?: CancellationToken): KernelNumerics | null {
  if (!k.ir || !k.domain || !k.hash) return null;
  const key = `${k.hash}|${optionsKey(options)}`;
  let entry = cache.get(key);
  if (!entry) {
    const computed = compute(k, options, token);
    entry = { ...computed, bytes: entryBytes(computed.result) };
    cache.set(key, entry);
    cacheBytes += entry.bytes;
    evictOldest();
  } else {
    cache.delete(key);
    cache.set(key, entry); // most recently used last
  }
  return { result: entry.result, spectrum: entry.spectrum, diagnostics: entry.notes.map((n) => n(k)) };
}
