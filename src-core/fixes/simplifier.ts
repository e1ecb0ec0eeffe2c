/**
 * The expression simplifier behind the symmetrize fix. The core does not load a computer-algebra library itself:
 * mathjs takes longer to load than a whole analysis, and most runs never need it. A front end installs one
 * (server/src/mathjsSimplifier.ts loads mathjs lazily, on the first fix that asks); without one, fixes keep their
 * unsimplified (and still correct) text.
 */

/** Returns a simplified form of a real expression written in mathjs syntax, or null when it cannot. */
export type ExpressionSimplifier = (expression: string) => string | null;

let installed: ExpressionSimplifier | null = null;

export function setExpressionSimplifier(simplifier: ExpressionSimplifier | null): void {
  installed = simplifier;
}

export function expressionSimplifier(): ExpressionSimplifier | null {
  return installed;
}
