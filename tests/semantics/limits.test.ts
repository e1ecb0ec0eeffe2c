/**
 * Sizes that binding must survive: long chains of definitions (declared in any order) must neither exhaust the call
 * stack nor be refused, and the expansion of helpers is refused exactly past its documented limit of 20000 parts,
 * once, where it first passes it. (No timing here: the machine running the tests may be slow.)
 */
import { describe, expect, it } from 'vitest';
import { analyzeText } from '../../src-core/analysis/analyze';
import { interpret } from '../../src-core/semantics/evaluator';
import { maxIrNodes } from '../../src-core/semantics/lower';

const bind = (text: string) => analyzeText(text, { numerics: false });
const lines = (n: number, line: (k: number) => string) => Array.from({ length: n }, (_, k) => line(k)).join('\n');

describe('long chains', () => {
  it('of 3000 helpers, each calling the next, declared last-first, lower to one deep tree', () => {
    const n = 3000;
    // f0(x) = x, f_k(x) = f_{k-1}(x) + 1: the kernel f3000(t) is t + 3000.
    const text = `domain [0, 1]\n${lines(n, (k) => `fn f${n - k}(x) = f${n - k - 1}(x) + 1`)}\nfn f0(x) = x\nkernel k(t, s) = f${n}(t) * s\n`;
    const r = bind(text);
    expect(r.diagnostics).toEqual([]);
    const v = interpret(r.model.kernels[0].ir!, [0.5, 2]);
    expect(v).toMatchObject({ ok: true, re: (0.5 + n) * 2 });
  });

  it('of 20000 constants, each using the next, declared last-first, all get their values', () => {
    const n = 20_000;
    const text = `domain [0, 1]\nkernel k(t, s) = c${n} * t\n${lines(n, (k) => `const c${n - k} = c${n - k - 1} + 1`)}\nconst c0 = 0\n`;
    const r = bind(text);
    expect(r.diagnostics).toEqual([]);
    expect(r.model.symbols.get(`c${n}`)).toMatchObject({ value: { re: n, im: 0 } });
  });

  it('of 20000 constants in a cycle give one error, on the first', () => {
    const n = 20_000;
    const text = `${lines(n, (k) => `const c${k} = c${(k + 1) % n} + 1`)}\n`;
    const d = bind(text).diagnostics;
    expect(d.map((x) => x.code)).toEqual(['KW205']);
    expect(d[0].range).toEqual({ start: 6, end: 8 });
    expect(d[0].related).toHaveLength(n - 1);
  });

  it('of 10000 helpers past the size limit give one error, where the limit is first passed', () => {
    const n = 10_000;
    // f_k(x) = f_{k-1}(x) + 1 expands to 5k + 1 parts (call, argument, binding, sum, one: five per level).
    const text = `domain [0, 1]\nfn f0(x) = x\n${lines(n, (k) => `fn f${k + 1}(x) = f${k}(x) + 1`)}\nkernel k(t, s) = f${n}(t)\n`;
    const d = bind(text).diagnostics;
    expect(d.map((x) => x.code)).toEqual(['KW107']);
    const first = 4000; // 5 · 4000 + 1 = 20001: the first size past the limit
    expect(5 * first + 1).toBe(maxIrNodes + 1);
    expect(text.slice(d[0].range.start - `fn f${first}(x) = `.length, d[0].range.end)).toBe(`fn f${first}(x) = f${first - 1}(x) + 1`);
  });
});

describe('the expansion limit', () => {
  // a_k(x) = a_{k-1}(x) + a_{k-1}(x), a_0(x) = x: a_k has S_k = 2 S_{k-1} + 7 parts (the sum, and per call: the
  // call, its argument, its binding and the body), so S_0 = 1, S_5 = 249, S_11 = 16377. A call a_k(t) adds
  // S_k + 3 parts, a term `+ t` adds 2, and parentheses around t add 1.
  const helpers = `domain [0, 1]\nfn a0(x) = x\n${lines(11, (k) => `fn a${k + 1}(x) = a${k}(x) + a${k}(x)`)}\n`;
  const body = (last: string) => `a11(t)${' + a5(t)'.repeat(14)}${' + t'.repeat(38)} + ${last}`;
  // 16380 + 14 · 253 + 39 · 2 = 20000 parts exactly.

  it('accepts an expression of exactly 20000 parts', () => {
    const r = bind(`${helpers}kernel k(t, s) = ${body('t')}\n`);
    expect(r.diagnostics).toEqual([]);
    expect(r.model.kernels[0].ir).not.toBeNull();
  });

  it('refuses one of 20001 parts, on that expression alone', () => {
    const text = `${helpers}kernel k(t, s) = ${body('(t)')}\nkernel user(t, s) = k(t, s) * 2\nconst c = k(0, 1)\nkernel other(t, s) = c\n`;
    const r = bind(text);
    expect(r.diagnostics.map((d) => [d.code, d.message])).toEqual([
      ['KW107', 'This expression has too many parts after expanding helper functions; the limit is 20000.'],
    ]);
    expect(text.slice(r.diagnostics[0].range.start, r.diagnostics[0].range.end)).toBe(body('(t)'));
    expect(r.model.kernels.map((k) => k.ir)).toEqual([null, null, null]);
  });

  it('is counted, not reached by expanding: doubling helpers 200 levels deep bind at once', () => {
    const text = `domain [0, 1]\nfn d0(x) = x * x\n${lines(200, (k) => `fn d${k + 1}(x) = d${k}(d${k}(x))`)}\nkernel k(t, s) = d200(t)\n`;
    const d = bind(text).diagnostics;
    expect(d.map((x) => x.code)).toEqual(['KW107']);
    // d_k has S_k = 2 S_{k-1} + 5 parts, S_0 = 3, so S_k = 8 · 2^k − 5: d11 has 16379, d12 is the first past 20000.
    expect(text.slice(d[0].range.start - 'fn d12(x) = '.length, d[0].range.end)).toBe('fn d12(x) = d11(d11(x))');
  });
});
