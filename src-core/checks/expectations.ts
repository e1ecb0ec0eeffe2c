/**
 * Declared expectations against the measured properties, and the findings no claim covers.
 *
 *  - Each declared claim gets a verdict from the check that owns the property. A failed claim is an error on the
 *    claim's own range with the figures (KW601–KW608); a claim the computation cannot decide (within the error, or
 *    a figure missing) is a warning there (KW609); a `resolvent μ` that holds shows its figures (KW540, info).
 *  - A finding (not Hermitian, not bounded, not positive, a jump, a kink, …) goes on the kernel's name with the
 *    severity from the settings, unless a declared claim says the same thing: then the claim's verdict replaces it.
 *  - Properties that hold but are not declared are named in one hint on the kernel's name (KW610), with fixes that
 *    append the claims. Claims implied by declared or suggested ones are left out (continuous ⇒ Hilbert–Schmidt ⇒
 *    bounded on the bounded square; positive ⇒ Hermitian).
 */
import type { Diagnostic, Fix, Severity } from '../diagnostics/types';
import { catalogue, type DiagnosticName } from '../diagnostics/catalogue';
import { makeDiagnostic } from '../diagnostics/make';
import type { ExpectationName } from '../syntax/ast';
import type { KernelSymbol, ResolvedExpectation } from '../semantics/model';
import type { ResolventReport } from '../analysis/types';
import { declareClaimsFix } from '../fixes/declareProperty';
import { symmetrizeFix } from '../fixes/symmetrize';
import type { ClaimVerdict, CheckContext, Finding } from './types';
import { boundedClaim, boundednessFindings, hilbertSchmidtClaim, type BoundednessFacts } from './boundedness';
import { continuityFindings, continuousClaim, type ContinuityFacts } from './continuity';
import { hermitianClaim, symmetryFindings, type SymmetryFacts } from './symmetry';
import { positiveClaim, positivityFindings, type PositivityFacts } from './positivity';
import { normClaim } from './norm';
import { rankClaim, type RankFacts } from './rank';
import { measureResolvent, resolventClaim } from './resolvent';
import { fmtComplex } from './sampling';

export interface KernelFacts {
  readonly symmetry: SymmetryFacts;
  readonly boundedness: BoundednessFacts;
  readonly continuity: ContinuityFacts;
  readonly positivity: PositivityFacts;
  /** Computed on first use (singular values of the Galerkin matrix). */
  readonly rank: () => RankFacts | null;
  /** True when the expression is a sum of separable terms (so a finite rank is worth suggesting). */
  readonly separable: boolean;
}

export interface Judgement {
  readonly diagnostics: Diagnostic[];
  readonly resolvent: ResolventReport[];
}

/** Claims that are never failed silently: their severity is not a setting. */
const claimFailures = new Set<DiagnosticName>([
  'hermitian-claim-failed', 'positive-claim-failed', 'continuous-claim-failed', 'bounded-claim-failed',
  'hilbert-schmidt-claim-failed', 'norm-claim-failed', 'rank-claim-failed', 'resolvent-claim-failed',
]);

function severityOf(ctx: CheckContext, name: DiagnosticName): Severity | 'off' {
  if (claimFailures.has(name)) return catalogue[name].severity;
  const s = ctx.options.severities;
  return s[name] ?? s[catalogue[name].code] ?? catalogue[name].severity;
}

export function judge(ctx: CheckContext, k: KernelSymbol, facts: KernelFacts, text: string): Judgement {
  const diagnostics: Diagnostic[] = [];
  const resolvent: ResolventReport[] = [];
  let fix: Fix | null | undefined;
  const symmetrize = () => (fix === undefined ? (fix = symmetrizeFix(k, text)) : fix);
  const emit = (name: DiagnosticName, range: { start: number; end: number }, args: Readonly<Record<string, string | number>>,
    extras: { figures?: Finding['figures']; fixes?: readonly Fix[] } = {}) => {
    const severity = severityOf(ctx, name);
    if (severity === 'off') return;
    diagnostics.push(makeDiagnostic(name, range, args, { severity, ...extras }));
  };

  // 1. Declared claims.
  const declared = new Set<ExpectationName>();
  for (const claim of k.expectations) {
    declared.add(claim.name);
    const claimText = text.slice(claim.item.range.start, claim.item.range.end).replace(/\s+/g, ' ') || claim.name;
    let verdict: ClaimVerdict;
    if (claim.name === 'resolvent') {
      const mu = claim.value ?? { re: 0, im: 0 };
      const r = measureResolvent(ctx, mu, facts.symmetry.report.holds, facts.boundedness);
      resolvent.push(r.report);
      verdict = resolventClaim(ctx, r, fmtComplex(mu.re, mu.im, 8));
      if (verdict.outcome === 'holds') emit('resolvent-figures', claim.item.range, { summary: r.summary }, { figures: resolventFigures(r.report) });
    } else {
      verdict = verdictOf(ctx, claim, facts, symmetrize);
    }
    if (verdict.outcome === 'fails') {
      emit(verdict.diagnostic, claim.item.range, verdict.args, { figures: verdict.figures, fixes: verdict.fixes });
    } else if (verdict.outcome === 'undecided') {
      emit('claim-undecided', claim.item.range, { claim: claimText, name: k.name, reason: verdict.reason });
    }
  }

  // 2. Findings that no declared claim covers.
  const hermitian = facts.symmetry.report.holds;
  const findings: Finding[] = [
    ...symmetryFindings(ctx, facts.symmetry, hermitian ? null : symmetrize()),
    ...boundednessFindings(ctx, facts.boundedness),
    ...continuityFindings(ctx, facts.continuity),
    ...positivityFindings(ctx, facts.positivity, hermitian),
  ];
  for (const f of findings) {
    if (f.covers.some((c) => declared.has(c))) continue;
    emit(f.name, k.nameRange, f.args, { figures: f.figures, fixes: f.fixes });
  }

  // 3. Properties that hold but are not declared (not worth a hint while the operator is not even bounded).
  const suggested = facts.boundedness.report.class === 'unbounded' ? [] : undeclared(facts, declared);
  if (suggested.length > 0) {
    const fixes = [declareClaimsFix(k.decl, text, suggested, true)];
    if (suggested.length > 1) for (const c of suggested) fixes.push(declareClaimsFix(k.decl, text, [c], false));
    const list = suggested.map((c) => `“${c}”`);
    emit('undeclared-property', k.nameRange, {
      name: k.name,
      list: list.length === 1 ? list[0] : `${list.slice(0, -1).join(', ')} and ${list[list.length - 1]}`,
      it: list.length === 1 ? 'it' : 'them',
    }, { fixes });
  }
  return { diagnostics, resolvent };
}

function verdictOf(ctx: CheckContext, claim: ResolvedExpectation, facts: KernelFacts, symmetrize: () => Fix | null): ClaimVerdict {
  switch (claim.name) {
    case 'hermitian': return hermitianClaim(ctx, facts.symmetry, facts.symmetry.report.holds ? null : symmetrize());
    case 'positive': return positiveClaim(ctx, facts.positivity);
    case 'continuous': return continuousClaim(ctx, facts.continuity);
    case 'bounded': return boundedClaim(ctx, facts.boundedness);
    case 'hilbert-schmidt': return hilbertSchmidtClaim(ctx, facts.boundedness);
    case 'norm': return normClaim(ctx, facts.boundedness, claim.op ?? '<=', claim.value?.re ?? NaN);
    case 'rank': return rankClaim(ctx, facts.rank(), claim.op === '<=' ? '<=' : '=', claim.value?.re ?? NaN);
    case 'resolvent': return { outcome: 'holds' };
  }
}

function resolventFigures(r: ResolventReport): Record<string, number | boolean | null> {
  return {
    muRe: r.mu.re, muIm: r.mu.im, distance: r.distance?.value ?? null, distanceError: r.distance?.error ?? null,
    resolventNorm: r.resolventNorm?.value ?? null, neumannConverges: r.neumannConverges,
  };
}

/** Claims that hold and are neither declared nor implied by a declared or another suggested claim. */
function undeclared(facts: KernelFacts, declared: ReadonlySet<ExpectationName>): string[] {
  const holding: ExpectationName[] = [];
  if (facts.symmetry.report.holds) holding.push('hermitian');
  if (facts.positivity.report.holds === true) holding.push('positive');
  if (facts.continuity.report.class === 'continuous' && facts.boundedness.report.class !== 'unbounded') holding.push('continuous');
  // Only what is decided is suggested: an exponent whose error interval straddles a threshold leaves the class open.
  const open = facts.boundedness.undecided;
  if (facts.boundedness.report.class === 'hilbert-schmidt' && !open.hilbertSchmidt) holding.push('hilbert-schmidt');
  if (facts.boundedness.report.class !== 'unbounded' && !open.bounded) holding.push('bounded');
  const present = new Set<ExpectationName>([...declared, ...holding.filter((c) => !declared.has(c))]);
  const implied = (c: ExpectationName) =>
    (c === 'hermitian' && present.has('positive'))
    || (c === 'hilbert-schmidt' && present.has('continuous'))
    || (c === 'bounded' && (present.has('hilbert-schmidt') || present.has('continuous')));
  const out: string[] = holding.filter((c) => !declared.has(c) && !implied(c) && !impliedByDeclared(c, declared));
  if (!declared.has('rank') && facts.separable) {
    const r = facts.rank();
    if (r && r.exact !== null && r.exact > 0) out.push(`rank = ${r.exact}`);
  }
  return out;
}

function impliedByDeclared(c: ExpectationName, declared: ReadonlySet<ExpectationName>): boolean {
  return (c === 'hermitian' && declared.has('positive'))
    || (c === 'hilbert-schmidt' && declared.has('continuous'))
    || (c === 'bounded' && (declared.has('hilbert-schmidt') || declared.has('continuous')));
}
