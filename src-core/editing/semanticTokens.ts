/**
 * Semantic classes of the names in a kernel file, beyond what a grammar can tell from the text alone: whether a
 * name is a parameter, a declared constant, a helper, a kernel or a built-in, and whether it is being declared.
 * Keywords, numbers, operators and comments are left to the grammar. Tokens come in source order.
 */
import type { SourceFile } from '../syntax/ast';
import type { TextRange } from '../syntax/textRange';
import { walkExpr } from '../syntax/walk';
import type { FileModel } from '../semantics/model';
import { isBuiltinConstant, isBuiltinFunction } from '../semantics/builtins';
import { isExpectationName } from '../semantics/expectations';
import { expressionsOf } from './nodeAt';

export type SemanticClass = 'parameter' | 'constant' | 'helper' | 'kernel' | 'builtin-function' | 'builtin-constant' | 'expectation';

export interface SemanticToken {
  readonly range: TextRange;
  readonly cls: SemanticClass;
  readonly declaration: boolean;
}

const kindClass = { const: 'constant', fn: 'helper', kernel: 'kernel' } as const;

export function semanticTokens(source: SourceFile, model: FileModel): SemanticToken[] {
  const out: SemanticToken[] = [];
  const classify = (name: string, params: readonly string[], call: boolean): SemanticClass | null => {
    if (params.includes(name)) return 'parameter';
    const sym = model.symbols.get(name);
    if (sym) return kindClass[sym.kind];
    if (call && isBuiltinFunction(name)) return 'builtin-function';
    if (!call && isBuiltinConstant(name)) return 'builtin-constant';
    return null;
  };
  for (const decl of source.declarations) {
    if (decl.kind !== 'domain' && decl.name.text !== '') {
      out.push({ range: decl.name.range, cls: kindClass[decl.kind], declaration: true });
    }
    if (decl.kind === 'fn' || decl.kind === 'kernel') {
      for (const p of decl.params) if (p.text !== '') out.push({ range: p.range, cls: 'parameter', declaration: true });
    }
    if (decl.kind === 'kernel') {
      for (const clause of decl.expects) {
        for (const item of clause.items) {
          if (isExpectationName(item.name)) out.push({ range: item.nameRange, cls: 'expectation', declaration: false });
        }
      }
    }
    for (const { expr, params } of expressionsOf(decl)) {
      walkExpr(expr, (e) => {
        if (e.kind === 'ident') {
          const cls = classify(e.name, params, false);
          if (cls) out.push({ range: e.range, cls, declaration: false });
        } else if (e.kind === 'call') {
          const cls = classify(e.callee, params, true);
          if (cls) out.push({ range: e.calleeRange, cls, declaration: false });
        }
      });
    }
  }
  return out.sort((a, b) => a.range.start - b.range.start);
}
