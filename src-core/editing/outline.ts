/**
 * The outline of a kernel file (document symbols): the domain line, constants, helpers and kernels, each kernel
 * with its claims as children. Plain data in offsets.
 */
import type { Declaration, SourceFile } from '../syntax/ast';
import type { TextRange } from '../syntax/textRange';
import { printExpr } from '../syntax/printer';

export type OutlineKind = 'domain' | 'constant' | 'helper' | 'kernel' | 'expectation';

export interface OutlineItem {
  readonly name: string;
  readonly kind: OutlineKind;
  /** A short description next to the name. */
  readonly detail: string;
  /** The whole declaration. */
  readonly range: TextRange;
  /** The part to reveal and select (the name). */
  readonly selectionRange: TextRange;
  readonly children: readonly OutlineItem[];
}

function item(decl: Declaration): OutlineItem | null {
  switch (decl.kind) {
    case 'domain':
      return {
        name: 'domain', kind: 'domain', detail: `[${printExpr(decl.interval.lower)}, ${printExpr(decl.interval.upper)}]`,
        range: decl.range, selectionRange: decl.keywordRange, children: [],
      };
    case 'const':
      if (decl.name.text === '') return null;
      return {
        name: decl.name.text, kind: 'constant', detail: `= ${printExpr(decl.value)}`,
        range: decl.range, selectionRange: decl.name.range, children: [],
      };
    case 'fn':
      if (decl.name.text === '') return null;
      return {
        name: decl.name.text, kind: 'helper', detail: `(${decl.params.map((p) => p.text).join(', ')})`,
        range: decl.range, selectionRange: decl.name.range, children: [],
      };
    case 'kernel': {
      if (decl.name.text === '') return null;
      const on = decl.domain ? ` on [${printExpr(decl.domain.lower)}, ${printExpr(decl.domain.upper)}]` : '';
      const children: OutlineItem[] = [];
      for (const clause of decl.expects) {
        for (const e of clause.items) {
          if (e.name === '') continue;
          const value = e.value ? `${e.op ? `${e.op} ` : ''}${printExpr(e.value)}` : '';
          children.push({ name: e.name, kind: 'expectation', detail: value, range: e.range, selectionRange: e.nameRange, children: [] });
        }
      }
      return {
        name: decl.name.text, kind: 'kernel', detail: `(${decl.params.map((p) => p.text).join(', ')})${on}`,
        range: decl.range, selectionRange: decl.name.range, children,
      };
    }
  }
}

export function outline(source: SourceFile): OutlineItem[] {
  const out: OutlineItem[] = [];
  for (const d of source.declarations) {
    const i = item(d);
    if (i) out.push(i);
  }
  return out;
}
