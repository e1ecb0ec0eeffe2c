/**
 * Shared shapes of the quadrature layer: 1D rules, 2D rules, plane points, and the error thrown on bad input.
 * A rule approximates ∫ f ≈ Σ w_i f(x_i); every rule returned by this layer is a fresh object the caller may keep.
 */

/** A rule on an interval: nodes (ascending unless stated otherwise) and their weights. */
export interface Rule1D {
  readonly nodes: Float64Array;
  readonly weights: Float64Array;
}

/** A rule on a plane region: ∫∫ f dA ≈ Σ w[i] f(x[i], y[i]). */
export interface Rule2D {
  readonly x: Float64Array;
  readonly y: Float64Array;
  readonly w: Float64Array;
}

/** A point of the plane, as [x, y] (or [t, s] in panel coordinates). */
export type Vec2 = readonly [number, number];

/** Thrown when a quadrature routine is called with arguments outside its domain (the message names them). */
export class QuadratureInputError extends RangeError {
  constructor(message: string) {
    super(message);
    this.name = 'QuadratureInputError';
  }
}

/** Throws unless `n` is an integer in [min, max]; `what` names the argument in the message. */
export function requireInteger(n: number, what: string, min: number, max = Number.MAX_SAFE_INTEGER): void {
  if (!Number.isInteger(n) || n < min || n > max) {
    throw new QuadratureInputError(`${what} must be an integer in [${min}, ${max}], got ${String(n)}`);
  }
}

/** Throws unless every value is a finite number. */
export function requireFinite(what: string, ...values: number[]): void {
  for (const v of values) {
    if (!Number.isFinite(v)) throw new QuadratureInputError(`${what} must be finite, got ${String(v)}`);
  }
}

/** A complex number as plain data (structurally the same as the semantics layer's complex values). */
export interface ComplexNumber {
  readonly re: number;
  readonly im: number;
}
