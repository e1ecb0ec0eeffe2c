/**
 * Kernels near the ends of the double range (1e250·K, 1e-300·K, 1e-320·t·s): the engine analyses 2^−e·K, whose
 * values are of order 1, and scales every figure back by 2^e. Multiplying by a power of two is exact for normal
 * numbers (IEEE 754 binary64: only the exponent changes; common practice), so the scaled analysis performs the same
 * rounding as an unscaled one in the middle of the range, without squares that overflow (1e250² in ∫∫|K|²) or
 * underflow (1e-250²).
 *
 * Two ways to scale, the exact one first:
 *  - before evaluation: when the expression is c·f(t, s) (a constant factor in its top-level product or quotient),
 *    c is replaced by c·2^−e, which is exact unless it under- or overflows; then f is evaluated in the normal range
 *    and even a subnormal kernel (1e-320·t·s, whose values carry a few bits only) is analysed to full precision;
 *  - after evaluation: every value is multiplied by 2^−e. Values that were subnormal (below 2^−1022) have already
 *    lost their low bits: each carries an absolute error of about 2^−1074 per rounding, which `absoluteFloor`
 *    turns into a floor under every error estimate (‖δT‖ ≤ ‖δK‖_HS ≤ sup|δK|·(b − a)).
 */
import type { IrFunction, IrNode } from '../../semantics/ir';
import { compileKernel, type CompiledKernel } from '../../semantics/evaluator';
import { gaussLegendre, mapRule } from '../quadrature';
import type { Estimate, SpectrumReport } from '../../analysis/types';
import { scaledFigures, type LevelSolution } from './solveLevel';
import type { SpectralResult } from './spectralEngine';

export interface KernelScaling {
  /** The kernel the engine analyses: 2^−exponent · K. */
  readonly kernel: CompiledKernel;
  readonly exponent: number;
  /** True when the scale was applied to a constant factor before evaluation (no precision lost). */
  readonly beforeEvaluation: boolean;
  /** Estimated absolute error of a value of the scaled kernel from subnormal evaluation (0 when none). */
  readonly valueError: number;
}

/** Values within 2^±64 of 1 are left alone (the figures stay bit for bit those of an unscaled analysis). */
const threshold = 64;
/** Roundings of a subnormal value that the floor allows for (one per arithmetic operation on the way). */
const subnormalRoundings = 16;
const minNormal = 2 ** -1022;
const subnormalUlp = 2 ** -1074;

/** x · 2^k in two steps, so that neither factor overflows or underflows on its own. */
export function timesPow2(x: number, k: number): number {
  const half = Math.trunc(k / 2);
  return x * 2 ** half * 2 ** (k - half);
}

/** Largest finite |K| on a 24 × 24 Gauss grid; 0 when there is none. */
export function sampledMaxAbs(kernel: CompiledKernel, a: number, b: number, n = 24): number {
  const r = mapRule(gaussLegendre(n), a, b);
  const re = new Float64Array(n * n);
  const im = kernel.complex ? new Float64Array(n * n) : null;
  kernel.evaluateGrid(r.nodes, r.nodes, re, im);
  let m = 0;
  for (let k = 0; k < re.length; k++) {
    const x = Math.max(Math.abs(re[k]), im ? Math.abs(im[k]) : 0);
    if (Number.isFinite(x) && x > m) m = x;
  }
  return m;
}

/** The constant factor of the top-level product or quotient, as a path of operands, or null. */
function scaleConstant(node: IrNode, k: number): IrNode | null {
  switch (node.op) {
    case 'const': {
      if (node.im !== 0) {
        const re = timesPow2(node.re, k);
        const im = timesPow2(node.im, k);
        if (timesPow2(re, -k) !== node.re || timesPow2(im, -k) !== node.im || !(Math.abs(re) >= minNormal || re === 0)) return null;
        return { ...node, re, im };
      }
      const re = timesPow2(node.re, k);
      if (!Number.isFinite(re) || Math.abs(re) < minNormal || timesPow2(re, -k) !== node.re) return null;
      return { ...node, re };
    }
    case 'neg': {
      const a = scaleConstant(node.a, k);
      return a ? { ...node, a } : null;
    }
    case 'mul': {
      const a = scaleConstant(node.a, k);
      if (a) return { ...node, a };
      const b = scaleConstant(node.b, k);
      return b ? { ...node, b } : null;
    }
    case 'div': {
      const a = scaleConstant(node.a, k);
      if (a) return { ...node, a };
      const b = scaleConstant(node.b, -k);
      return b ? { ...node, b } : null;
    }
    case 'let': {
      const body = scaleConstant(node.body, k);
      return body ? { ...node, body } : null;
    }
    default:
      return null;
  }
}

/** The IR of 2^−k·K when K has a constant factor that takes the scale exactly, else null. */
export function prescaledIr(ir: IrFunction, k: number): IrFunction | null {
  const root = scaleConstant(ir.root, -k);
  return root ? { ...ir, root } : null;
}

function afterEvaluation(kernel: CompiledKernel, k: number): CompiledKernel {
  const scale = (re: Float64Array, im: Float64Array | null) => {
    for (let i = 0; i < re.length; i++) re[i] = timesPow2(re[i], -k);
    if (im) for (let i = 0; i < im.length; i++) im[i] = timesPow2(im[i], -k);
  };
  return {
    arity: kernel.arity,
    complex: kernel.complex,
    evaluate(args) {
      const v = kernel.evaluate(args);
      return { re: timesPow2(v.re, -k), im: timesPow2(v.im, -k) };
    },
    evaluateColumns(columns, outRe, outIm) {
      kernel.evaluateColumns(columns, outRe, outIm);
      scale(outRe, kernel.complex ? outIm : null);
    },
    evaluateGrid(ts, ss, outRe, outIm) {
      kernel.evaluateGrid(ts, ss, outRe, outIm);
      scale(outRe, kernel.complex ? outIm : null);
    },
  };
}

/**
 * The kernel to analyse and the power of two its figures are multiplied by. `maxAbs` is the largest finite |K|
 * sampled on the square.
 */
export function scaleKernel(ir: IrFunction, kernel: CompiledKernel, a: number, b: number): KernelScaling {
  const maxAbs = sampledMaxAbs(kernel, a, b);
  const unscaled: KernelScaling = { kernel, exponent: 0, beforeEvaluation: false, valueError: subnormalError(maxAbs, 0) };
  if (!(maxAbs > 0) || !Number.isFinite(maxAbs)) return unscaled;
  const exponent = Math.round(Math.log2(maxAbs));
  if (Math.abs(exponent) <= threshold) return unscaled;
  const pre = prescaledIr(ir, exponent);
  if (pre) {
    const compiled = compileKernel(pre);
    const check = sampledMaxAbs(compiled, a, b);
    // The scaled expression must give the scaled values (a constant inside a sum would not).
    if (Number.isFinite(check) && check > 0 && Math.abs(Math.log2(check)) <= 2) {
      return { kernel: compiled, exponent, beforeEvaluation: true, valueError: subnormalError(check, 0) };
    }
  }
  return { kernel: afterEvaluation(kernel, exponent), exponent, beforeEvaluation: false, valueError: subnormalError(maxAbs, exponent) };
}

/**
 * Absolute error of a scaled kernel value from subnormal rounding during evaluation: a kernel whose values come
 * within 2^52 of the subnormal range may have passed through it on the way (a product of small factors), each
 * rounding there costing up to 2^−1075 in absolute terms (an ulp of the subnormals is 2^−1074).
 */
function subnormalError(maxAbs: number, exponent: number): number {
  if (!(maxAbs > 0) || maxAbs >= minNormal * 2 ** 52) return 0;
  return timesPow2(subnormalRoundings * subnormalUlp, -exponent);
}

/** The floor the subnormal evaluation error puts under eigenvalue, norm and trace errors on [a, b]. */
export function absoluteFloor(s: KernelScaling, a: number, b: number): number {
  return s.valueError * (b - a);
}

/**
 * An error scaled back by 2^k, plus the rounding of the scaled-back value: a figure that lands among the subnormal
 * numbers is rounded to a multiple of 2^−1074 (adding 2^−1074 to a larger error changes nothing).
 */
export function errorTimesPow2(error: number, k: number): number {
  return timesPow2(error, k) + subnormalUlp;
}

/** A level of the scaled kernel as the level of K: matrix, eigenvalues and norms times 2^k (vectors unchanged). */
export function scaleLevelBack(level: LevelSolution, k: number): LevelSolution {
  const m = level.matrix;
  const up = (x: number) => timesPow2(x, k);
  return {
    ...level,
    matrix: { ...m, re: m.re.map(up), im: m.im ? m.im.map(up) : null, hsSquared: timesPow2(m.hsSquared, 2 * k) },
    ...scaledFigures(level, up),
  };
}

/** Every figure of an analysis of 2^−k·K as a figure of K (relative ones, defect and accuracy, do not change). */
export function scaleResultBack(r: SpectralResult, k: number): SpectralResult {
  if (k === 0) return r;
  const up = (x: number) => timesPow2(x, k);
  const err = (x: number) => errorTimesPow2(x, k);
  const est = (e: Estimate | null) => (e ? { ...e, value: up(e.value), error: err(e.error) } : null);
  const s = r.spectrum;
  const spectrum: SpectrumReport | null = s && {
    ...s,
    eigenvalues: s.eigenvalues.map((e) => ({ re: up(e.re), im: up(e.im), error: err(e.error) })),
    norm: s.norm && {
      value: up(s.norm.value), error: err(s.norm.error),
      lower: Math.max(0, up(s.norm.lower) - subnormalUlp), upper: up(s.norm.upper) + subnormalUlp,
    },
    hsNorm: est(s.hsNorm),
    trace: est(s.trace),
  };
  return { ...r, spectrum, finest: r.finest && scaleLevelBack(r.finest, k) };
}
