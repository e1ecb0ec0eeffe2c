/**
 * The symmetrize fix: replaces a kernel's body by its Hermitian part (K(t, s) + conj K(s, t)) / 2, the closest
 * Hermitian kernel in the Hilbert–Schmidt norm. The mirrored term is the body with the kernel's two variables
 * swapped in the syntax tree (helpers and constants keep their names); a real kernel needs no conj.
 *
 * For a real kernel the text is then offered to the installed simplifier (mathjs `simplify`, see simplifier.ts) (e.g. (t·s + s·t)/2 becomes t·s). The simplified
 * text is used only when it is not longer, parses with our parser, binds in the file without errors, and equals
 * the Hermitian part at 16 random points of the square to 10⁻¹⁰; otherwise the plain form is kept.
 */
import { expressionSimplifier } from './simplifier';
import type { Expr, KernelDecl } from '../syntax/ast';
import type { Fix } from '../diagnostics/types';
import { printExpr } from '../syntax/printer';
import { parse, parseExpression } from '../syntax/parser';
import { bindFile } from '../semantics/bind';
import { compileKernel, type CompiledKernel } from '../semantics/evaluator';
import type { KernelSymbol } from '../semantics/model';
import { seededUniform } from '../numerics/linalg/seededRandom';

export const symmetrizeKind = 'symmetrize';

const here = { start: 0, end: 0 };

/** A copy of `e` with the identifiers `x` and `y` exchanged. */
export function swapNames(e: Expr, x: string, y: string): Expr {
  switch (e.kind) {
    case 'number': case 'error': return e;
    case 'ident': return e.name === x ? { ...e, name: y } : e.name === y ? { ...e, name: x } : e;
    case 'paren': return { ...e, inner: swapNames(e.inner, x, y) };
    case 'unary': return { ...e, operand: swapNames(e.operand, x, y) };
    case 'binary': return { ...e, left: swapNames(e.left, x, y), right: swapNames(e.right, x, y) };
    case 'call': return { ...e, args: e.args.map((a) => swapNames(a, x, y)) };
    case 'cond': return { ...e, test: swapNames(e.test, x, y), then: swapNames(e.then, x, y), otherwise: swapNames(e.otherwise, x, y) };
  }
}

/** The text of (K(t, s) + conj K(s, t)) / 2 for the kernel's body (without conj for a real kernel). */
export function hermitianPartText(decl: KernelDecl, complex: boolean): string | null {
  if (decl.params.length !== 2 || decl.params.some((p) => p.text === '')) return null;
  const [x, y] = decl.params.map((p) => p.text);
  const swapped = swapNames(decl.body, x, y);
  const mirrored: Expr = complex
    ? { kind: 'call', range: here, callee: 'conj', calleeRange: here, args: [swapped] }
    : swapped;
  const sum: Expr = { kind: 'binary', range: here, op: '+', opRange: here, left: decl.body, right: mirrored };
  const half: Expr = { kind: 'binary', range: here, op: '/', opRange: here, left: { kind: 'paren', range: here, inner: sum }, right: { kind: 'number', range: here, value: 2, raw: '2' } };
  return printExpr(half);
}

/** The kernel named `name` in `text`, compiled, when the file binds it without errors. */
function compileFromFile(text: string, name: string): CompiledKernel | null {
  const source = parse(text);
  if (source.diagnostics.some((d) => d.severity === 'error')) return null;
  const model = bindFile(source);
  const k = model.kernels.find((q) => q.name === name);
  if (!k?.ir) return null;
  const errorsInKernel = model.diagnostics.some((d) => d.severity === 'error' && d.range.start >= k.decl.range.start && d.range.end <= k.decl.range.end);
  return errorsInKernel ? null : compileKernel(k.ir);
}

/** True when the candidate body, put into the file, gives (K(t, s) + conj K(s, t)) / 2 at random points. */
function matchesHermitianPart(k: KernelSymbol, text: string, candidate: string): boolean {
  if (!k.ir || !k.domain) return false;
  const replaced = text.slice(0, k.decl.body.range.start) + candidate + text.slice(k.decl.body.range.end);
  const compiled = compileFromFile(replaced, k.name);
  if (!compiled) return false;
  const original = compileKernel(k.ir);
  const random = seededUniform(20_240_611);
  const { a, b } = k.domain;
  const at = (f: CompiledKernel, t: number, s: number): [number, number] => {
    const re = new Float64Array(1);
    const im = new Float64Array(1);
    f.evaluateColumns([Float64Array.of(t), Float64Array.of(s)], re, f.complex ? im : null);
    return [re[0], f.complex ? im[0] : 0];
  };
  for (let n = 0; n < 16; n++) {
    const t = a + (b - a) * random();
    const s = a + (b - a) * random();
    const [kr, ki] = at(original, t, s);
    const [mr, mi] = at(original, s, t);
    const hr = 0.5 * (kr + mr);
    const hi = 0.5 * (ki - mi);
    const [cr, ci] = at(compiled, t, s);
    const scale = 1 + Math.hypot(hr, hi);
    if (!Number.isFinite(hr) || !Number.isFinite(hi)) continue;
    if (!(Math.hypot(cr - hr, ci - hi) <= 1e-10 * scale)) return false;
  }
  return true;
}

/** mathjs' simplification of a real expression, printed in our syntax, or null when mathjs cannot handle it. */
function simplified(plain: string): string | null {
  const simplify = expressionSimplifier();
  if (!simplify || plain.length > 400) return null;
  try {
    const out = simplify(plain);
    if (out === null) return null;
    const reparsed = parseExpression(out);
    if (reparsed.diagnostics.length > 0) return null;
    return printExpr(reparsed.expr);
  } catch {
    return null;
  }
}

const cache = new Map<string, string | null>();

/** The new body text for the kernel: the Hermitian part, simplified when that is safe. */
export function symmetrizedBody(k: KernelSymbol, text: string): string | null {
  const complex = k.ir?.complex ?? false;
  const plain = hermitianPartText(k.decl, complex);
  if (plain === null) return null;
  if (complex) return plain;
  const key = `${k.hash};${text.slice(k.decl.range.start, k.decl.range.end)};${plain}`;
  if (cache.has(key)) return cache.get(key) ?? plain;
  const candidate = simplified(plain);
  const chosen = candidate !== null && candidate.length <= plain.length && candidate !== plain && matchesHermitianPart(k, text, candidate)
    ? candidate : null;
  cache.set(key, chosen);
  if (cache.size > 128) cache.delete(cache.keys().next().value as string);
  return chosen ?? plain;
}

/** The fix that replaces the kernel's body by its Hermitian part; null when the declaration is incomplete. */
export function symmetrizeFix(k: KernelSymbol, text: string): Fix | null {
  const body = symmetrizedBody(k, text);
  if (body === null) return null;
  const word = k.ir?.complex ? 'Hermitian' : 'symmetric';
  return {
    kind: symmetrizeKind,
    title: `Replace the kernel by its ${word} part`,
    edits: [{ range: k.decl.body.range, newText: body }],
  };
}
