/**
 * No text from a user can reach generated code. The IR has no place for names (variables are slot numbers,
 * builtins come from a closed list, constants are doubles), and the evaluator rejects anything else before making
 * code. The generated source is scanned token by token: every identifier must be one the generator writes itself.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compileFunction, compileKernel, interpret } from '../../src-core/semantics/evaluator';
import { generateSource } from '../../src-core/semantics/evaluator/codegen';
import type { IrFunction, IrNode } from '../../src-core/semantics/ir';
import { IrMaker, irFromText } from './irBuilder';
import { irArb } from './randomIr';

/** Written here, not imported: the names generated code may contain. */
const allowedWords = new Set([
  // JavaScript
  'function', 'const', 'let', 'for', 'if', 'else', 'return', 'length',
  // entries and loops
  'point', 'columns', 'grid', 'a', 'res', 'c', 'outRe', 'outIm', 'n', 'k', 'ts', 'ss', 'nt', 'ns', 'p', 'q', 'base',
  // helpers (parameters of the generated function)
  'exp', 'log', 'sqrt', 'abs', 'sin', 'cos', 'tan', 'sinh', 'cosh', 'tanh', 'atan', 'sign', 'floor', 'min', 'max',
  'pow', 'hypot', 'erf', 'clog', 'csqrt', 'csin', 'ccos', 'ctan', 'csinh', 'ccosh', 'ctanh', 'catan', 'cpow', 'cdiv',
  'csign', 'o',
]);
/** Generated names: arguments x0, columns c0, values r12 / i12, exponentials e12. */
const generatedName = /^(?:x|c|r|i|e)\d+$/;

/** The problems with a generated source, or [] when every token is allowed. */
function scan(source: string): string[] {
  const problems: string[] = [];
  if (!source.startsWith("'use strict';\n")) problems.push('no strict mode prologue');
  const body = source.slice("'use strict';\n".length);
  if (/['"`\\]/.test(body)) problems.push('a quote or backslash');
  // Number literals first (they may contain e+ / e- and dots), then words.
  const withoutNumbers = body.replace(/\b\d+(?:\.\d+)?(?:e[+-]\d+)?\b/g, ' 0 ');
  for (const word of withoutNumbers.match(/[A-Za-z_$][\w$]*/g) ?? []) {
    if (!allowedWords.has(word) && !generatedName.test(word)) problems.push(`identifier ${word}`);
  }
  // Property access only as `.length`; everything else is a number's decimal point (removed above).
  for (const m of withoutNumbers.matchAll(/\.\s*([A-Za-z_$][\w$]*)?/g)) if (m[1] !== 'length') problems.push(`property access ${m[0]}`);
  const leftovers = withoutNumbers.replace(/[A-Za-z_$][\w$]*|\s+|[-+*/=<>!?:;,.&|()[\]{}]|0/g, '');
  if (leftovers !== '') problems.push(`unexpected characters ${JSON.stringify(leftovers)}`);
  return problems;
}

const range = { start: 0, end: 1 };
const t: IrNode = { op: 'var', slot: 0, range };

function withRoot(root: unknown, extra: Partial<IrFunction> = {}): IrFunction {
  return { root: root as IrNode, arity: 2, slotCount: 2, complex: false, ...extra };
}

describe('generated source contains only the generator’s own identifiers', () => {
  it('random real and complex trees', () => {
    fc.assert(
      fc.property(fc.boolean().chain((complex) => irArb(complex, 6)), (fn) => {
        const problems = scan(generateSource(fn).source);
        if (problems.length > 0) throw new Error(problems.join('; '));
        return true;
      }),
      { numRuns: 500, seed: 42 },
    );
  });

  it('extreme constants are serialized as numbers (NaN, ±∞, −0, subnormal, huge)', () => {
    const ir = new IrMaker();
    const values = [NaN, Infinity, -Infinity, -0, 5e-324, 1.7976931348623157e308, -1e-7, 1e21, 0.1];
    for (const x of values) {
      const fn = withRoot(ir.bin('add', ir.v(0), ir.c(x)));
      expect(scan(generateSource(fn).source)).toEqual([]);
      const v = compileKernel(fn).evaluate([0, 0]);
      expect(Object.is(v.re, 0 + x) || (Number.isNaN(x) && Number.isNaN(v.re))).toBe(true);
    }
  });

  it('the scanner itself rejects foreign names (a check of the check)', () => {
    expect(scan("'use strict';\nconst r0 = process.exit(1);")).toContain('identifier process');
    expect(scan("'use strict';\nconst r0 = this.constructor;")).toEqual(expect.arrayContaining(['identifier this', 'identifier constructor']));
    expect(scan("'use strict';\nconst r0 = \"x\";")).toContain('a quote or backslash');
  });
});

describe('names from a user cannot even be represented: hostile IR is rejected before any code is made', () => {
  const hostile: [string, IrFunction][] = [
    ['a builtin named constructor', withRoot({ op: 'call', fn: 'constructor', args: [t], range })],
    ['a builtin named __proto__', withRoot({ op: 'call', fn: '__proto__', args: [t], range })],
    ['a builtin named toString', withRoot({ op: 'call', fn: 'toString', args: [t], range })],
    ['a builtin named process', withRoot({ op: 'call', fn: 'process', args: [t], range })],
    ['a builtin named require', withRoot({ op: 'call', fn: 'require', args: [t], range })],
    ['an op named this', withRoot({ op: 'this', range })],
    ['an op named eval', withRoot({ op: 'eval', a: t, range })],
    ['a slot that is text', withRoot({ op: 'var', slot: '0]; process.exit(1); [', range })],
    ['a slot out of range', withRoot({ op: 'var', slot: 7, range })],
    ['a fractional slot', withRoot({ op: 'var', slot: 0.5, range })],
    ['a constant that is text', withRoot({ op: 'const', re: '1; require("fs")', im: 0, range })],
    ['a constant object with toString', withRoot({ op: 'const', re: { toString: () => 'process' }, im: 0, range })],
    ['a complex constant in a real function', withRoot({ op: 'const', re: 0, im: 1, range })],
    ['a let slot that clashes with an argument', withRoot({ op: 'let', slot: 0, value: t, body: t, range })],
    ['a let slot used outside its body', withRoot({ op: 'add', a: { op: 'let', slot: 2, value: t, body: t, range }, b: { op: 'var', slot: 2, range }, range }, { slotCount: 3 })],
    ['exp with two arguments', withRoot({ op: 'call', fn: 'exp', args: [t, t], range })],
    ['an arity that is text', withRoot(t, { arity: '2; process' as unknown as number })],
    ['a missing child', withRoot({ op: 'neg', range })],
  ];
  for (const [name, fn] of hostile) {
    it(name, () => {
      expect(() => compileFunction(fn)).toThrow(/internal evaluator error/);
      expect(() => interpret(fn, [0, 0])).toThrow(/internal evaluator error/);
    });
  }

  it('a kernel must have arity 2', () => {
    expect(() => compileKernel(irFromText('t', ['t']).fn)).toThrow(/arity 2/);
  });
});
