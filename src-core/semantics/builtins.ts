/**
 * The built-in functions and constants of kernel expressions: the one list the parser's name checks, the evaluator,
 * completion and hovers all read.
 */

export type BuiltinFunctionName =
  | 'exp' | 'log' | 'sqrt' | 'abs' | 'sin' | 'cos' | 'tan' | 'sinh' | 'cosh' | 'tanh' | 'atan'
  | 'min' | 'max' | 'sign' | 'floor' | 'erf' | 'conj' | 're' | 'im';

export interface BuiltinFunction {
  readonly name: BuiltinFunctionName;
  /** Minimum and maximum number of arguments (max = Infinity for variadic). */
  readonly minArgs: number;
  readonly maxArgs: number;
  readonly signature: string;
  readonly description: string;
  /** Defined for real arguments only (a complex argument is an evaluation fault). */
  readonly realOnly: boolean;
  /** The result is real even for complex arguments. */
  readonly realResult: boolean;
}

function fn(
  name: BuiltinFunctionName,
  minArgs: number,
  maxArgs: number,
  signature: string,
  description: string,
  realOnly = false,
  realResult = false,
): BuiltinFunction {
  return { name, minArgs, maxArgs, signature, description, realOnly, realResult };
}

export const builtinFunctions: Readonly<Record<BuiltinFunctionName, BuiltinFunction>> = {
  exp: fn('exp', 1, 1, 'exp(z)', 'Exponential e^z.'),
  log: fn('log', 1, 1, 'log(z)', 'Natural logarithm; real kernels need z > 0 (log(0) = -∞ marks a singularity).'),
  sqrt: fn('sqrt', 1, 1, 'sqrt(z)', 'Principal square root; real kernels need z ≥ 0.'),
  abs: fn('abs', 1, 1, 'abs(z)', 'Absolute value |z| (modulus for complex z).', false, true),
  sin: fn('sin', 1, 1, 'sin(z)', 'Sine.'),
  cos: fn('cos', 1, 1, 'cos(z)', 'Cosine.'),
  tan: fn('tan', 1, 1, 'tan(z)', 'Tangent.'),
  sinh: fn('sinh', 1, 1, 'sinh(z)', 'Hyperbolic sine.'),
  cosh: fn('cosh', 1, 1, 'cosh(z)', 'Hyperbolic cosine.'),
  tanh: fn('tanh', 1, 1, 'tanh(z)', 'Hyperbolic tangent.'),
  atan: fn('atan', 1, 1, 'atan(z)', 'Inverse tangent (principal branch).'),
  min: fn('min', 2, Infinity, 'min(x, y, ...)', 'Smallest of real arguments; makes a kink where they cross.', true, true),
  max: fn('max', 2, Infinity, 'max(x, y, ...)', 'Largest of real arguments; makes a kink where they cross.', true, true),
  sign: fn('sign', 1, 1, 'sign(x)', 'Sign of x: -1, 0 or 1 (z/|z| for complex z); makes a jump at x = 0.'),
  floor: fn('floor', 1, 1, 'floor(x)', 'Largest integer not above real x; makes jumps at integers.', true, true),
  erf: fn('erf', 1, 1, 'erf(x)', 'Error function of real x.', true, true),
  conj: fn('conj', 1, 1, 'conj(z)', 'Complex conjugate.'),
  re: fn('re', 1, 1, 're(z)', 'Real part.', false, true),
  im: fn('im', 1, 1, 'im(z)', 'Imaginary part.', false, true),
};

export type BuiltinConstantName = 'pi' | 'e' | 'i';

export interface BuiltinConstant {
  readonly name: BuiltinConstantName;
  readonly re: number;
  readonly im: number;
  readonly description: string;
}

export const builtinConstants: Readonly<Record<BuiltinConstantName, BuiltinConstant>> = {
  pi: { name: 'pi', re: Math.PI, im: 0, description: 'π = 3.14159…' },
  e: { name: 'e', re: Math.E, im: 0, description: 'Euler’s number e = 2.71828…' },
  i: { name: 'i', re: 0, im: 1, description: 'The imaginary unit, i² = -1.' },
};

export function isBuiltinFunction(name: string): name is BuiltinFunctionName {
  return Object.prototype.hasOwnProperty.call(builtinFunctions, name);
}

export function isBuiltinConstant(name: string): name is BuiltinConstantName {
  return Object.prototype.hasOwnProperty.call(builtinConstants, name);
}

/** Declaration keywords and word operators; none can be declared as a name. */
export const keywords = ['domain', 'const', 'fn', 'kernel', 'expect', 'on', 'and', 'or', 'not'] as const;

export function isKeyword(name: string): boolean {
  return (keywords as readonly string[]).includes(name);
}
