/**
 * Triangular support: kernels that vanish on one side of the diagonal, such as `t > s ? cos(t - s) : 0` or
 * `(t >= s) * exp(t - s)`, define Volterra operators (Tf)(t) = ∫_a^t K(t, s) f(s) ds (or ∫_t^b). A Volterra operator
 * with a square-integrable kernel is quasinilpotent: ‖Tⁿ‖^(1/n) → 0, so its spectrum is {0} and it has no nonzero
 * eigenvalue. (The iterated kernels obey |K_n(t, s)| ≤ a(t) b(s) (∫_s^t a²)^((n−2)/2) / √((n−2)!) by Cauchy–Schwarz;
 * F. G. Tricomi, Integral Equations, 1957, ch. I on Volterra equations, where the resolvent kernel of a
 * square-integrable Volterra kernel is shown to be an entire function of the parameter; quoted from memory.)
 * Galerkin discretisations of such operators are nilpotent-like matrices whose eigenvalues are ill-conditioned and
 * wander between levels (pseudospectra), so the engine's eigenvalues of them are spurious.
 *
 * The support is read from the expression: the half-squares {t < s} and {t > s} are the triangles with vertices
 * (a, a), (a, b), (b, b) and (a, a), (b, a), (b, b); a comparison of two affine functions of t and s is decided on a
 * triangle when their difference has one sign at its three vertices (a linear function takes its extremes at
 * vertices; where it is 0 on a segment the set has measure zero, which an L² operator does not see). A node is
 * constant on a triangle when it is a constant, a decided comparison (1 or 0), the sign of an affine function of one
 * sign there, a conditional whose test is decided there (or whose branches are the same constant), arithmetic on
 * such nodes, a product with a factor 0 there, or a max (min) of nonpositive (nonnegative) arguments one of which is
 * 0 (`max(t - s, 0)`). K has triangular support when it is the constant 0 on exactly one of the two triangles.
 * The finding is then confirmed numerically: K must be exactly 0 at every point
 * of a Gauss grid inside that triangle and nonzero somewhere in the other one (else it is the zero kernel).
 */
import type { IrFunction, IrNode } from '../../semantics/ir';
import type { CompiledKernel } from '../../semantics/evaluator';
import { collectBindings } from '../../semantics/irTools';
import { gaussLegendre, mapRule } from '../quadrature';

/** 'lower': K = 0 where s > t, so (Tf)(t) = ∫_a^t K(t, s) f(s) ds; 'upper': K = 0 where s < t, (Tf)(t) = ∫_t^b. */
export type TriangularSide = 'lower' | 'upper';

export interface TriangularSupport {
  readonly side: TriangularSide;
  /** Grid points of the vanishing triangle where K was evaluated and found exactly 0. */
  readonly checkedPoints: number;
}

/** The two open half-squares: 'below' is {t > s} (under the diagonal in (t, s) coordinates), 'above' is {t < s}. */
type Region = 'below' | 'above';
type Tri = 'true' | 'false' | 'unknown';

interface Affine { readonly ct: number; readonly cs: number; readonly c0: number }

const maxNodes = 20000;

class SupportReader {
  private readonly bindings: Map<number, IrNode>;
  private visited = 0;

  constructor(root: IrNode, private readonly a: number, private readonly b: number) {
    this.bindings = collectBindings(root);
  }

  /** Vertices (t, s) of the closed triangle of a region. */
  private vertices(r: Region): [number, number][] {
    const { a, b } = this;
    return r === 'below' ? [[a, a], [b, a], [b, b]] : [[a, a], [a, b], [b, b]];
  }

  private budget(): boolean {
    return ++this.visited <= maxNodes;
  }

  affine(n: IrNode, depth = 0): Affine | null {
    if (depth > 64 || !this.budget()) return null;
    switch (n.op) {
      case 'const': return n.im === 0 && Number.isFinite(n.re) ? { ct: 0, cs: 0, c0: n.re } : null;
      case 'var': {
        if (n.slot === 0) return { ct: 1, cs: 0, c0: 0 };
        if (n.slot === 1) return { ct: 0, cs: 1, c0: 0 };
        const v = this.bindings.get(n.slot);
        return v ? this.affine(v, depth + 1) : null;
      }
      case 'let': return this.affine(n.body, depth + 1);
      case 'neg': {
        const x = this.affine(n.a, depth + 1);
        return x ? { ct: -x.ct, cs: -x.cs, c0: -x.c0 } : null;
      }
      case 'add': case 'sub': {
        const x = this.affine(n.a, depth + 1);
        const y = x && this.affine(n.b, depth + 1);
        if (!x || !y) return null;
        const k = n.op === 'add' ? 1 : -1;
        return { ct: x.ct + k * y.ct, cs: x.cs + k * y.cs, c0: x.c0 + k * y.c0 };
      }
      case 'mul': {
        const x = this.affine(n.a, depth + 1);
        const y = x && this.affine(n.b, depth + 1);
        if (!x || !y) return null;
        if (x.ct === 0 && x.cs === 0) return { ct: x.c0 * y.ct, cs: x.c0 * y.cs, c0: x.c0 * y.c0 };
        if (y.ct === 0 && y.cs === 0) return { ct: y.c0 * x.ct, cs: y.c0 * x.cs, c0: y.c0 * x.c0 };
        return null;
      }
      case 'div': {
        const x = this.affine(n.a, depth + 1);
        const y = x && this.affine(n.b, depth + 1);
        if (!x || !y || y.ct !== 0 || y.cs !== 0 || y.c0 === 0) return null;
        return { ct: x.ct / y.c0, cs: x.cs / y.c0, c0: x.c0 / y.c0 };
      }
      default: return null;
    }
  }

  /** The truth of a test on a whole region (up to a set of measure zero). */
  truth(n: IrNode, r: Region, depth = 0): Tri {
    if (depth > 64 || !this.budget()) return 'unknown';
    switch (n.op) {
      case 'let': return this.truth(n.body, r, depth + 1);
      case 'var': {
        const v = n.slot >= 2 ? this.bindings.get(n.slot) : undefined;
        return v ? this.truth(v, r, depth + 1) : 'unknown';
      }
      case 'not': {
        const x = this.truth(n.a, r, depth + 1);
        return x === 'true' ? 'false' : x === 'false' ? 'true' : 'unknown';
      }
      case 'and': case 'or': {
        const x = this.truth(n.a, r, depth + 1);
        const y = this.truth(n.b, r, depth + 1);
        if (n.op === 'and') return x === 'false' || y === 'false' ? 'false' : x === 'true' && y === 'true' ? 'true' : 'unknown';
        return x === 'true' || y === 'true' ? 'true' : x === 'false' && y === 'false' ? 'false' : 'unknown';
      }
      case 'lt': case 'le': case 'gt': case 'ge': case 'eq': case 'ne': {
        const x = this.affine(n.a, depth + 1);
        const y = x && this.affine(n.b, depth + 1);
        if (!x || !y) return 'unknown';
        const diff: IrNode = { op: 'sub', a: n.a, b: n.b, range: n.range };
        // The sign of the difference on the open triangle, up to measure zero.
        const sign = this.affineSign(diff, r, depth);
        if (sign === null) return 'unknown';
        const holdsFor = (v: number): boolean => {
          switch (n.op) {
            case 'lt': return v < 0;
            case 'le': return v <= 0;
            case 'gt': return v > 0;
            case 'ge': return v >= 0;
            case 'eq': return v === 0;
            default: return v !== 0;
          }
        };
        return holdsFor(sign) ? 'true' : 'false';
      }
      default: return 'unknown';
    }
  }

  /** The sign of an affine node on the region (−1, 0 for identically 0, 1), or null when it changes sign there. */
  private affineSign(n: IrNode, r: Region, depth: number): -1 | 0 | 1 | null {
    const d = this.affine(n, depth + 1);
    if (!d) return null;
    const values = this.vertices(r).map(([t, s]) => d.ct * t + d.cs * s + d.c0);
    if (!values.every(Number.isFinite)) return null;
    if (values.every((v) => v === 0)) return 0;
    return values.every((v) => v <= 0) ? -1 : values.every((v) => v >= 0) ? 1 : null;
  }

  /**
   * The node's value where it is constant on the region (up to measure zero): real constants, decided comparisons
   * (1 or 0), sign of an affine argument, and arithmetic on them; a product with a factor 0 is 0 whatever the other
   * factor; max (min) of arguments that are all ≤ 0 (≥ 0) there, one of them the constant 0, is 0. Null otherwise.
   */
  constant(n: IrNode, r: Region, depth = 0): number | null {
    if (depth > 64 || !this.budget()) return null;
    const kid = (m: IrNode) => this.constant(m, r, depth + 1);
    switch (n.op) {
      case 'const': return n.im === 0 && Number.isFinite(n.re) ? n.re : null;
      case 'var': {
        const v = n.slot >= 2 ? this.bindings.get(n.slot) : undefined;
        return v ? kid(v) : null;
      }
      case 'let': return kid(n.body);
      case 'neg': {
        const x = kid(n.a);
        return x === null ? null : -x;
      }
      case 'mul': case 'and': {
        const x = kid(n.a);
        if (x === 0) return 0;
        const y = kid(n.b);
        if (y === 0) return 0;
        if (x === null || y === null) return null;
        return n.op === 'mul' ? x * y : (x !== 0 && y !== 0 ? 1 : 0);
      }
      case 'or': {
        const x = kid(n.a);
        const y = kid(n.b);
        if (x === null || y === null) return (x !== null && x !== 0) || (y !== null && y !== 0) ? 1 : null;
        return x !== 0 || y !== 0 ? 1 : 0;
      }
      case 'not': {
        const x = kid(n.a);
        return x === null ? null : x === 0 ? 1 : 0;
      }
      case 'add': case 'sub': case 'div': {
        const x = kid(n.a);
        if (n.op === 'div' && x === 0) return 0;
        const y = kid(n.b);
        if (x === null || y === null) return null;
        const v = n.op === 'add' ? x + y : n.op === 'sub' ? x - y : x / y;
        return Number.isFinite(v) ? v : null;
      }
      case 'pow': {
        const e = kid(n.b);
        if (e === null) return null;
        const x = kid(n.a);
        if (x === 0 && e > 0) return 0;
        if (x === null) return null;
        const v = x ** e;
        return Number.isFinite(v) ? v : null;
      }
      case 'lt': case 'le': case 'gt': case 'ge': case 'eq': case 'ne': {
        const t = this.truth(n, r, depth + 1);
        return t === 'true' ? 1 : t === 'false' ? 0 : null;
      }
      case 'cond': {
        const test = this.truth(n.test, r, depth + 1);
        if (test === 'true') return kid(n.then);
        if (test === 'false') return kid(n.otherwise);
        const x = kid(n.then);
        return x !== null && x === kid(n.otherwise) ? x : null;
      }
      case 'call': {
        if (n.fn === 'max' || n.fn === 'min') {
          const sign = n.fn === 'max' ? -1 : 1;
          let zero = false;
          for (const arg of n.args) {
            const c = kid(arg);
            if (c === 0) { zero = true; continue; }
            if (c !== null ? Math.sign(c) === sign : this.affineSign(arg, r, depth) === sign) continue;
            return null;
          }
          return zero ? 0 : null;
        }
        if (n.args.length !== 1) return null;
        if (n.fn === 'sign') {
          const c = kid(n.args[0]);
          if (c !== null) return Math.sign(c);
          return this.affineSign(n.args[0], r, depth);
        }
        const x = kid(n.args[0]);
        if (x === null) return null;
        switch (n.fn) {
          case 'abs': return Math.abs(x);
          case 'sin': case 'sinh': case 'tan': case 'tanh': case 'atan': case 'erf': case 'conj': case 're':
            return x === 0 ? 0 : null;
          case 'im': return 0;
          case 'sqrt': return x >= 0 ? Math.sqrt(x) : null;
          case 'exp': return Math.exp(x);
          case 'cos': return Math.cos(x);
          case 'cosh': return Math.cosh(x);
          default: return null;
        }
      }
      default: return null;
    }
  }

  /** True when the node is identically 0 on the region (up to measure zero). */
  zero(n: IrNode, r: Region): boolean {
    return this.constant(n, r) === 0;
  }
}

/** Which half-square the expression says K vanishes on (null: neither, or both: the zero kernel). */
export function triangularFromExpression(ir: IrFunction, domain: readonly [number, number]): TriangularSide | null {
  const [a, b] = domain;
  if (!(a < b) || !Number.isFinite(a) || !Number.isFinite(b)) return null;
  const above = new SupportReader(ir.root, a, b).zero(ir.root, 'above');
  const below = new SupportReader(ir.root, a, b).zero(ir.root, 'below');
  if (above === below) return null;
  return above ? 'lower' : 'upper';
}

/** Number of Gauss points per axis of the confirmation grid. */
const gridPoints = 32;

/**
 * Triangular support read from the expression and confirmed on a Gauss grid: K exactly 0 at every grid point of
 * the vanishing triangle, nonzero and finite at some point of the other. Null when either fails. The kernel is
 * compiled (when given as a function) only once the expression shows triangular support.
 */
export function detectTriangularSupport(
  ir: IrFunction, domain: readonly [number, number], compiled: CompiledKernel | (() => CompiledKernel),
): TriangularSupport | null {
  const side = triangularFromExpression(ir, domain);
  if (!side) return null;
  const kernel = typeof compiled === 'function' ? compiled() : compiled;
  const grid = sampleTriangles(kernel, domain);
  const zero = side === 'lower' ? grid.above : grid.below;
  const other = side === 'lower' ? grid.below : grid.above;
  return zero.zero && other.nonzero ? { side, checkedPoints: zero.points } : null;
}

/**
 * Triangular support seen on the Gauss grid only (K exactly 0 at every grid point of one triangle, nonzero in the
 * other) for a kernel whose expression does not show it: not a proof that σ(T) = {0}, but a sign that Galerkin
 * eigenvalues may wander between levels as they do for Volterra operators.
 */
export function triangularOnGrid(kernel: CompiledKernel, domain: readonly [number, number]): TriangularSide | null {
  const [a, b] = domain;
  if (!(a < b) || !Number.isFinite(a) || !Number.isFinite(b)) return null;
  const g = sampleTriangles(kernel, domain);
  if (g.above.zero && g.below.nonzero) return 'lower';
  if (g.below.zero && g.above.nonzero) return 'upper';
  return null;
}

interface TriangleSample { zero: boolean; nonzero: boolean; points: number }

/** K on a Gauss grid, off the diagonal: is it exactly 0 on each triangle, and nonzero (finite) somewhere? */
function sampleTriangles(kernel: CompiledKernel, domain: readonly [number, number]): { above: TriangleSample; below: TriangleSample } {
  const [a, b] = domain;
  const nodes = mapRule(gaussLegendre(gridPoints), a, b).nodes;
  const n = nodes.length;
  const re = new Float64Array(n * n);
  const im = kernel.complex ? new Float64Array(n * n) : null;
  kernel.evaluateGrid(nodes, nodes, re, im);
  const above: TriangleSample = { zero: true, nonzero: false, points: 0 };
  const below: TriangleSample = { zero: true, nonzero: false, points: 0 };
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      if (i === j) continue;
      const part = nodes[j] > nodes[i] ? above : below; // s > t: above the diagonal
      const x = re[i * n + j];
      const y = im ? im[i * n + j] : 0;
      part.points++;
      if (x !== 0 || y !== 0) part.zero = false;
      if (Number.isFinite(x) && Number.isFinite(y) && (x !== 0 || y !== 0)) part.nonzero = true;
    }
  }
  return { above, below };
}

/** Words for the support: “K(t, s) = 0 for s > t”. */
export function describeTriangular(side: TriangularSide): string {
  return side === 'lower' ? 'K(t, s) = 0 for s > t' : 'K(t, s) = 0 for s < t';
}
