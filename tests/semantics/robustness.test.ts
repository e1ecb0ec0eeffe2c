/**
 * Binding never throws, whatever the file: random files built from a few names that refer to each other in every
 * way (before their declaration, in cycles, through broken constants, from domains and claims, with the wrong
 * number of arguments) bind to a model whose every lowered kernel evaluates. The fixed cases at the end are files
 * that once made binding throw.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyzeText } from '../../src-core/analysis/analyze';
import { entryByCode } from '../../src-core/diagnostics/catalogue';
import { interpret } from '../../src-core/semantics/evaluator';

const names = ['a', 'b', 'c', 'f', 'g', 'k1', 'k2', 'constructor'];
const numbers = ['0', '1', '2.5', '-3', '1 / 0', '0 / 0', 'i', 'pi'];

/** A random expression over the names, the given parameters, numbers and a few built-ins. */
function exprArb(params: readonly string[]): fc.Arbitrary<string> {
  const atom = fc.oneof(fc.constantFrom(...names), fc.constantFrom(...numbers), ...(params.length ? [fc.constantFrom(...params)] : []));
  const { e } = fc.letrec<{ e: string }>((tie) => ({
    e: fc.oneof(
      { depthSize: 'small', withCrossShrink: true },
      atom,
      fc.tuple(tie('e'), fc.constantFrom('+', '-', '*', '/', '^', '<'), tie('e')).map(([x, op, y]) => `${x} ${op} ${y}`),
      fc.tuple(fc.constantFrom(...names, 'exp', 'min', 'sqrt'), fc.array(tie('e'), { maxLength: 3 })).map(([fn, args]) => `${fn}(${args.join(', ')})`),
      tie('e').map((x) => `(${x})`),
    ),
  }));
  return e;
}

const intervalArb = fc.tuple(exprArb([]), exprArb([])).map(([x, y]) => `[${x}, ${y}]`);

const declarationArb: fc.Arbitrary<string> = fc.oneof(
  fc.tuple(fc.constantFrom(...names), exprArb([])).map(([n, e]) => `const ${n} = ${e}`),
  fc.tuple(fc.constantFrom(...names), fc.constantFrom(['x'], ['x', 'y'], ['x', 'x'], ['a'])).chain(([n, ps]) =>
    exprArb(ps).map((e) => `fn ${n}(${ps.join(', ')}) = ${e}`)),
  fc.tuple(fc.constantFrom(...names), fc.option(intervalArb), exprArb(['t', 's']), fc.option(exprArb([]))).map(
    ([n, on, e, claim]) => `kernel ${n}(t, s)${on ? ` on ${on}` : ''} = ${e}${claim ? `\n  expect hermitian, norm <= ${claim}, rank = ${claim}` : ''}`),
  intervalArb.map((iv) => `domain ${iv}`),
);

const fileArb = fc.array(declarationArb, { minLength: 1, maxLength: 10 }).map((ds) => `${ds.join('\n')}\n`);

function checkFile(text: string): void {
  const r = analyzeText(text, { numerics: false });
  for (const d of r.diagnostics) expect(entryByCode(d.code), d.code).toBeDefined();
  for (const sym of r.model.symbols.values()) {
    if (sym.kind === 'const' && sym.value) expect(Number.isFinite(sym.value.re) && Number.isFinite(sym.value.im)).toBe(true);
  }
  for (const k of r.model.kernels) {
    expect(k.hash !== null).toBe(k.ir !== null && k.domain !== null);
    if (k.domain) expect(k.domain.a).toBeLessThan(k.domain.b);
    if (k.ir) interpret(k.ir, [0.25, 0.75]);
  }
}

describe('binding', () => {
  it('never throws on random files of names that refer to each other', () => {
    fc.assert(fc.property(fileArb, (text) => checkFile(text)), { numRuns: 400, seed: 20261201 });
  });

  const once: [what: string, text: string][] = [
    ['a constant using one declared later that is not finite', 'const b = inf + 1\nconst inf = 1 / 0\nkernel k(t, s) on [0, 1] = b\n'],
    ['a constant calling a helper that uses a constant declared later', 'fn f(x) = x + c\nconst d = f(1)\nconst c = 2\nkernel k(t, s) on [0, 1] = d\n'],
    ['a domain end using a constant in a cycle', 'const c = c\ndomain [0, c]\nkernel k(t, s) = t\n'],
    ['a claim using a constant that is not finite', 'const c = 1 / 0\nkernel k(t, s) on [0, 1] = t\n  expect norm <= c\n'],
    ['a domain end calling a helper with an unknown name', 'fn f(x) = x + nope\nkernel k(t, s) on [0, f(1)] = t\n'],
    ['a domain end calling a kernel in a cycle', 'kernel k(t, s) on [0, k(1, 1)] = k(s, t)\n'],
    ['a constant calling a kernel that calls it back', 'const c = k(1, 2)\nkernel k(t, s) on [0, 1] = c * t\n'],
  ];
  for (const [what, text] of once) {
    it(`binds ${what}`, () => checkFile(text));
  }
});
