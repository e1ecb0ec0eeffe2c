/**
 * Declared expectations (`expect hermitian, norm <= 2, ...`): checks each claim's name and the form of its value.
 * Whether a claim actually holds is decided by the property checks later; here only its shape is validated.
 */
import type { ExpectationName, KernelDecl } from '../syntax/ast';
import type { Diagnostic } from '../diagnostics/types';
import { makeDiagnostic } from '../diagnostics/make';
import { suggest } from '../util/suggest';
import { checkNames } from './resolveNames';
import type { DraftSymbol, Scope } from './scope';
import type { ResolvedExpectation } from './model';
import { evaluateClosed, formatComplex } from './values';

export interface ExpectationInfo {
  readonly name: ExpectationName;
  /** 'flag' takes nothing; 'bound' takes < or <= and a positive number; 'count' takes = or <= and a whole number; 'point' a number. */
  readonly form: 'flag' | 'bound' | 'count' | 'point';
  readonly description: string;
}

export const expectationInfo: Readonly<Record<ExpectationName, ExpectationInfo>> = {
  hermitian: { name: 'hermitian', form: 'flag', description: 'K(t, s) = conj K(s, t): the operator is self-adjoint, its spectrum real.' },
  positive: { name: 'positive', form: 'flag', description: 'Positive semidefinite: ∫∫ conj f(t) K(t, s) f(s) ≥ 0 for every f, so no eigenvalue is negative (a valid covariance).' },
  continuous: { name: 'continuous', form: 'flag', description: 'K is continuous on the closed square [a, b]² (no jumps, no singularities), as Mercer’s theorem assumes.' },
  bounded: { name: 'bounded', form: 'flag', description: 'The operator is bounded on L²[a, b] (integrable singularities allowed).' },
  'hilbert-schmidt': { name: 'hilbert-schmidt', form: 'flag', description: '∫∫ |K|² is finite: the operator is Hilbert–Schmidt, hence compact.' },
  norm: { name: 'norm', form: 'bound', description: 'The operator norm ‖T‖ is below the given bound (norm < x) or at most it (norm <= x).' },
  rank: { name: 'rank', form: 'count', description: 'The range of the operator has dimension exactly n (rank = n) or at most n (rank <= n): a separable kernel with that many independent terms (for a Hermitian kernel, the number of nonzero eigenvalues).' },
  resolvent: { name: 'resolvent', form: 'point', description: 'μ lies in the resolvent set: μI − T is invertible, so μu − Tu = f has exactly one solution for every f.' },
};

export function isExpectationName(name: string): name is ExpectationName {
  return Object.prototype.hasOwnProperty.call(expectationInfo, name);
}

/** Checks the claims of one kernel; `isSound` says which definitions a claim's value may use (see bind.ts). */
export function bindExpectations(
  decl: KernelDecl, scope: Scope, isSound: (sym: DraftSymbol) => boolean, diagnostics: Diagnostic[],
): ResolvedExpectation[] {
  const out: ResolvedExpectation[] = [];
  for (const clause of decl.expects) {
    for (const item of clause.items) {
      if (item.name === '') continue;
      if (!isExpectationName(item.name)) {
        const s = suggest(item.name, Object.keys(expectationInfo));
        diagnostics.push(makeDiagnostic('unknown-expectation', item.nameRange, {
          name: item.name, suggestion: s ? ` Did you mean “${s}”?` : '',
        }, s ? { fixes: [{ kind: 'did-you-mean', title: `Change to “${s}”`, edits: [{ range: item.nameRange, newText: s }], preferred: true }] } : {}));
        continue;
      }
      const info = expectationInfo[item.name];
      const problem = (text: string) => diagnostics.push(makeDiagnostic('expectation-value', item.range, { problem: text }));
      if (info.form === 'flag') {
        if (item.op || item.value) problem(`“${item.name}” takes no value.`);
        else out.push({ name: item.name, item });
        continue;
      }
      const opOk = info.form === 'bound' ? item.op === '<' || item.op === '<='
        : info.form === 'count' ? item.op === '=' || item.op === '<='
          : item.op === undefined || item.op === '=';
      if (!opOk || !item.value) {
        const example = info.form === 'bound' ? 'norm <= 2' : info.form === 'count' ? 'rank = 3' : 'resolvent 0.5';
        problem(`“${item.name}” needs ${info.form === 'point' ? 'a value' : 'a comparison and a value'}: write e.g. “${example}”.`);
        continue;
      }
      const names = checkNames(item.value, [], scope, diagnostics);
      // A broken definition used here has its own error: no second one for the claim.
      if (!names.ok || !names.uses.every(isSound)) continue;
      const v = evaluateClosed(item.value, scope, diagnostics);
      if (!v) continue;
      if (!Number.isFinite(v.re) || !Number.isFinite(v.im)) {
        problem(`The value of “${item.name}” is ${formatComplex(v)}; it must be finite.`);
        continue;
      }
      if (info.form === 'bound' && (v.im !== 0 || v.re <= 0)) {
        problem(`A norm bound must be a positive real number, not ${formatComplex(v)}.`);
        continue;
      }
      if (info.form === 'count' && (v.im !== 0 || v.re < 0 || !Number.isInteger(v.re))) {
        problem(`A rank must be a whole number ≥ 0, not ${formatComplex(v)}.`);
        continue;
      }
      out.push({ name: item.name, item, op: item.op, value: v });
    }
  }
  return out;
}
