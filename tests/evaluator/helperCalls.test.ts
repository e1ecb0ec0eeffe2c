/**
 * Kernels that call helper functions, written as source text and bound through the real front end (parse →
 * bindFile). Lowering turns each call into `let` bindings; the symbolic analyses then cut sub-expressions out of
 * the tree and close them over their bindings (irTools.closeOver) before compiling them. A helper applied to one
 * variable only (`f(s)`) used to make closeOver wrap a slot that the cut-out part already bound, so the evaluator
 * saw one slot bound twice ("let slot 2 bound twice") and the whole analysis stopped with an internal error.
 *
 * 1. Regression shapes run through analyzeText with numerics on: no exception, figures for every kernel.
 * 2. A seeded property test over generated documents (nested helpers with 1–3 parameters, partial applications,
 *    shared sub-expressions, conditionals, constants, real and complex): compileKernel never throws, the compiled
 *    kernel agrees bit for bit with the interpreter (checkEntries.ts), agrees with mathjs `evaluate` of the same
 *    expression with the helpers inlined textually, and every sub-expression closed over its bindings compiles
 *    and agrees with the interpreter too.
 * 3. The same generated documents through analyzeText with numerics on: every one gets an answer, no exception.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyzeText } from '../../src-core/analysis/analyze';
import { bindFile } from '../../src-core/semantics/bind';
import { compileKernel, interpret } from '../../src-core/semantics/evaluator';
import type { IrFunction, IrNode } from '../../src-core/semantics/ir';
import { closeOver, collectBindings, irChildren, slotCountOf } from '../../src-core/semantics/irTools';
import { mayBeComplex } from '../../src-core/semantics/lower';
import { parse } from '../../src-core/syntax/parser';
import { entryDisagreement, runEntries } from './checkEntries';
import { closeValues, mathjsEvaluate } from './mathjsReference';

function kernelIr(text: string): IrFunction {
  const model = bindFile(parse(text));
  expect(model.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
  const k = model.kernels.find((x) => x.name === 'k');
  if (!k?.ir) throw new Error(`kernel k did not bind:\n${text}`);
  return k.ir;
}

/** Every sub-expression of the kernel, closed over its bindings the way the symbolic analyses do it. */
function closedParts(fn: IrFunction): IrFunction[] {
  const bindings = collectBindings(fn.root);
  const out: IrFunction[] = [];
  const stack: IrNode[] = [fn.root];
  while (stack.length > 0) {
    const n = stack.pop()!;
    stack.push(...irChildren(n));
    if (n.op === 'var' && n.slot >= 2 && !bindings.has(n.slot)) continue;
    const root = closeOver(n, bindings);
    const slots = slotCountOf(root);
    out.push({ root, arity: 2, slotCount: slots, complex: mayBeComplex(root, slots) });
  }
  return out;
}

const regressionShapes: Record<string, string> = {
  'the reported file: a helper on s only': 'fn f(x) = 2*x\nkernel k(t, s) = f(s)',
  'a helper on t only': 'fn f(x) = x^2 + 1\nkernel k(t, s) = f(t) * s',
  'a helper on both variables': 'fn f(x) = 3*x\nkernel k(t, s) = f(t) * f(s)',
  'a helper calling a helper with a constant argument': 'fn g(a, b) = a * b + 1\nfn f(x) = g(x, 2)\nkernel k(t, s) = f(s) + t',
  'the same helper twice with different arguments': 'fn f(x, y) = x - y\nkernel k(t, s) = f(t, 1) * f(s, 0.5)',
  'a helper inside a conditional branch': 'fn f(x) = exp(x)\nkernel k(t, s) = t < s ? f(s) : t',
  'helper results shared between branches': 'fn f(x) = x + 1\nfn g(y) = f(y) * f(y)\nkernel k(t, s) = t < s ? g(s) * t : g(t) * s',
  'a helper of a helper of one variable, complex': 'fn f(x) = i * x\nfn g(y) = f(y) + f(2)\nkernel k(t, s) = g(s) * conj(g(t))',
};

describe('helper calls: regression shapes', () => {
  for (const [name, body] of Object.entries(regressionShapes)) {
    it(name, () => {
      const text = `domain [0, 1]\n${body}\n`;
      const fn = kernelIr(text);
      expect(() => compileKernel(fn)).not.toThrow();
      for (const part of closedParts(fn)) {
        const d = entryDisagreement(runEntries(part, [0.3, 0.7]));
        expect(d).toBe('');
      }
      const analysis = analyzeText(text);
      const k = analysis.kernels.find((x) => x.name === 'k');
      expect(k?.spectrum).toBeDefined();
    });
  }
});

/** A generated document: helper declarations, the kernel body, and the same body with every helper inlined. */
interface Doc {
  readonly text: string;
  readonly inlined: string;
  readonly complex: boolean;
}

interface Helper {
  readonly name: string;
  readonly params: readonly string[];
  /** The body with parameters as `(p)` placeholders, for textual inlining. */
  readonly inline: (args: readonly string[]) => string;
  readonly body: string;
}

type Expr = { src: string; inl: string };

function exprArb(vars: readonly string[], helpers: readonly Helper[], complex: boolean, depth: number): fc.Arbitrary<Expr> {
  const leaves: fc.Arbitrary<Expr>[] = [
    fc.constantFrom('0.5', '2', '1.25', '3').map((c) => ({ src: c, inl: c })),
    fc.constantFrom('c1', 'c2').map((c) => ({ src: c, inl: c === 'c1' ? '(0.75)' : '(1.5)' })),
  ];
  if (vars.length > 0) leaves.push(fc.constantFrom(...vars).map((v) => ({ src: v, inl: v })));
  if (complex) leaves.push(fc.constant({ src: 'i', inl: 'i' }));
  const leaf = fc.oneof(...leaves);
  if (depth <= 0) return leaf;
  const sub = exprArb(vars, helpers, complex, depth - 1);
  // Comparison operands stay real: on the complex path helper parameters may carry an imaginary part.
  const real = exprArb(vars.filter((v) => v === 't' || v === 's' || !complex), [], false, 0);
  const options: fc.Arbitrary<Expr>[] = [
    leaf,
    fc.tuple(sub, fc.constantFrom('+', '-', '*'), sub).map(([a, op, b]) => ({ src: `(${a.src} ${op} ${b.src})`, inl: `(${a.inl} ${op} ${b.inl})` })),
    // A conditional whose test compares real operands (t, s, parameters on the real path, constants).
    fc.tuple(real, fc.constantFrom('<', '<=', '>', '>='), real, sub, sub).map(([a, op, b, x, y]) => ({
      src: `(${a.src} ${op} ${b.src} ? ${x.src} : ${y.src})`,
      inl: `(${a.inl} ${op} ${b.inl} ? ${x.inl} : ${y.inl})`,
    })),
    sub.map((a) => ({ src: `sin(${a.src})`, inl: `sin(${a.inl})` })),
  ];
  for (const h of helpers) {
    options.push(fc.array(sub, { minLength: h.params.length, maxLength: h.params.length }).map((args) => ({
      src: `${h.name}(${args.map((a) => a.src).join(', ')})`,
      inl: h.inline(args.map((a) => a.inl)),
    })));
  }
  return fc.oneof(...options);
}

function helperArb(name: string, earlier: readonly Helper[], complex: boolean): fc.Arbitrary<Helper> {
  return fc.integer({ min: 1, max: 3 }).chain((arity) => {
    const params = ['x', 'y', 'z'].slice(0, arity);
    return exprArb(params, earlier, complex, 2).map((body) => {
      // Inline by substituting each parameter in the inlined body (parameters are single letters x, y, z that no
      // other name in the inlined text contains).
      const inline = (args: readonly string[]) =>
        `(${body.inl.replace(/\b[xyz]\b/g, (p) => `(${args[params.indexOf(p)]})`)})`;
      return { name, params, inline, body: body.src };
    });
  });
}

function docArb(complex: boolean): fc.Arbitrary<Doc> {
  return fc.integer({ min: 1, max: 3 }).chain((count) => {
    let helpers: fc.Arbitrary<Helper[]> = fc.constant([]);
    for (let k = 0; k < count; k++) {
      helpers = helpers.chain((hs) => helperArb(`h${k}`, hs, complex).map((h) => [...hs, h]));
    }
    return helpers.chain((hs) =>
      exprArb(['t', 's'], hs, complex, 3).chain((body) =>
        // A shared sub-expression: one helper-call result used in two places of the kernel.
        exprArb(['t', 's'], hs, complex, 1).map((shared) => {
          const decls = hs.map((h) => `fn ${h.name}(${h.params.join(', ')}) = ${h.body}`);
          const text = ['domain [0, 1]', 'const c1 = 0.75', 'const c2 = 1.5', ...decls,
            `fn shared(t, s) = ${shared.src}`,
            `kernel k(t, s) = ${body.src} + shared(t, s) * shared(s, t)`].join('\n');
          const swap = shared.inl.replace(/\b[ts]\b/g, (v) => (v === 't' ? 'S_' : 'T_')).replace(/S_/g, 's').replace(/T_/g, 't');
          const inlined = `${body.inl} + (${shared.inl}) * (${swap})`;
          return { text, inlined, complex };
        })));
  });
}

const pointArb = fc.tuple(fc.double({ min: 0.05, max: 0.95, noNaN: true }), fc.double({ min: 0.05, max: 0.95, noNaN: true }));

for (const complex of [false, true]) {
  describe(`helper calls: generated documents, ${complex ? 'complex' : 'real'} path`, () => {
    it('compile, agree with the interpreter and with mathjs, and close over their bindings', () => {
      let compared = 0;
      let complexKernels = 0;
      fc.assert(fc.property(docArb(complex), pointArb, (doc, [t, s]) => {
        const fn = kernelIr(doc.text);
        const kernel = compileKernel(fn);
        const entries = runEntries(fn, [t, s]);
        expect(entryDisagreement(entries), doc.text).toBe('');
        const reference = mathjsEvaluate(doc.inlined,
          { t: { re: t, im: 0, realTyped: true }, s: { re: s, im: 0, realTyped: true } }, kernel.complex);
        const got = entries.point;
        if (kernel.complex) complexKernels++;
        if (Number.isFinite(reference.re) && Number.isFinite(reference.im)) {
          expect(closeValues(got, reference, kernel.complex, 1e-9, 1e-12), `${doc.text}\nmathjs: ${doc.inlined}`).toBe(true);
          compared++;
        }
        for (const part of closedParts(fn)) {
          const p = interpret(part, [t, s]);
          const c = compileKernel(part).evaluate([t, s]);
          expect(Object.is(p.re, c.re) || (Number.isNaN(p.re) && Number.isNaN(c.re)), doc.text).toBe(true);
        }
      }), { seed: complex ? 20261202 : 1202, numRuns: 150 });
      // The generator really reaches both paths, and mathjs is consulted on most documents.
      expect(compared).toBeGreaterThan(100);
      if (complex) expect(complexKernels).toBeGreaterThan(50);
      else expect(complexKernels).toBe(0);
    });
  });
}

describe('helper calls: generated documents through the whole analysis', () => {
  for (const complex of [false, true]) {
    it(`analyzeText answers every document without an exception (${complex ? 'complex' : 'real'})`, () => {
      fc.assert(fc.property(docArb(complex), (doc) => {
        const analysis = analyzeText(`${doc.text}\n`);
        expect(analysis.kernels.map((k) => k.name), doc.text).toEqual(['k']);
      }), { seed: complex ? 7 : 8, numRuns: 25 });
    });
  }
});
