/**
 * Installs mathjs `simplify` as the core's expression simplifier, loading mathjs only when a fix first asks for it
 * (loading it costs more than analysing a file, and most runs never need it). esbuild turns the `require` below into
 * a lazily initialised module inside the bundle.
 */
import { setExpressionSimplifier } from '@kernwright/core';

type MathjsLike = {
  parse(text: string): unknown;
  simplify(node: unknown): { toString(options: object): string };
};

let mathjs: MathjsLike | null = null;

export function simplifyWithMathjs(expression: string): string | null {
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  mathjs ??= require('mathjs') as MathjsLike;
  return mathjs.simplify(mathjs.parse(expression)).toString({ parenthesis: 'auto', implicit: 'show' });
}

export function installMathjsSimplifier(): void {
  setExpressionSimplifier(simplifyWithMathjs);
}
