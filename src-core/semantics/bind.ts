/**
 * Binding: from the syntax tree to the file model. Checks names, parameters, cycles, domains and declared
 * expectations; evaluates constants; resolves each kernel to IR with its domain and a hash of its definition.
 * Never throws for any tree the parser produces.
 */
import type { Expr, Interval, Name, SourceFile } from '../syntax/ast';
import type { Diagnostic } from '../diagnostics/types';
import { makeDiagnostic } from '../diagnostics/make';
import { cover } from '../syntax/textRange';
import { isBuiltinConstant, isBuiltinFunction } from './builtins';
import { evaluateClosed, formatComplex, formatNumber } from './values';
import { collectScope, describeSymbol, type DraftKernel, type DraftSymbol, type Scope } from './scope';
import { checkNames } from './resolveNames';
import { expandedSize, IrTooLargeError, lowerFunction, maxIrNodes } from './lower';
import { canonicalIr, hashText } from './hash';
import { findCycles } from './cycles';
import { bindExpectations } from './expectations';
import type { ConstantSymbol, FileModel, ResolvedDomain } from './model';

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
    } else if (isBuiltinConstant(p.text) || isBuiltinFunction(p.text)) {
      // Inside the definition the name is the variable: `exp(x)` there is an error, `pi` is the argument.
      const what = isBuiltinConstant(p.text) ? 'built-in constant' : 'built-in function';
      diagnostics.push(makeDiagnostic('shadowed-name', p.range, { name: p.text, what }));
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

/**
 * Decides which definitions are sound (own body fine, not in a cycle, everything used sound, not too large once
 * helpers are expanded) and evaluates the sound constants, in one depth-first pass that finishes every definition
 * after the ones it uses. So a constant is evaluated only when everything it reaches (constants behind helpers
 * included) already has its value; a definition that fails (a value that is not finite, an expansion that is too
 * large) is reported once and makes everything that uses it unsound without a second error; and a long chain of
 * definitions cannot exhaust the call stack. Only the declaration that owns a name can be sound: duplicates and
 * reserved names are reported and not analysed further.
 */
function settleDefinitions(
  scope: Scope,
  uses: ReadonlyMap<DraftSymbol, readonly DraftSymbol[]>,
  bodyOk: ReadonlyMap<DraftSymbol, boolean>,
  inCycle: ReadonlySet<DraftSymbol>,
  diagnostics: Diagnostic[],
): Map<DraftSymbol, boolean> {
  const sound = new Map<DraftSymbol, boolean>();
  const active = new Set<DraftSymbol>();
  // Expanded size of each sound definition's body (see expandedSize); a call adds its callee's body and parameters.
  const sizes = new Map<DraftSymbol, number>();
  const calleeSize = (name: string): number => {
    const callee = scope.symbols.get(name);
    if (!callee || callee.kind === 'const') return 0;
    return (sizes.get(callee) ?? 0) + callee.decl.params.length;
  };
  const open = (sym: DraftSymbol) => {
    active.add(sym);
    const ok = bodyOk.get(sym) === true && !inCycle.has(sym) && scope.symbols.get(sym.name) === sym;
    return { sym, next: 0, ok };
  };
  for (const root of scope.all) {
    if (sound.has(root)) continue;
    const stack = [open(root)];
    while (stack.length > 0) {
      const top = stack[stack.length - 1];
      const deps = uses.get(top.sym) ?? [];
      if (top.next < deps.length) {
        const dep = deps[top.next++];
        const known = sound.get(dep);
        if (known !== undefined) top.ok &&= known;
        else if (active.has(dep)) top.ok = false; // a way back to a definition still open: a cycle
        else stack.push(open(dep));
        continue;
      }
      stack.pop();
      active.delete(top.sym);
      let ok = top.ok;
      if (ok) {
        // Everything used is sound and measured: refuse an expansion that is too large here, where it first is.
        const body = top.sym.kind === 'const' ? top.sym.decl.value : top.sym.decl.body;
        const size = expandedSize(body, calleeSize);
        if (size > maxIrNodes) {
          diagnostics.push(makeDiagnostic('expression-too-complex', body.range, {
            what: 'has too many parts after expanding helper functions', limit: maxIrNodes,
          }));
          ok = false;
        } else sizes.set(top.sym, size);
      }
      ok &&= top.sym.kind !== 'const' || evaluateConstant(top.sym, scope, diagnostics);
      sound.set(top.sym, ok);
      if (stack.length > 0) stack[stack.length - 1].ok &&= ok;
    }
  }
  return sound;
}

/** Evaluates a constant whose dependencies all have values; false (with a diagnostic) when it has none. */
function evaluateConstant(sym: ConstantSymbol, scope: Scope, diagnostics: Diagnostic[]): boolean {
  const v = evaluateClosed(sym.decl.value, scope, diagnostics);
  if (!v) return false;
  if (!Number.isFinite(v.re) || !Number.isFinite(v.im)) {
    diagnostics.push(makeDiagnostic('constant-not-finite', sym.decl.value.range, { name: sym.name, value: formatComplex(v) }));
    return false;
  }
  sym.value = v;
  return true;
}

function bindInterval(
  interval: Interval, own: boolean, scope: Scope, isSound: (sym: DraftSymbol) => boolean, text: string,
  diagnostics: Diagnostic[],
): ResolvedDomain | null {
  const ends: (number | null)[] = [];
  for (const [which, expr] of [['a', interval.lower], ['b', interval.upper]] as const) {
    const names = checkNames(expr, [], scope, diagnostics);
    // A broken definition used here has its own error; the domain is then simply unknown.
    if (!names.ok || !names.uses.every(isSound)) { ends.push(null); continue; }
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

  // 2. Cycles, then which definitions are sound, and the values of the sound constants.
  const inCycle = findCycles(scope.all, uses, diagnostics);
  const sound = settleDefinitions(scope, uses, bodyOk, inCycle, diagnostics);
  const isSound = (sym: DraftSymbol): boolean => sound.get(sym) === true;

  // 3. The default domain: the first `domain` line.
  let defaultDomain: ResolvedDomain | null = null;
  let firstDomain: Interval | null = null;
  for (const d of source.declarations) {
    if (d.kind !== 'domain') continue;
    if (firstDomain) {
      diagnostics.push(makeDiagnostic('duplicate-domain', d.range, {}, {
        related: [{ range: firstDomain.range, message: 'the default domain' }],
      }));
      // Ignored, but its names are still checked (and the constants it mentions count as used).
      checkNames(d.interval.lower, [], scope, diagnostics);
      checkNames(d.interval.upper, [], scope, diagnostics);
      continue;
    }
    firstDomain = d.interval;
    defaultDomain = bindInterval(d.interval, false, scope, isSound, source.text, diagnostics);
  }

  // 4. Kernels.
  const kernels: DraftKernel[] = [];
  for (const sym of scope.all) {
    if (sym.kind !== 'kernel') continue;
    kernels.push(sym);
    if (sym.decl.domain) sym.domain = bindInterval(sym.decl.domain, true, scope, isSound, source.text, diagnostics);
    else if (defaultDomain) sym.domain = defaultDomain;
    else if (!firstDomain && sym.name !== '') {
      diagnostics.push(makeDiagnostic('missing-domain', sym.nameRange, { name: sym.name }));
    }
    sym.expectations = bindExpectations(sym.decl, scope, isSound, diagnostics);
    if (isSound(sym)) {
      try {
        sym.ir = lowerFunction(sym.decl.body, sym.decl.params.map((p) => p.text), scope);
      } catch (err) {
        // Sizes were counted in step 2, so this is only a safety net should lowering and counting ever disagree.
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

  // 5. Unused constants and helpers.
  for (const sym of scope.all) {
    if (sym.kind === 'kernel' || sym.name === '' || scope.symbols.get(sym.name) !== sym) continue;
    if (sym.references.length > 0) continue;
    diagnostics.push(makeDiagnostic(sym.kind === 'const' ? 'unused-constant' : 'unused-function', sym.nameRange,
      { name: sym.name }, { tags: ['unnecessary'] }));
  }

  return { symbols: scope.symbols, kernels, defaultDomain, diagnostics };
}
