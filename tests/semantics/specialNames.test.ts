/**
 * Names that mean something to JavaScript objects (`constructor`, `__proto__`, `toString`, ...) are ordinary names in
 * a kernel file: declared, they work in every role; undeclared, they are unknown. A lookup table built on a plain
 * object would find them on its prototype; the symbol table is a Map, and these cases would notice if it were not.
 */
import { describe, expect, it } from 'vitest';
import { analyzeText } from '../../src-core/analysis/analyze';
import { interpret } from '../../src-core/semantics/evaluator';

const specialNames = [
  'constructor', '__proto__', 'toString', 'hasOwnProperty', 'valueOf', 'isPrototypeOf', 'propertyIsEnumerable',
  'toLocaleString', '__defineGetter__', '__lookupSetter__', 'prototype', 'length', 'name', 'caller',
];

const codes = (text: string) => analyzeText(text, { numerics: false }).diagnostics.map((d) => d.code);

/** K(0.25, 0.5) of kernel k, or null when it has no IR. */
function valueOfK(text: string): number | null {
  const k = analyzeText(text, { numerics: false }).model.kernels.find((x) => x.name === 'k');
  if (!k?.ir) return null;
  const r = interpret(k.ir, [0.25, 0.5]);
  return r.ok ? r.re : null;
}

describe.each(specialNames)('the name %s', (n) => {
  it('is unknown as a value until declared', () => {
    expect(codes(`domain [0, 1]\nkernel k(t, s) = ${n} * t\n`)).toEqual(['KW201']);
  });

  it('is unknown as a function until declared', () => {
    expect(codes(`domain [0, 1]\nkernel k(t, s) = ${n}(t)\n`)).toEqual(['KW202']);
  });

  it('is an unknown claim', () => {
    expect(codes(`domain [0, 1]\nkernel k(t, s) = t\n  expect ${n}\n`)).toEqual(['KW213']);
  });

  it('works as a constant, also in the domain and a claim', () => {
    const text = `const ${n} = 3\ndomain [0, ${n}]\nkernel k(t, s) = ${n} * t + s\n  expect norm <= ${n} * 10\n`;
    expect(codes(text)).toEqual([]);
    expect(valueOfK(text)).toBe(3 * 0.25 + 0.5);
    const model = analyzeText(text, { numerics: false }).model;
    expect(model.symbols).toBeInstanceOf(Map);
    expect(model.symbols.get(n)).toMatchObject({ kind: 'const', value: { re: 3, im: 0 } });
    expect(model.defaultDomain).toMatchObject({ a: 0, b: 3 });
  });

  it('works as a helper', () => {
    const text = `domain [0, 1]\nfn ${n}(x, y) = x - 2 * y\nkernel k(t, s) = ${n}(t, s)\n`;
    expect(codes(text)).toEqual([]);
    expect(valueOfK(text)).toBe(0.25 - 1);
  });

  it('works as a kernel called by another', () => {
    const text = `domain [0, 1]\nkernel ${n}(t, s) = t * s\nkernel k(t, s) = ${n}(s, t) + 1\n`;
    expect(codes(text)).toEqual([]);
    expect(valueOfK(text)).toBe(0.125 + 1);
  });

  it('works as a parameter', () => {
    const text = `domain [0, 1]\nfn g(${n}) = ${n} * 4\nkernel k(t, s) = g(t)\n`;
    expect(codes(text)).toEqual([]);
    expect(valueOfK(text)).toBe(1);
  });

  it('is a duplicate when declared twice, and unused when never used', () => {
    expect(codes(`domain [0, 1]\nconst ${n} = 1\nfn ${n}(x) = x\nkernel k(t, s) = t\n`)).toEqual(['KW211', 'KW204']);
  });

  it('is suggested for a misspelling', () => {
    const typo = `${n}X`;
    const d = analyzeText(`domain [0, 1]\nconst ${n} = 2\nkernel k(t, s) = ${typo} * t + ${n}\n`, { numerics: false }).diagnostics;
    expect(d.map((x) => x.message)).toEqual([`Unknown name “${typo}”. Did you mean “${n}”?`]);
  });
});

it('the symbol table holds only what the file declares', () => {
  const model = analyzeText('domain [0, 1]\nconst a = 1\nkernel k(t, s) = a * t\n', { numerics: false }).model;
  expect(model.symbols).toBeInstanceOf(Map);
  expect([...model.symbols.keys()]).toEqual(['a', 'k']);
  for (const n of specialNames) expect(model.symbols.has(n), n).toBe(false);
});
