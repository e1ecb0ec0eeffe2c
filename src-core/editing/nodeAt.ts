/**
 * What is at an offset of a kernel file: a declared name (at its declaration or at a use), a parameter, a built-in,
 * a claim of an `expect` clause or a declaration keyword. The one lookup behind hover, go-to-definition, find
 * references, rename and signature help. Plain data in offsets; only the declaration around the offset is walked.
 */
import type { Declaration, Expectation, Expr, FnDecl, KernelDecl, SourceFile } from '../syntax/ast';
import { contains, type TextRange } from '../syntax/textRange';
import { walkExpr } from '../syntax/walk';
import type { FileModel, FileSymbol, KernelSymbol } from '../semantics/model';
import { isBuiltinConstant, isBuiltinFunction, type BuiltinConstantName, type BuiltinFunctionName } from '../semantics/builtins';

export type NodeAt =
  | { readonly kind: 'symbol'; readonly symbol: FileSymbol; readonly range: TextRange; readonly declaration: boolean }
  | {
      readonly kind: 'parameter';
      readonly name: string;
      readonly range: TextRange;
      readonly owner: FnDecl | KernelDecl;
      /** Position of the parameter in its owner's list. */
      readonly index: number;
      readonly declaration: boolean;
    }
  | { readonly kind: 'builtin-function'; readonly name: BuiltinFunctionName; readonly range: TextRange }
  | { readonly kind: 'builtin-constant'; readonly name: BuiltinConstantName; readonly range: TextRange }
  | { readonly kind: 'expectation'; readonly item: Expectation; readonly kernel: KernelSymbol | null; readonly range: TextRange }
  | { readonly kind: 'keyword'; readonly word: string; readonly range: TextRange }
  /** A name that resolves to nothing (already reported as a diagnostic), or a duplicate declaration. */
  | { readonly kind: 'unresolved'; readonly name: string; readonly range: TextRange };

/** The declaration whose range contains `offset` (ends inclusive), or null. */
export function declarationAt(source: SourceFile, offset: number): Declaration | null {
  const decls = source.declarations;
  let lo = 0;
  let hi = decls.length - 1;
  // Declarations are in source order and do not overlap: binary search on the start.
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (decls[mid].range.start <= offset) lo = mid;
    else hi = mid - 1;
  }
  const d = decls[lo];
  return d && contains(d.range, offset) ? d : null;
}

/** The symbol a declaration introduces, when it is the one the name resolves to (not a duplicate). */
export function symbolOfDeclaration(model: FileModel, decl: Declaration): FileSymbol | null {
  if (decl.kind === 'domain' || decl.name.text === '') return null;
  const sym = model.symbols.get(decl.name.text);
  return sym && sym.nameRange.start === decl.name.range.start ? sym : null;
}

export function kernelOfDeclaration(model: FileModel, decl: KernelDecl): KernelSymbol | null {
  return model.kernels.find((k) => k.decl === decl) ?? null;
}

/** The expressions of a declaration with the parameter names visible in each. */
export function expressionsOf(decl: Declaration): { expr: Expr; params: readonly string[] }[] {
  switch (decl.kind) {
    case 'domain':
      return [{ expr: decl.interval.lower, params: [] }, { expr: decl.interval.upper, params: [] }];
    case 'const':
      return [{ expr: decl.value, params: [] }];
    case 'fn':
      return [{ expr: decl.body, params: decl.params.map((p) => p.text) }];
    case 'kernel': {
      const out: { expr: Expr; params: readonly string[] }[] = [];
      if (decl.domain) out.push({ expr: decl.domain.lower, params: [] }, { expr: decl.domain.upper, params: [] });
      out.push({ expr: decl.body, params: decl.params.map((p) => p.text) });
      for (const clause of decl.expects) for (const item of clause.items) if (item.value) out.push({ expr: item.value, params: [] });
      return out;
    }
  }
}

/** The innermost identifier or callee name at `offset` inside `expr`. */
function nameInExpr(expr: Expr, offset: number): { name: string; range: TextRange; call: boolean } | null {
  let found: { name: string; range: TextRange; call: boolean } | null = null;
  walkExpr(expr, (e) => {
    if (!contains(e.range, offset)) return false;
    if (e.kind === 'ident') found = { name: e.name, range: e.range, call: false };
    else if (e.kind === 'call' && contains(e.calleeRange, offset)) found = { name: e.callee, range: e.calleeRange, call: true };
    return true;
  });
  return found;
}

function resolveName(model: FileModel, decl: Declaration, params: readonly string[], name: string, range: TextRange): NodeAt {
  if (params.includes(name) && (decl.kind === 'fn' || decl.kind === 'kernel')) {
    return { kind: 'parameter', name, range, owner: decl, index: params.indexOf(name), declaration: false };
  }
  const sym = model.symbols.get(name);
  if (sym) return { kind: 'symbol', symbol: sym, range, declaration: false };
  if (isBuiltinFunction(name)) return { kind: 'builtin-function', name, range };
  if (isBuiltinConstant(name)) return { kind: 'builtin-constant', name, range };
  return { kind: 'unresolved', name, range };
}

export function nodeAt(source: SourceFile, model: FileModel, offset: number): NodeAt | null {
  const decl = declarationAt(source, offset);
  if (!decl) return null;
  if (contains(decl.keywordRange, offset)) return { kind: 'keyword', word: decl.kind, range: decl.keywordRange };
  if (decl.kind !== 'domain' && decl.name.text !== '' && contains(decl.name.range, offset)) {
    const sym = symbolOfDeclaration(model, decl);
    return sym
      ? { kind: 'symbol', symbol: sym, range: decl.name.range, declaration: true }
      : { kind: 'unresolved', name: decl.name.text, range: decl.name.range };
  }
  if (decl.kind === 'fn' || decl.kind === 'kernel') {
    const index = decl.params.findIndex((p) => p.text !== '' && contains(p.range, offset));
    if (index >= 0) {
      const p = decl.params[index];
      return { kind: 'parameter', name: p.text, range: p.range, owner: decl, index, declaration: true };
    }
  }
  if (decl.kind === 'kernel') {
    for (const clause of decl.expects) {
      if (contains(clause.keywordRange, offset)) return { kind: 'keyword', word: 'expect', range: clause.keywordRange };
      for (const item of clause.items) {
        if (item.name !== '' && contains(item.nameRange, offset)) {
          return { kind: 'expectation', item, kernel: kernelOfDeclaration(model, decl), range: item.nameRange };
        }
      }
    }
  }
  for (const { expr, params } of expressionsOf(decl)) {
    if (!contains(expr.range, offset)) continue;
    const hit = nameInExpr(expr, offset);
    if (hit) return resolveName(model, decl, params, hit.name, hit.range);
  }
  return null;
}

/** Every use of parameter `name` inside its owner's body. */
export function parameterUses(owner: FnDecl | KernelDecl, name: string): TextRange[] {
  const out: TextRange[] = [];
  walkExpr(owner.body, (e) => {
    if (e.kind === 'ident' && e.name === name) out.push(e.range);
    else if (e.kind === 'call' && e.callee === name) out.push(e.calleeRange);
  });
  return out;
}
