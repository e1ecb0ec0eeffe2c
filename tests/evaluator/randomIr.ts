/**
 * Random IR functions for property tests: trees over every operator, every builtin, conditionals and `let`
 * bindings (a bound leaf refers to the innermost enclosing let), with small real constants, and complex ones on
 * the complex path. Each node gets its own synthetic range.
 */
import fc from 'fast-check';
import { builtinFunctions, type BuiltinFunctionName } from '../../src-core/semantics/builtins';
import type { IrBinaryOp, IrFunction, IrNode } from '../../src-core/semantics/ir';

type Leaf = 't' | 's' | 'bound' | { re: number; im: number };
export type TreeSpec =
  | { k: 'leaf'; v: Leaf }
  | { k: 'unary'; op: 'neg' | 'not'; a: TreeSpec }
  | { k: 'binary'; op: IrBinaryOp; a: TreeSpec; b: TreeSpec }
  | { k: 'call'; fn: BuiltinFunctionName; args: TreeSpec[] }
  | { k: 'cond'; test: TreeSpec; then: TreeSpec; otherwise: TreeSpec }
  | { k: 'let'; value: TreeSpec; body: TreeSpec };

export const binaryOps: readonly IrBinaryOp[] = ['add', 'sub', 'mul', 'div', 'pow', 'lt', 'le', 'gt', 'ge', 'eq', 'ne', 'and', 'or'];
export const builtinNames = Object.keys(builtinFunctions) as BuiltinFunctionName[];

const realConstants = [0, 1, 2, 3, -1, -2.5, 0.5, 0.1, 1e-3, 10, Math.PI];
const complexConstants: [number, number][] = [[0, 1], [1, -2], [-0.5, 0.25], [0, -3]];

function leafArb(complex: boolean): fc.Arbitrary<TreeSpec> {
  const constant = complex
    ? fc.oneof(fc.constantFrom(...realConstants).map((re) => ({ re, im: 0 })), fc.constantFrom(...complexConstants).map(([re, im]) => ({ re, im })))
    : fc.constantFrom(...realConstants).map((re) => ({ re, im: 0 }));
  return fc.oneof(
    { weight: 3, arbitrary: fc.constantFrom<Leaf>('t', 's') },
    { weight: 1, arbitrary: fc.constant<Leaf>('bound') },
    { weight: 2, arbitrary: constant },
  ).map((v) => ({ k: 'leaf', v }) as TreeSpec);
}

export function treeArb(complex: boolean, maxDepth: number): fc.Arbitrary<TreeSpec> {
  const { node } = fc.letrec<{ node: TreeSpec }>((tie) => {
    const sub = tie('node');
    const callArb = fc.constantFrom(...builtinNames).chain((fn) => {
      const count = fn === 'min' || fn === 'max' ? fc.integer({ min: 2, max: 3 }) : fc.constant(1);
      return count.chain((n) => fc.array(sub, { minLength: n, maxLength: n }).map((args) => ({ k: 'call', fn, args }) as TreeSpec));
    });
    return {
      node: fc.oneof(
        { maxDepth, depthIdentifier: 'tree' },
        { weight: 2, arbitrary: leafArb(complex) },
        { weight: 1, arbitrary: fc.record({ op: fc.constantFrom<'neg' | 'not'>('neg', 'not'), a: sub }).map((r) => ({ k: 'unary', ...r }) as TreeSpec) },
        { weight: 4, arbitrary: fc.record({ op: fc.constantFrom(...binaryOps), a: sub, b: sub }).map((r) => ({ k: 'binary', ...r }) as TreeSpec) },
        { weight: 4, arbitrary: callArb },
        { weight: 1, arbitrary: fc.record({ test: sub, then: sub, otherwise: sub }).map((r) => ({ k: 'cond', ...r }) as TreeSpec) },
        { weight: 1, arbitrary: fc.record({ value: sub, body: sub }).map((r) => ({ k: 'let', ...r }) as TreeSpec) },
      ),
    };
  });
  return node;
}

/** Lowers a spec to an IR function of (t, s), numbering let slots from 2. */
export function specToIr(spec: TreeSpec, complex: boolean): IrFunction {
  let offset = 0;
  let slotCount = 2;
  const range = () => {
    const start = offset++;
    return { start, end: start + 1 };
  };
  const go = (n: TreeSpec, bound: number): IrNode => {
    switch (n.k) {
      case 'leaf': {
        const v = n.v;
        if (v === 't') return { op: 'var', slot: 0, range: range() };
        if (v === 's') return { op: 'var', slot: 1, range: range() };
        if (v === 'bound') return { op: 'var', slot: bound, range: range() };
        return { op: 'const', re: v.re, im: v.im, range: range() };
      }
      case 'unary':
        return { op: n.op, a: go(n.a, bound), range: range() };
      case 'binary':
        return { op: n.op, a: go(n.a, bound), b: go(n.b, bound), range: range() };
      case 'call':
        return { op: 'call', fn: n.fn, args: n.args.map((a) => go(a, bound)), range: range() };
      case 'cond':
        return { op: 'cond', test: go(n.test, bound), then: go(n.then, bound), otherwise: go(n.otherwise, bound), range: range() };
      case 'let': {
        const slot = slotCount++;
        const value = go(n.value, bound);
        return { op: 'let', slot, value, body: go(n.body, slot), range: range() };
      }
    }
  };
  const root = go(spec, 0);
  return { root, arity: 2, slotCount, complex };
}

export function irArb(complex: boolean, maxDepth: number): fc.Arbitrary<IrFunction> {
  return treeArb(complex, maxDepth).map((spec) => specToIr(spec, complex));
}

/** Points: mostly random in [-3, 3], sometimes the special values that hit zeros, cuts and poles exactly. */
export const coordinateArb: fc.Arbitrary<number> = fc.oneof(
  { weight: 3, arbitrary: fc.double({ min: -3, max: 3, noNaN: true }) },
  { weight: 1, arbitrary: fc.constantFrom(0, 1, -1, 2, 0.5, -0.5) },
);
