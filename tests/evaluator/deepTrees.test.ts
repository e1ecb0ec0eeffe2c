/**
 * Very deep trees compile and evaluate without exhausting the stack: code generation, analysis and the
 * interpreter are iterative, and conditionals nested deeper than the generator's block limit pick between eagerly
 * evaluated branches (same values). Expected values come from running the same double operations in a plain loop.
 */
// Citations of books and papers in this file (authors, years, sections) are given from memory.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { IrFunction, IrNode } from '../../src-core/semantics/ir';
import { compileKernel, interpret } from '../../src-core/semantics/evaluator';
import { entryDisagreement, runEntries } from './checkEntries';
import { IrMaker } from './irBuilder';
import { irArb } from './randomIr';

const ir = new IrMaker();

/** x ↦ −(x + s) applied `depth` times (alternating add and neg nodes, 2·depth levels). */
function negAddChain(depth: number, complex: boolean): IrFunction {
  let node = ir.v(0);
  for (let k = 0; k < depth; k++) node = ir.un('neg', ir.bin('add', node, ir.v(1)));
  return { root: node, arity: 2, slotCount: 2, complex };
}

function negAddExpected(depth: number, t: number, s: number): number {
  let x = t;
  for (let k = 0; k < depth; k++) x = -(x + s);
  return x;
}

/** let u1 = t + s in let u2 = u1 * 0.5 + s in ... (each let's body holds the next). */
function letChain(depth: number): IrFunction {
  const values: IrNode[] = [];
  for (let k = 0; k < depth; k++) {
    const previous = k === 0 ? ir.v(0) : ir.v(1 + k);
    values.push(ir.bin('add', ir.bin('mul', previous, ir.c(0.5)), ir.v(1)));
  }
  let node = ir.v(1 + depth);
  for (let k = depth - 1; k >= 0; k--) node = ir.let(2 + k, values[k], node);
  return { root: node, arity: 2, slotCount: 2 + depth, complex: false };
}

/** s < 0 ? (s < 1 ? (... t ...) + 1 : s) + 1 : s, nested `depth` times. */
function condChain(depth: number): IrFunction {
  let node = ir.v(0);
  for (let k = 0; k < depth; k++) node = ir.cond(ir.bin('lt', ir.v(1), ir.c(k)), ir.bin('add', node, ir.c(1)), ir.v(1));
  return { root: node, arity: 2, slotCount: 2, complex: false };
}

describe('deep trees', () => {
  const chains: [string, number, boolean][] = [
    ['neg/add chain, depth 2000, real', 1000, false],
    ['neg/add chain, depth 2000, complex', 1000, true],
    ['neg/add chain, depth 20000, real', 10000, false],
  ];
  for (const [name, depth, complex] of chains) {
    it(name, () => {
      const fn = negAddChain(depth, complex);
      const [t, s] = [0.75, 0.125];
      const expected = negAddExpected(depth, t, s);
      const v = runEntries(fn, [t, s]);
      expect(entryDisagreement(v)).toBe('');
      expect(v.point.re).toBe(expected);
      expect(v.point.im).toBe(0);
    });
  }

  it('let chain, depth 2000', () => {
    const fn = letChain(2000);
    let x = 0.3;
    for (let k = 0; k < 2000; k++) x = x * 0.5 + 0.2;
    const v = runEntries(fn, [0.3, 0.2]);
    expect(entryDisagreement(v)).toBe('');
    expect(v.point.re).toBe(x);
  });

  // [s, value at t = 0.5]. For s = -1 every test s < k holds: 2000 additions to t. For s = 1500.5 the tests for
  // k = 1501..1999 hold (499 additions) and the level k = 1500 returns s itself.
  const condCases: [number, number][] = [
    [-1, 2000.5],
    [1500.5, 1999.5],
  ];
  for (const [s, expected] of condCases) {
    it(`conditional chain, depth 2000, s = ${s}`, () => {
      const fn = condChain(2000);
      const v = runEntries(fn, [0.5, s]);
      expect(entryDisagreement(v)).toBe('');
      expect(v.point.re).toBe(expected);
    });
  }

  it('conditional chain with a NaN test deep inside gives NaN and names the NaN', () => {
    const fn = condChain(2000);
    const r = interpret(fn, [0.5, NaN]);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.fault.kind).toBe('non-finite');
    expect(compileKernel(fn).evaluate([0.5, NaN]).re).toBeNaN();
  });

  it('random trees under 60 nested conditionals (branches picked eagerly) agree with interpret bit for bit', () => {
    fc.assert(
      fc.property(irArb(true, 5), fc.double(), fc.double(), (inner, t, s) => {
        let root = inner.root;
        for (let k = 0; k < 60; k++) root = ir.cond(ir.bin('ge', ir.v(1), ir.c(-Infinity)), root, ir.c(k));
        return entryDisagreement(runEntries({ ...inner, root }, [t, s])) === '';
      }),
      { numRuns: 200, seed: 5 },
    );
  });
});
