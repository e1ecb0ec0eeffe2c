/**
 * Name checks inside one expression: every identifier and call must resolve to a parameter, a declared constant,
 * helper or kernel, or a built-in; calls must have the right number of arguments. Records references (for
 * go-to-definition, rename, unused-name hints) and the declarations the expression depends on (for cycles).
 */
import type { Expr } from '../syntax/ast';
import type { Diagnostic } from '../diagnostics/types';
import { makeDiagnostic } from '../diagnostics/make';
import { suggest } from '../util/suggest';
import { builtinConstants, builtinFunctions, isBuiltinConstant, isBuiltinFunction } from './builtins';
import { describeSymbol, type DraftSymbol, type Scope } from './scope';

export interface NameCheckResult {
  /** False when the expression has an error of its own (syntax or names). */
  readonly ok: boolean;
  /** Declarations used, in order of first use. */
  readonly uses: DraftSymbol[];
}

function arityText(min: number, max: number): string {
  const plural = (n: number) => (n === 1 ? '' : 's');
  if (max === Infinity) return `${min} or more arguments`;
  if (min === max) return `${min} argument${plural(min)}`;
  return `${min} to ${max} arguments`;
}

/** An unknown name, with a did-you-mean suggestion and its fix when a close candidate exists. */
function unknownName(
  kind: 'unknown-identifier' | 'unknown-function', name: string, range: Expr['range'], candidates: Iterable<string>,
): Diagnostic {
  const suggestion = suggest(name, candidates);
  if (!suggestion) return makeDiagnostic(kind, range, { name, suggestion: '' });
  return makeDiagnostic(kind, range, { name, suggestion: ` Did you mean “${suggestion}”?` }, {
    fixes: [{ kind: 'did-you-mean', title: `Change to “${suggestion}”`, edits: [{ range, newText: suggestion }], preferred: true }],
    figures: { suggestion },
  });
}

export function checkNames(
  expr: Expr,
  params: readonly string[],
  scope: Scope,
  diagnostics: Diagnostic[],
): NameCheckResult {
  let ok = true;
  const uses: DraftSymbol[] = [];
  const use = (sym: DraftSymbol, range: Expr['range']) => {
    sym.references.push(range);
    if (!uses.includes(sym)) uses.push(sym);
  };
  const valueNames = (): string[] => [
    ...params,
    ...[...scope.symbols.values()].filter((s) => s.kind === 'const').map((s) => s.name),
    ...Object.keys(builtinConstants),
  ];
  const functionNames = (): string[] => [
    ...Object.keys(builtinFunctions),
    ...[...scope.symbols.values()].filter((s) => s.kind !== 'const').map((s) => s.name),
  ];
  const report = (d: Diagnostic) => {
    diagnostics.push(d);
    ok = false;
  };

  // Iterative pre-order walk: expressions can be deep, recursion must not overflow.
  const stack: Expr[] = [expr];
  while (stack.length > 0) {
    const e = stack.pop()!;
    switch (e.kind) {
      case 'number':
        break;
      case 'error':
        ok = false;
        break;
      case 'paren':
        stack.push(e.inner);
        break;
      case 'unary':
        stack.push(e.operand);
        break;
      case 'binary':
        stack.push(e.right, e.left);
        break;
      case 'cond':
        stack.push(e.otherwise, e.then, e.test);
        break;
      case 'ident': {
        if (params.includes(e.name)) break;
        const sym = scope.symbols.get(e.name);
        if (sym) {
          if (sym.kind === 'const') use(sym, e.range);
          else {
            sym.references.push(e.range);
            report(makeDiagnostic('function-as-value', e.range, { name: e.name }));
          }
        } else if (isBuiltinConstant(e.name)) {
          // fine
        } else if (isBuiltinFunction(e.name)) {
          report(makeDiagnostic('function-as-value', e.range, { name: e.name }));
        } else {
          report(unknownName('unknown-identifier', e.name, e.range, valueNames()));
        }
        break;
      }
      case 'call': {
        for (let k = e.args.length - 1; k >= 0; k--) stack.push(e.args[k]);
        const n = e.args.length;
        const arity = (min: number, max: number) => {
          if (n < min || n > max) {
            report(makeDiagnostic('wrong-arity', e.range, {
              name: e.callee, expected: arityText(min, max), count: n, were: n === 1 ? 'was' : 'were',
            }));
          }
        };
        if (params.includes(e.callee)) {
          report(makeDiagnostic('not-a-function', e.calleeRange, { name: e.callee, what: 'variable' }));
          break;
        }
        const sym = scope.symbols.get(e.callee);
        if (sym) {
          if (sym.kind === 'const') {
            sym.references.push(e.calleeRange);
            report(makeDiagnostic('not-a-function', e.calleeRange, { name: e.callee, what: describeSymbol(sym) }));
          } else {
            use(sym, e.calleeRange);
            const count = sym.kind === 'fn' ? sym.params.length : 2;
            arity(count, count);
          }
        } else if (isBuiltinFunction(e.callee)) {
          const b = builtinFunctions[e.callee];
          arity(b.minArgs, b.maxArgs);
        } else if (isBuiltinConstant(e.callee)) {
          report(makeDiagnostic('not-a-function', e.calleeRange, { name: e.callee, what: 'built-in constant' }));
        } else {
          report(unknownName('unknown-function', e.callee, e.calleeRange, functionNames()));
        }
        break;
      }
    }
  }
  return { ok, uses };
}
