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
    'Callable are the built-in functions (exp log sqrt abs sin cos tan sinh cosh tanh atan min max sign floor erf conj re im) and helpers declared with fn.'),
  'wrong-arity': entry('KW203', 'error', 'Wrong number of arguments', '“{name}” takes {expected}, but {count} {were} given.',
    'Call a function with exactly the number of arguments it declares (min and max take two or more).'),
  'duplicate-name': entry('KW204', 'error', 'Duplicate name', '“{name}” is already declared as a {previous}.',
    'Constants, helper functions and kernels share one namespace; each name is declared once.'),
  'definition-cycle': entry('KW205', 'error', 'Definitions refer to each other in a cycle', '“{name}” depends on itself: {chain}.',
    'Constants and helper functions must not refer to themselves, directly or through others.'),
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
    'A parameter named like a constant or a built-in constant (pi, e, i) hides it; rename the parameter.'),
  'missing-domain': entry('KW217', 'error', 'No domain', 'Kernel “{name}” has no domain: add “domain [a, b]” to the file or “on [a, b]” to the kernel.',
    'Every kernel is analysed on a bounded interval, from the file’s domain line or its own “on [a, b]”.'),
  'duplicate-domain': entry('KW218', 'warning', 'Second default domain', 'The file already has a default domain; this line overrides it for the whole file.',
    'A file has one default domain; give kernels that need another one their own “on [a, b]”.'),
  'not-real': entry('KW219', 'error', 'Real value required', '{what} must be real, but is {value}.',
    'Domain ends, comparison operands and the arguments of min, max, floor, sign (on real kernels) and erf must be real.'),
  'not-a-function': entry('KW220', 'error', 'Not a function', '“{name}” is a {what}, not a function.',
    'Only built-in functions and helpers declared with fn can be called.'),
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
  'not-converged': entry('KW401', 'info', 'Target accuracy not reached', 'The spectrum of “{name}” reached a relative accuracy of {reached} (target {target}) within {budget} ms.',
    'The engine refines its discretisation until the leading eigenvalues agree to the target accuracy or the time budget per kernel is spent. Every figure still carries its own error estimate; raise the time budget or the resolution cap for more digits.'),
  'spectrum-unavailable': entry('KW402', 'warning', 'No spectrum', 'No spectrum for “{name}”: {reason}.',
    'The operator could not be analysed numerically; the message says why. Eigenvalues and the norm are reported as null.'),
  'methods-disagree': entry('KW403', 'warning', 'Two methods disagree', 'For “{name}”, the degenerate-kernel method gives λ{index} = {exact} but the Galerkin discretisation gives {galerkin} (difference {difference}, above the combined error estimate {error}).',
    'A separable kernel is solved twice, exactly through the small matrix of inner products and by discretisation; a disagreement beyond their error estimates points to a kernel the analysis does not handle well. Please report it with the kernel.'),
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
