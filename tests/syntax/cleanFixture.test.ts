/**
 * The clean fixture uses every valid form of the format and parses without a diagnostic. These checks make sure
 * it really does hold every form (so that "no diagnostic" means something) and that the tree reads it right.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { BinaryOp, ConstDecl, KernelDecl, UnaryOp } from '../../src-core/syntax';
import { parse } from '../../src-core/syntax/parser';
import { printExpr } from '../../src-core/syntax/printer';
import { LineIndex } from '../../src-core/syntax/textRange';
import { builtinConstants, builtinFunctions } from '../../src-core/semantics/builtins';
import { allExprs } from './treeText';

const text = readFileSync(join(__dirname, 'fixtures', 'clean.kw'), 'utf8');
const file = parse(text);
const exprs = allExprs(file);
const kernels = file.declarations.filter((d): d is KernelDecl => d.kind === 'kernel');
const kernel = (name: string) => kernels.find((k) => k.name.text === name)!;
const constant = (name: string) =>
  file.declarations.find((d): d is ConstDecl => d.kind === 'const' && d.name.text === name)!;

describe('clean.kw', () => {
  it('has no diagnostic', () => expect(file.diagnostics).toEqual([]));

  it('calls every built-in function and uses every built-in constant', () => {
    const called = new Set(exprs.flatMap((e) => (e.kind === 'call' ? [e.callee] : [])));
    const named = new Set(exprs.flatMap((e) => (e.kind === 'ident' ? [e.name] : [])));
    for (const fn of Object.keys(builtinFunctions)) expect(called, fn).toContain(fn);
    for (const c of Object.keys(builtinConstants)) expect(named, c).toContain(c);
  });

  it('uses every operator, a conditional and parentheses', () => {
    const binary: BinaryOp[] = ['+', '-', '*', '/', '^', '<', '<=', '>', '>=', '==', '!=', 'and', 'or'];
    const unary: UnaryOp[] = ['-', '+', 'not'];
    const ops = new Set(exprs.flatMap((e) => (e.kind === 'binary' || e.kind === 'unary' ? [`${e.kind} ${e.op}`] : [])));
    for (const op of binary) expect(ops, op).toContain(`binary ${op}`);
    for (const op of unary) expect(ops, op).toContain(`unary ${op}`);
    expect(exprs.some((e) => e.kind === 'cond')).toBe(true);
    expect(exprs.some((e) => e.kind === 'paren')).toBe(true);
  });

  it('writes numbers in every form and keeps them as written', () => {
    const raws = exprs.flatMap((e) => (e.kind === 'number' ? [e.raw] : []));
    expect(raws).toEqual(expect.arrayContaining(['2.5', '3e-4', '1.5E+2', '.5']));
    expect(constant('rate').value).toMatchObject({ kind: 'number', value: 3e-4 });
    expect(constant('big').value).toMatchObject({ kind: 'number', value: 150 });
  });

  it('reads Unicode names', () => {
    expect(constant('σ').name.range).toEqual({ start: text.indexOf('σ ='), end: text.indexOf('σ =') + 1 });
    expect(constant('ℓ_2')).toBeDefined();
  });

  it('takes a trailing comment of a constant as its note, trimmed', () => {
    expect(constant('c').note).toBe('metres');
    expect(constant('rate').note).toBe('per second');
    expect(constant('big').note).toBeUndefined();
  });

  it('continues declarations over indented lines (spaces and a tab), across comments and blank lines', () => {
    const index = new LineIndex(text);
    const arithmetic = kernel('arithmetic');
    const source = text.slice(arithmetic.range.start, arithmetic.range.end);
    // From its keyword to the end of its expect clause: eight lines, a blank one and a comment among them.
    expect(source).toMatch(/^kernel arithmetic\(t, s\)[^]*\n\n[^]*\t\+ sinh\(t\)[^]*, resolvent -1$/);
    expect(index.position(arithmetic.range.end).line - index.position(arithmetic.range.start).line).toBe(7);
    expect(printExpr(kernel('logic').body)).toContain('t != s ? blend(t, s, 0.5) : c > 1 ? 1 : 0');
  });

  it('attaches expect clauses at column 0 and indented to the kernel above', () => {
    expect(kernel('wiener').expects.map((c) => c.items.map((i) => i.name))).toEqual([
      ['hermitian', 'positive', 'continuous', 'bounded', 'hilbert-schmidt'],
    ]);
    const gauss = kernel('gauss');
    expect(gauss.expects).toHaveLength(2);
    expect(gauss.expects[1].items.map((i) => [i.name, i.op, i.value && printExpr(i.value)])).toEqual([
      ['norm', '<=', '2.5'],
      ['rank', '=', '3'],
      ['norm', '<', '10'],
    ]);
    expect(kernel('arithmetic').expects[0].items.map((i) => [i.name, i.op, i.value && printExpr(i.value)])).toEqual([
      ['resolvent', undefined, '0.5 + 2 * i'],
      ['resolvent', undefined, '-1'],
    ]);
    expect(kernel('logic').expects).toEqual([]);
  });

  it('gives kernels their own interval with on [a, b]', () => {
    expect(kernel('gauss').domain && printExpr(kernel('gauss').domain!.lower)).toBe('-1');
    expect(kernel('logic').domain && printExpr(kernel('logic').domain!.upper)).toBe('2 * pi');
    expect(kernel('wiener').domain).toBeUndefined();
  });

  it('collects every comment, with its text after #', () => {
    // Independent reading: the fixture has no strings, so every # starts a comment that runs to the line end.
    const expected = [...text.matchAll(/#([^\r\n]*)/g)].map((m) => ({
      range: { start: m.index!, end: m.index! + m[0].length },
      text: m[1],
    }));
    expect(file.comments).toEqual(expected);
  });
});
