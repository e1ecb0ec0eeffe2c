/**
 * The catalogue of every diagnostic Kernwright reports: a stable code, a slug, a default severity, a one-line title,
 * a help text (shown in SARIF rules and hovers) and a message template with `{placeholders}`.
 *
 * Codes are grouped: KW1xx syntax, KW2xx names and declarations, KW3xx evaluation faults, KW4xx numerical analysis,
 * KW5xx property checks, KW6xx declared expectations. Codes are never reused or renumbered.
 */
import type { Severity } from './types';

export interface CatalogueEntry {
  readonly code: string;
  readonly severity: Severity;
  readonly title: string;
  readonly help: string;
  readonly template: string;
}

function entry(code: string, severity: Severity, title: string, template: string, help: string): CatalogueEntry {
  return { code, severity, title, template, help };
}

export const catalogue = {
  // ---- KW1xx syntax ----
  'unexpected-character': entry('KW101', 'error', 'Unexpected character', 'Unexpected character “{char}”.{hint}',
    'The character cannot start any token of the kernel file format. Remove it or replace it with an operator the format knows (+ - * / ^, comparisons, and/or/not, ? :).'),
  'expected-token': entry('KW102', 'error', 'Something is missing here', 'Expected {expected}, found {found}.',
    'The parser expected a different token at this point. The declaration is skipped up to the end of its line; later lines are still checked.'),
  'unclosed-bracket': entry('KW103', 'error', 'Unclosed bracket', 'This “{open}” is never closed; expected “{close}” before {found}.',
    'Every opening parenthesis or bracket needs its closing partner on the same declaration (continuation lines included).'),
  'missing-operator': entry('KW104', 'error', 'Missing operator', 'Missing operator between “{left}” and “{right}”; multiplication is written with “*”.',
    'Kernel expressions need explicit operators: write 2*t, not 2t, and (t - s)*(t + s), not (t - s)(t + s).'),
  'form-not-allowed': entry('KW105', 'error', 'Expression form not allowed', '{form} is not allowed in a kernel expression.{hint}',
    'Kernel expressions are pure arithmetic: numbers, names, + - * / ^, comparisons, and/or/not, cond ? a : b and calls of the built-in or helper functions. Assignments, strings, arrays, indexing, property access, ranges, factorials and transposes are rejected so that a kernel file can never run code of its own.'),
  'unknown-declaration': entry('KW106', 'error', 'Unknown declaration', 'A line starts with “{word}”, which is not a declaration.{suggestion}',
    'Each declaration starts with a keyword: domain, const, fn, kernel or expect. Continuation lines are indented.'),
  'expression-too-complex': entry('KW107', 'error', 'Expression too complex', 'This expression {what}; the limit is {limit}.',
    'Very deep or very long expressions are refused to keep the editor responsive; split them into helper functions.'),
  'invalid-number': entry('KW108', 'error', 'Invalid number', '“{text}” is not a valid number.',
    'Numbers are written like 2, 0.5, .5, 3e-4 or 1.5E+2.'),
  'orphan-expect': entry('KW109', 'error', 'Expectation without a kernel', 'This “expect” clause does not follow a kernel declaration.',
    'Declared expectations belong to the kernel declared just above them.'),
  'stray-continuation': entry('KW110', 'error', 'Indented line without a declaration', 'This indented line continues no declaration.',
    'Indented lines continue the declaration above them; the first declaration of a file starts at column 1.'),
  'trailing-text': entry('KW111', 'error', 'Unexpected text after the declaration', 'Unexpected {found} after the end of the {what}.',
    'A declaration ends at the end of its line (or its indented continuation lines). Start a new declaration on a new line.'),

  // ---- KW2xx names and declarations ----
  'unknown-identifier': entry('KW201', 'error', 'Unknown name', 'Unknown name “{name}”.{suggestion}',
    'A name must be a variable of the enclosing kernel or helper, a constant declared with const, or one of the built-in constants pi, e and i.'),
  'unknown-function': entry('KW202', 'error', 'Unknown function', 'Unknown function “{name}”.{suggestion}',
    'Callable are the built-in functions (exp log sqrt abs sin cos tan sinh cosh tanh atan min max sign floor erf conj re im), helpers declared with fn and kernels (with two arguments).'),
  'wrong-arity': entry('KW203', 'error', 'Wrong number of arguments', '“{name}” takes {expected}, but {count} {were} given.',
    'Call a function with exactly the number of arguments it declares (min and max take two or more).'),
  'duplicate-name': entry('KW204', 'error', 'Duplicate name', '“{name}” is already declared as a {previous}.',
    'Constants, helper functions and kernels share one namespace; each name is declared once.'),
  'definition-cycle': entry('KW205', 'error', 'Definitions refer to each other in a cycle', '“{name}” depends on itself: {chain}.',
    'Constants, helper functions and kernels must not refer to themselves, directly or through others.'),
  'kernel-variable-count': entry('KW206', 'error', 'A kernel takes exactly two variables', 'Kernel “{name}” declares {count} variable{s}; a kernel K(t, s) takes exactly two.',
    'An integral kernel K(t, s) is a function of the output variable t and the integration variable s.'),
  'domain-empty': entry('KW207', 'error', 'Empty domain', 'The domain [{a}, {b}] is empty: both ends are equal.',
    'A domain [a, b] needs a < b.'),
  'domain-reversed': entry('KW208', 'error', 'Reversed domain', 'The domain [{a}, {b}] is reversed: its lower end is above its upper end.',
    'A domain [a, b] needs a < b; the quick fix swaps the ends.'),
  'domain-not-finite': entry('KW209', 'error', 'Domain end not finite', 'The domain end {which} evaluates to {value}; it must be a finite real number.',
    'Kernwright analyses operators on bounded intervals [a, b] with finite real ends.'),
  'constant-not-finite': entry('KW210', 'error', 'Constant not finite', 'Constant “{name}” evaluates to {value}.',
    'A constant must evaluate to a finite number (real or complex).'),
  'unused-constant': entry('KW211', 'hint', 'Unused constant', 'Constant “{name}” is never used.',
    'Remove the constant or use it in a kernel.'),
  'unused-function': entry('KW212', 'hint', 'Unused helper function', 'Helper function “{name}” is never used.',
    'Remove the helper or call it from a kernel.'),
  'unknown-expectation': entry('KW213', 'error', 'Unknown expectation', 'Unknown expectation “{name}”.{suggestion}',
    'Known claims: hermitian, positive, continuous, bounded, hilbert-schmidt, norm < x or norm <= x, rank = n or rank <= n, resolvent μ.'),
  'expectation-value': entry('KW214', 'error', 'Malformed expectation', '{problem}',
    'hermitian, positive, continuous, bounded and hilbert-schmidt take no value; norm takes < or <= and a positive number; rank takes = or <= and a whole number; resolvent takes a number (possibly complex).'),
  'duplicate-parameter': entry('KW215', 'error', 'Duplicate parameter', 'Parameter “{name}” appears twice.',
    'The variables of a kernel or helper must have distinct names.'),
  'shadowed-name': entry('KW216', 'warning', 'Parameter hides another name', 'Parameter “{name}” hides the {what} of the same name inside this definition.',
    'A parameter named like a constant, a helper, a kernel or a built-in (pi, e, i, exp, max, ...) hides it inside its definition, where the name means the parameter; rename the parameter.'),
  'missing-domain': entry('KW217', 'error', 'No domain', 'Kernel “{name}” has no domain: add “domain [a, b]” to the file or “on [a, b]” to the kernel.',
    'Every kernel is analysed on a bounded interval, from the file’s domain line or its own “on [a, b]”.'),
  'duplicate-domain': entry('KW218', 'warning', 'Second default domain', 'The file already has a default domain; this line is ignored.',
    'A file has one default domain, its first domain line; later domain lines are ignored. Give kernels that need another interval their own “on [a, b]”.'),
  'not-real': entry('KW219', 'error', 'Real value required', '{what} must be real, but is {value}.',
    'Domain ends, comparison operands and the arguments of min, max, floor, sign (on real kernels) and erf must be real.'),
  'not-a-function': entry('KW220', 'error', 'Not a function', '“{name}” is a {what}, not a function.',
    'Only built-in functions, helpers declared with fn and kernels can be called.'),
  'function-as-value': entry('KW221', 'error', 'Function used as a value', '“{name}” is a function; call it with arguments.',
    'Functions must be called, e.g. exp(t), not exp.'),
  'reserved-name': entry('KW222', 'error', 'Reserved name', '“{name}” is a reserved {what} and cannot be declared.',
    'Keywords (domain, const, fn, kernel, expect, on, and, or, not) and built-in names cannot be redeclared.'),

  // ---- KW3xx evaluation faults ----
  'non-finite-value': entry('KW301', 'warning', 'Value not finite', 'Kernel “{name}” evaluates to {value} at t = {t}, s = {s}.',
    'A kernel value is NaN or infinite at a sampled point. If the kernel is meant to be singular there, the boundedness check says whether the singularity is integrable.'),
  'real-domain-fault': entry('KW302', 'error', 'Real function outside its domain', '{fn}({arg}) is undefined for real numbers (at t = {t}, s = {s}).',
    'In a real kernel, sqrt and log need non-negative arguments and powers of negative bases need whole exponents. Use abs(...) or make the kernel complex deliberately.'),
  'complex-where-real': entry('KW303', 'error', 'Complex value where a real one is needed', '{what} received the complex value {value} (at t = {t}, s = {s}).',
    'Comparisons, min, max, floor and erf are defined for real arguments only.'),

  // ---- KW4xx numerical analysis ----
  'not-converged': entry('KW401', 'info', 'Target accuracy not reached', 'The spectrum of “{name}” reached a relative accuracy of {reached} (target {target}) within its budget of {budget} ms of work.',
    'The engine refines its discretisation until the leading eigenvalues agree to the target accuracy or the budget per kernel is spent (counted in work, so the result is the same on every machine). Every figure still carries its own error estimate; raise the time budget or the resolution cap for more digits.'),
  'spectrum-unavailable': entry('KW402', 'warning', 'No spectrum', 'No spectrum for “{name}”: {reason}.',
    'The operator could not be analysed numerically; the message says why. Eigenvalues and the norm are reported as null.'),
  'methods-disagree': entry('KW403', 'warning', 'Two methods disagree', 'For “{name}”, the degenerate-kernel method gives λ{index} = {exact} but the Galerkin discretisation gives {galerkin} (difference {difference}, above the combined error estimate {error}).',
    'A separable kernel is solved twice, exactly through the small matrix of inner products and by discretisation; a disagreement beyond their error estimates points to a kernel the analysis does not handle well. Please report it with the kernel.'),

  'jump-lines-capped': entry('KW404', 'info', 'Too many jump lines to follow', 'This floor(…) jumps along {lines} lines inside the square, more than the {cap} the discretisation follows one by one; the rest are refined across uniformly, so the figures of “{name}” converge slowly (their errors say how far).',
    'The spectral engine puts a panel boundary on every line where the kernel jumps, up to a fixed number per floor(…), so that the work does not depend on the values in the file. Beyond it, the discretisation refines uniformly, which converges slowly across jumps; every figure still carries its own error estimate.'),
  'loci-capped': entry('KW405', 'info', 'Too many kinks and jumps to follow', 'Kernel “{name}” has {loci} lines where it jumps, kinks or is singular, more than a discretisation within the resolution cap of {maxResolution} can follow; {followed} are followed and the rest refined across uniformly, so the figures converge slowly (their errors say how far).',
    'Every locus the engine follows becomes a panel boundary, and each panel needs a few basis functions. When the loci need more than the resolution cap allows, only the singular lines are followed; every figure still carries its own error estimate.'),
  'analysis-stopped': entry('KW406', 'warning', 'Analysis stopped', 'The analysis of “{name}” was stopped after {seconds} s, far beyond its budget of {budget} ms of work; its spectrum and properties are not known.',
    'A safety net stops the analysis of a kernel that runs far past its budget (something the engine’s own limits did not catch), so that the other kernels and files still get their answers. The kernel is skipped until its definition changes. Please report it with the kernel.'),
  'analysis-out-of-memory': entry('KW407', 'warning', 'Analysis ran out of memory', 'The analysis of “{name}” needed more than the analysis memory limit of {limitMb} MB and was stopped; its spectrum and properties are not known.',
    'The analysis runs with a fixed memory limit, so that one kernel cannot exhaust the machine. The kernel is skipped until its definition changes. Please report it with the kernel.'),

  // ---- KW5xx property checks (findings about a kernel that no claim covers; severities are settings) ----
  'not-hermitian': entry('KW501', 'info', 'Not Hermitian', 'Kernel “{name}” is not {what}: ‖K − K*‖/‖K‖ = {defect}; the largest difference is at t = {t}, s = {s}, where K(t, s) = {value} but {mirror} = {mirrored}.',
    'T is self-adjoint exactly when K(t, s) = conj K(s, t) (for a real kernel: K(t, s) = K(s, t)). The defect is measured on a grid of Gauss points and on the Galerkin matrix. Many models (covariances, Green’s functions of symmetric problems) need a self-adjoint operator; the quick fix replaces the kernel by its Hermitian part (K(t, s) + conj K(s, t)) / 2.'),
  'unbounded': entry('KW510', 'warning', 'Operator not bounded', 'Kernel “{name}” does not define a bounded operator on L²[{a}, {b}]: {reason}. No eigenvalues or norm are reported.',
    'Along a line, |K| ~ d^(−α) is integrable for α < 1 (then Schur’s test bounds the operator) and square-integrable for α < 1/2; at a corner point of the square, α < 1 gives a Hilbert–Schmidt kernel and α > 1 an unbounded operator. A kernel that is infinite or undefined on a set of positive area is not bounded either.'),
  'not-hilbert-schmidt': entry('KW511', 'info', 'Bounded but not Hilbert–Schmidt', 'Kernel “{name}” is bounded but not Hilbert–Schmidt: |K| grows like d^(−{exponent}) toward {where}, so ∫∫|K|² diverges while ∫|K| stays finite.',
    'The operator is bounded (Schur’s test), but the Hilbert–Schmidt norm is infinite; eigenvalue errors of such kernels decrease slowly with the discretisation.'),
  'weakly-singular': entry('KW512', 'info', 'Weakly singular kernel', 'Kernel “{name}” is weakly singular: {growth} toward {where}; the singularity is square-integrable, so the operator is Hilbert–Schmidt.',
    'The kernel is infinite on a line or at a point, but mildly enough that ∫∫|K|² is finite. Point values on the singular set are not part of the operator.'),
  'jump': entry('KW520', 'info', 'Kernel jumps', 'Kernel “{name}” jumps across {where} by up to {jump} (measured at {points} points); it is not continuous, which Mercer’s theorem needs.',
    'The jump is measured numerically on both sides of the curve at several points. A discontinuous kernel can still define a fine operator, but Mercer’s expansion and trace identity need continuity.'),
  'kink': entry('KW521', 'info', 'Kink in the kernel', 'Kernel “{name}” has a kink along {where}: its first derivative jumps there (by up to {slope}); plain quadrature converges slowly across it.',
    'The kernel is continuous but not smooth across this curve. The spectral engine splits its panels along straight kinks, so this is information, not a problem.'),
  'covariance-not-positive': entry('KW530', 'warning', 'Looks like a covariance but is not positive', 'Kernel “{name}” looks like a covariance (real, non-negative, largest on the diagonal) but is not positive semidefinite: {evidence}.',
    'A covariance must be positive semidefinite: every eigenvalue ≥ 0. A kernel that has the shape of one but a negative eigenvalue gives negative variances for some combinations (common with truncated or box-shaped kernels). Declare “positive” to make this an error, or set the severity of this finding.'),
  'not-positive': entry('KW531', 'info', 'Not positive semidefinite', 'Kernel “{name}” is not positive semidefinite: {evidence}.',
    'A Hermitian kernel with a negative eigenvalue. That is fine for many operators (Green’s functions of indefinite problems, connectivity kernels); it rules out using the kernel as a covariance.'),
  'mercer-mismatch': entry('KW532', 'info', 'Mercer’s trace identity not confirmed', 'For “{name}”, ∫K(t, t) dt = {trace} but the {count} computed eigenvalues add up to {sum}; Mercer’s identity is not confirmed to this accuracy.',
    'For a continuous positive kernel the trace equals the sum of all eigenvalues (Mercer). A mismatch beyond the error estimates means the discretisation has not resolved enough of the spectrum.'),
  'resolvent-figures': entry('KW540', 'info', 'Resolvent figures', '{summary}',
    'For a declared “resolvent μ”: the distance from μ to the computed spectrum (0 included, which is in the spectrum of every compact operator), the resolvent norm ‖(μ − T)⁻¹‖ for a Hermitian operator, and whether the Neumann series of (μ − T)⁻¹ converges (|μ| above the spectral radius).'),

  // ---- KW6xx declared expectations (claims written with `expect`) ----
  'hermitian-claim-failed': entry('KW601', 'error', 'Claimed Hermitian, but it is not', 'Claimed “hermitian”, but “{name}” is not: ‖K − K*‖/‖K‖ = {defect}; at t = {t}, s = {s}, K(t, s) = {value} but {mirror} = {mirrored}.',
    'The claim K(t, s) = conj K(s, t) fails by more than the tolerance. The quick fix replaces the kernel by its Hermitian part, or remove the claim.'),
  'positive-claim-failed': entry('KW602', 'error', 'Claimed positive, but it is not', 'Claimed “positive”, but “{name}” is not positive semidefinite: {evidence}.',
    'A positive semidefinite operator has no negative eigenvalue and is self-adjoint. The most negative eigenvalue and, where one exists, a point where the kernel itself proves it (K(t, t) < 0 or |K(t, s)|² > K(t, t)K(s, s)) are shown.'),
  'continuous-claim-failed': entry('KW603', 'error', 'Claimed continuous, but it is not', 'Claimed “continuous”, but “{name}” {evidence}.',
    'Continuity on the closed square is what Mercer’s theorem assumes; a jump or a singularity breaks it.'),
  'bounded-claim-failed': entry('KW604', 'error', 'Claimed bounded, but it is not', 'Claimed “bounded”, but “{name}” is not bounded on L²: {evidence}.',
    'A non-integrable singularity (|K| ~ d^(−α) with α ≥ 1 along a line) or values that are infinite on a set that matters make the operator unbounded.'),
  'hilbert-schmidt-claim-failed': entry('KW605', 'error', 'Claimed Hilbert–Schmidt, but it is not', 'Claimed “hilbert-schmidt”, but ∫∫|K|² diverges for “{name}”: {evidence}.',
    'A Hilbert–Schmidt kernel has ∫∫|K|² < ∞; a singularity |K| ~ d^(−α) along a line with α ≥ 1/2 breaks it.'),
  'norm-claim-failed': entry('KW606', 'error', 'Norm bound fails', 'Claimed “norm {op} {bound}”, but ‖T‖ = {norm} for “{name}”.',
    'The operator norm is computed with its error estimate; the claim fails only when the whole error interval lies on the wrong side of the bound.'),
  'rank-claim-failed': entry('KW607', 'error', 'Rank claim fails', 'Claimed “rank {op} {claimed}”, but “{name}” has {evidence}.',
    'The rank is the number of nonzero singular values of the operator (for a Hermitian one, the number of nonzero eigenvalues); it is read from the singular values of the Galerkin matrix, which drop to the noise level after the last nonzero one.'),
  'resolvent-claim-failed': entry('KW608', 'error', 'μ is in the spectrum', 'Claimed “resolvent {mu}”, but {evidence}.',
    'μ is in the resolvent set when μI − T has a bounded inverse. For a compact operator on an infinite-dimensional space, 0 is always in the spectrum.'),
  'claim-undecided': entry('KW609', 'warning', 'Claim cannot be decided', 'Cannot confirm “{claim}” for “{name}”: {reason}.',
    'The claim lies within the error of the computed figures, or a figure it needs is not available. Raise the time budget, or state the claim with some margin.'),
  'undeclared-property': entry('KW610', 'hint', 'Property holds but is not declared', 'Kernel “{name}” also satisfies {list}; declaring {it} documents the property and keeps it checked.',
    'Declared claims are checked on every edit, so a later change that breaks them is caught. The quick fix appends the claims to the kernel’s expect clause.'),
} as const satisfies Record<string, CatalogueEntry>;

export type DiagnosticName = keyof typeof catalogue;

/** Fills `{placeholders}` of a template; unknown placeholders are left as written. */
export function formatMessage(template: string, args: Readonly<Record<string, string | number>>): string {
  return template.replace(/\{(\w+)\}/g, (whole, key: string) => (key in args ? String(args[key]) : whole));
}

export function entryByCode(code: string): CatalogueEntry | undefined {
  return (Object.values(catalogue) as CatalogueEntry[]).find((e) => e.code === code);
}

export function nameByCode(code: string): DiagnosticName | undefined {
  return (Object.keys(catalogue) as DiagnosticName[]).find((k) => catalogue[k].code === code);
}
