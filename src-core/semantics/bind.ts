/**
 * Binding: from the syntax tree to the file model. Checks names, parameters, cycles, domains and declared
 * expectations; evaluates constants; resolves each kernel to IR with its domain and a hash of its definition.
 * Never throws for any tree the parser produces.
 */
import type { Expr, Interval, Name, SourceFile } from '../syntax/ast';
import type { Diagnostic } from '../diagnostics/types';
import { makeDiagnostic } from '../diagnostics/make';
import { cover } from '../syntax/textRange';
import { isBuiltinConstant } from './builtins';
import { evaluateClosed, formatComplex, formatNumber } from './values';
import { collectScope, describeSymbol, type DraftKernel, type DraftSymbol, type Scope } from './scope';
import { checkNames } from './resolveNames';
import { IrTooLargeError, lowerFunction, maxIrNodes } from './lower';
import { canonicalIr, hashText } from './hash';
import { findCycles } from './cycles';
import { bindExpectations } from './expectations';
import type { ComplexValue, FileModel, ResolvedDomain } from './model';

function checkParams(kind: 'fn' | 'kernel', name: Name, params: readonly Name[], scope: Scope, diagnostics: Diagnostic[]): boolean {
  let ok = true;
  const seen = new Set<string>();
  for (const p of params) {
    if (p.text === '') { ok = false; continue; }
    if (seen.has(p.text)) {
      diagnostics.push(makeDiagnostic('duplicate-parameter', p.range, { name: p.text }));
      ok = false;
    }
    seen.add(p.text);
    const other = scope.symbols.get(p.text);
    if (other) {
      diagnostics.push(makeDiagnostic('shadowed-name', p.range, { name: p.text, what: describeSymbol(other) }, {
        related: [{ range: other.nameRange, message: `the ${describeSymbol(other)} “${p.text}”` }],
      }));
    } else if (isBuiltinConstant(p.text)) {
      diagnostics.push(makeDiagnostic('shadowed-name', p.range, { name: p.text, what: 'built-in constant' }));
    }
  }
  if (kind === 'kernel' && params.length !== 2) {
    const r = params.length > 0 ? cover(params[0].range, params[params.length - 1].range) : name.range;
    diagnostics.push(makeDiagnostic('kernel-variable-count', r, {
      name: name.text, count: params.length, s: params.length === 1 ? '' : 's',
    }));
    ok = false;
  }
  return ok;
}

function bindInterval(
  interval: Interval, own: boolean, scope: Scope, text: string, diagnostics: Diagnostic[],
): ResolvedDomain | null {
  const ends: (number | null)[] = [];
  for (const [which, expr] of [['a', interval.lower], ['b', interval.upper]] as const) {
    const names = checkNames(expr, [], scope, diagnostics);
    if (!names.ok) { ends.push(null); continue; }
    const v = evaluateClosed(expr, scope, diagnostics);
    if (!v) { ends.push(null); continue; }
    if (v.im !== 0) {
      diagnostics.push(makeDiagnostic('not-real', expr.range, { what: `The domain end ${which}`, value: formatComplex(v) }));
      ends.push(null);
    } else if (!Number.isFinite(v.re)) {
      diagnostics.push(makeDiagnostic('domain-not-finite', expr.range, { which, value: formatNumber(v.re) }));
      ends.push(null);
    } else ends.push(v.re);
  }
  const [a, b] = ends;
  if (a === null || b === null) return null;
  const args = { a: formatNumber(a), b: formatNumber(b) };
  if (a === b) {
    diagnostics.push(makeDiagnostic('domain-empty', interval.range, args));
    return null;
  }
  if (a > b) {
    const slice = (e: Expr) => text.slice(e.range.start, e.range.end);
    diagnostics.push(makeDiagnostic('domain-reversed', interval.range, args, {
      fixes: [{
        kind: 'swap-domain',
        title: 'Swap the domain ends',
        preferred: true,
        edits: [
          { range: interval.lower.range, newText: slice(interval.upper) },
          { range: interval.upper.range, newText: slice(interval.lower) },
        ],
      }],
    }));
    return null;
  }
  return { a, b, range: interval.range, own };
}

export function bindFile(source: SourceFile): FileModel {
  const diagnostics: Diagnostic[] = [];
  const scope = collectScope(source.declarations, diagnostics);

  // 1. Parameters and names inside every body (duplicates included, so that their errors still show).
  const bodyOk = new Map<DraftSymbol, boolean>();
  const uses = new Map<DraftSymbol, DraftSymbol[]>();
  // A declaration with a syntax error inside it is not analysed further (its tree may be incomplete).
  const syntaxErrors = source.diagnostics.filter((d) => d.severity === 'error');
  const brokenBySyntax = (r: { start: number; end: number }) =>
    syntaxErrors.some((d) => d.range.start >= r.start && d.range.start <= r.end);
  for (const sym of scope.all) {
    let ok = !brokenBySyntax(sym.decl.range);
    let params: string[] = [];
    if (sym.kind !== 'const') {
      ok = checkParams(sym.kind, sym.decl.name, sym.decl.params, scope, diagnostics) && ok;
      params = sym.decl.params.map((p) => p.text);
    }
    const body = sym.kind === 'const' ? sym.decl.value : sym.decl.body;
    const r = checkNames(body, params, scope, diagnostics);
    bodyOk.set(sym, ok && r.ok && sym.name !== '');
    uses.set(sym, r.uses);
  }

  // 2. Cycles, then which definitions are sound (own body fine, everything used sound, not in a cycle).
  const inCycle = findCycles(scope.all, uses, diagnostics);
  const sound = new Map<DraftSymbol, boolean>();
  const isSound = (sym: DraftSymbol, depth = 0): boolean => {
    const known = sound.get(sym);
    if (known !== undefined) return known;
    if (inCycle.has(sym) || depth > 10_000) return false;
    sound.set(sym, false); // provisional, guards against revisits
    const ok = bodyOk.get(sym)! && uses.get(sym)!.every((u) => isSound(u, depth + 1));
    sound.set(sym, ok);
    return ok;
  };

  // 3. Constants, in dependency order (isSound recursion order is not evaluation order: evaluate on demand).
  const evaluating = new Set<DraftSymbol>();
  const evaluateConstant = (sym: DraftSymbol): void => {
    if (sym.kind !== 'const' || sym.value || evaluating.has(sym) || !isSound(sym)) return;
    evaluating.add(sym);
    for (const u of uses.get(sym)!) evaluateConstant(u);
    const v = evaluateClosed(sym.decl.value, scope, diagnostics);
    if (v && (!Number.isFinite(v.re) || !Number.isFinite(v.im))) {
      diagnostics.push(makeDiagnostic('constant-not-finite', sym.decl.value.range, { name: sym.name, value: formatComplex(v) }));
      sound.set(sym, false);
    } else if (v) {
      sym.value = v;
    } else sound.set(sym, false);
  };
  for (const sym of scope.all) if (scope.symbols.get(sym.name) === sym) evaluateConstant(sym);

  // 4. The default domain: the first `domain` line.
  let defaultDomain: ResolvedDomain | null = null;
  let firstDomain: Interval | null = null;
  for (const d of source.declarations) {
    if (d.kind !== 'domain') continue;
    if (firstDomain) {
      diagnostics.push(makeDiagnostic('duplicate-domain', d.range, {}, {
        related: [{ range: firstDomain.range, message: 'the default domain' }],
      }));
      continue;
    }
    firstDomain = d.interval;
    defaultDomain = bindInterval(d.interval, false, scope, source.text, diagnostics);
  }

  // 5. Kernels.
  const kernels: DraftKernel[] = [];
  for (const sym of scope.all) {
    if (sym.kind !== 'kernel') continue;
    kernels.push(sym);
    if (sym.decl.domain) sym.domain = bindInterval(sym.decl.domain, true, scope, source.text, diagnostics);
    else if (defaultDomain) sym.domain = defaultDomain;
    else if (!firstDomain && sym.name !== '') {
      diagnostics.push(makeDiagnostic('missing-domain', sym.nameRange, { name: sym.name }));
    }
    sym.expectations = bindExpectations(sym.decl, scope, diagnostics);
    if (isSound(sym)) {
      try {
        sym.ir = lowerFunction(sym.decl.body, sym.decl.params.map((p) => p.text), scope);
      } catch (err) {
        if (!(err instanceof IrTooLargeError)) throw err;
        diagnostics.push(makeDiagnostic('expression-too-complex', sym.decl.body.range, {
          what: 'has too many parts after expanding helper functions', limit: maxIrNodes,
        }));
      }
    }
    if (sym.ir && sym.domain) {
      sym.hash = hashText(`${sym.domain.a};${sym.domain.b};${canonicalIr(sym.ir.root)}`);
    }
  }

  // 6. Unused constants and helpers.
  for (const sym of scope.all) {
    if (sym.kind === 'kernel' || sym.name === '' || scope.symbols.get(sym.name) !== sym) continue;
    if (sym.references.length > 0) continue;
    diagnostics.push(makeDiagnostic(sym.kind === 'const' ? 'unused-constant' : 'unused-function', sym.nameRange,
      { name: sym.name }, { tags: ['unnecessary'] }));
  }

  return { symbols: scope.symbols, kernels, defaultDomain, diagnostics };
}
