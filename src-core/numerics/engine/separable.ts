/**
 * Recognises separable (degenerate) kernels K(t, s) = Σ_j f_j(t) g_j(s) from the expression: sums and products
 * distribute, small whole powers expand, exp of a sum of one-variable parts factors, and cos, sin, cosh, sinh of
 * such sums follow the addition theorems. Anything else that mixes t and s (abs(t − s), min(t, s), exp(t·s), …) is
 * not separable. At most `maxTerms` terms.
 */
import type { IrNode } from '../../semantics/ir';
import type { TextRange } from '../../syntax/textRange';
import { collectBindings, dependenceOf } from '../../semantics/irTools';

export interface SeparableTerm {
  readonly coefRe: number;
  readonly coefIm: number;
  /** Factors depending on t only (slot 0), or on nothing. */
  readonly t: readonly IrNode[];
  /** Factors depending on s only (slot 1). */
  readonly s: readonly IrNode[];
}

export const maxTerms = 16;

class NotSeparable extends Error {}

export function expandSeparable(root: IrNode): SeparableTerm[] | null {
  const bindings = collectBindings(root);
  const dep = dependenceOf(bindings);
  const range: TextRange = root.range;
  const c = (re: number, im = 0): IrNode => ({ op: 'const', re, im, range });
  const mul = (a: IrNode, b: IrNode): IrNode => ({ op: 'mul', a, b, range });
  const add = (a: IrNode, b: IrNode): IrNode => ({ op: 'add', a, b, range });
  const call = (fn: 'exp' | 'cos' | 'sin' | 'cosh' | 'sinh' | 'conj', a: IrNode): IrNode => ({ op: 'call', fn, args: [a], range });

  const single = (n: IrNode): SeparableTerm[] => {
    if (n.op === 'const') return [{ coefRe: n.re, coefIm: n.im, t: [], s: [] }];
    const m = dep(n);
    return [m & 2 ? { coefRe: 1, coefIm: 0, t: [], s: [n] } : { coefRe: 1, coefIm: 0, t: [n], s: [] }];
  };
  const product = (x: SeparableTerm[], y: SeparableTerm[]): SeparableTerm[] => {
    if (x.length * y.length > maxTerms) throw new NotSeparable();
    const out: SeparableTerm[] = [];
    for (const p of x) for (const q of y) {
      out.push({
        coefRe: p.coefRe * q.coefRe - p.coefIm * q.coefIm,
        coefIm: p.coefRe * q.coefIm + p.coefIm * q.coefRe,
        t: [...p.t, ...q.t], s: [...p.s, ...q.s],
      });
    }
    return out;
  };
  const scale = (x: SeparableTerm[], re: number, im: number) => x.map((p) => ({
    ...p, coefRe: p.coefRe * re - p.coefIm * im, coefIm: p.coefRe * im + p.coefIm * re,
  }));
  const termNode = (p: SeparableTerm): IrNode => [...p.t, ...p.s].reduce((acc, f) => mul(acc, f), c(p.coefRe, p.coefIm));
  /** Splits a sum of terms into its t-only part u and its s-only part v (u + v), or fails. */
  const split = (x: SeparableTerm[]): [IrNode, IrNode] => {
    let u: IrNode = c(0);
    let v: IrNode = c(0);
    for (const p of x) {
      if (p.s.length === 0) u = add(u, termNode(p));
      else if (p.t.length === 0) v = add(v, termNode(p));
      else throw new NotSeparable();
    }
    return [u, v];
  };
  const pairTerm = (ft: IrNode, gs: IrNode, sign = 1): SeparableTerm => ({ coefRe: sign, coefIm: 0, t: [ft], s: [gs] });

  const expand = (n: IrNode, depth: number): SeparableTerm[] => {
    if (depth > 200) throw new NotSeparable();
    if (dep(n) !== 3) return single(n);
    switch (n.op) {
      case 'add': return [...expand(n.a, depth + 1), ...expand(n.b, depth + 1)].slice(0, maxTerms + 1);
      case 'sub': return [...expand(n.a, depth + 1), ...scale(expand(n.b, depth + 1), -1, 0)];
      case 'neg': return scale(expand(n.a, depth + 1), -1, 0);
      case 'mul': return product(expand(n.a, depth + 1), expand(n.b, depth + 1));
      case 'div': {
        const m = dep(n.b);
        if (m === 3) throw new NotSeparable();
        const inv: IrNode = { op: 'div', a: c(1), b: n.b, range };
        return product(expand(n.a, depth + 1), single(inv));
      }
      case 'pow': {
        if (n.b.op !== 'const' || n.b.im !== 0 || !Number.isInteger(n.b.re) || n.b.re < 1 || n.b.re > 6) throw new NotSeparable();
        const base = expand(n.a, depth + 1);
        let acc = base;
        for (let k = 1; k < n.b.re; k++) acc = product(acc, base);
        return acc;
      }
      case 'let': return expand(n.body, depth + 1);
      case 'var': {
        const b = bindings.get(n.slot);
        if (!b) throw new NotSeparable();
        return expand(b, depth + 1);
      }
      case 'call': {
        const arg = n.args[0];
        switch (n.fn) {
          case 'conj':
            return expand(arg, depth + 1).map((p) => ({
              coefRe: p.coefRe, coefIm: -p.coefIm, t: p.t.map((f) => call('conj', f)), s: p.s.map((f) => call('conj', f)),
            }));
          case 'exp': {
            const [u, v] = split(expand(arg, depth + 1));
            return [{ coefRe: 1, coefIm: 0, t: [call('exp', u)], s: [call('exp', v)] }];
          }
          case 'cos': {
            const [u, v] = split(expand(arg, depth + 1));
            return [pairTerm(call('cos', u), call('cos', v)), pairTerm(call('sin', u), call('sin', v), -1)];
          }
          case 'sin': {
            const [u, v] = split(expand(arg, depth + 1));
            return [pairTerm(call('sin', u), call('cos', v)), pairTerm(call('cos', u), call('sin', v))];
          }
          case 'cosh': {
            const [u, v] = split(expand(arg, depth + 1));
            return [pairTerm(call('cosh', u), call('cosh', v)), pairTerm(call('sinh', u), call('sinh', v))];
          }
          case 'sinh': {
            const [u, v] = split(expand(arg, depth + 1));
            return [pairTerm(call('sinh', u), call('cosh', v)), pairTerm(call('cosh', u), call('sinh', v))];
          }
          default: throw new NotSeparable();
        }
      }
      default: throw new NotSeparable();
    }
  };
  try {
    const terms = expand(root, 0);
    if (terms.length > maxTerms) return null;
    return terms;
  } catch (err) {
    if (err instanceof NotSeparable) return null;
    throw err;
  }
}

/** f_j(t) (including the coefficient) and g_j(s) of a term, as IR trees over slots 0 (t) and 1 (s). */
export function termFactors(p: SeparableTerm, range: TextRange): { f: IrNode; g: IrNode } {
  const c = (re: number, im = 0): IrNode => ({ op: 'const', re, im, range });
  const f = p.t.reduce<IrNode>((acc, x) => ({ op: 'mul', a: acc, b: x, range }), c(p.coefRe, p.coefIm));
  const g = p.s.reduce<IrNode>((acc, x) => ({ op: 'mul', a: acc, b: x, range }), c(1));
  return { f, g };
}
