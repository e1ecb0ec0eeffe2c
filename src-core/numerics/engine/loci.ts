/**
 * Where a kernel is not smooth, read from its expression. abs, min, max, sign, floor, comparisons and conditionals
 * make kinks or jumps along the zero set of their argument (or of the difference of their arguments); log,
 * negative or fractional powers, sqrt and divisions make singular behaviour along the zero set of their argument
 * (or denominator). When that zero set is a straight line a·t + b·s + c = 0 it is returned exactly, so that the
 * discretisation can put panel breakpoints on it (lines t = c, s = c) or split panel pairs along it (oblique
 * lines such as the diagonal t = s). Zero sets that are not straight lines are reported as `unknown`.
 */
import type { TextRange } from '../../syntax/textRange';
import type { IrFunction, IrNode } from '../../semantics/ir';
import { closeOver, slotCountOf } from '../../semantics/irTools';
import { compileKernel } from '../../semantics/evaluator';
import { mayBeComplex } from '../../semantics/lower';
import { isAnalytic, pointLoci, vanishesOn, type PointLocusFinding } from './lociPoints';

/** The line ct·t + cs·s + c0 = 0, normalised so that max(|ct|, |cs|) = 1 and the first nonzero of (ct, cs) is > 0. */
export interface Line {
  readonly ct: number;
  readonly cs: number;
  readonly c0: number;
}

export type LocusKind = 'kink' | 'jump' | 'singular';

export interface Locus {
  readonly line: Line;
  readonly kind: LocusKind;
  /** The expression node that creates it. */
  readonly range: TextRange;
  /**
   * The growth of |K| toward the line as written in the expression, when one node alone decides it: |ℓ|^(−α) from a
   * power with a constant exponent of a base vanishing to a known order on ℓ, or log|ℓ|, and no other part of the
   * expression mentions ℓ (so nothing can cancel or change the order). Checked against the measured growth by
   * singularity.ts before it is used.
   */
  readonly written?: { readonly type: 'power' | 'log'; readonly exponent: number };
  /**
   * A division by an affine ℓ whose numerator is analytic and vanishes on ℓ: the quotient is analytic across the line
   * (Hadamard's lemma: an analytic g with g = 0 on ℓ = 0 is ℓ·h with h analytic), so the kernel is smooth there; the
   * locus is kept (as a kink, which needs no singular quadrature) only so that no rule evaluates K on the line, where
   * the expression is 0/0.
   */
  readonly removable?: boolean;
}

export interface LociResult {
  readonly loci: readonly Locus[];
  /**
   * Non-smooth places whose zero set is not a straight line (the discretisation refines uniformly instead).
   * `node` is the expression whose zero set it is, closed over its bindings (a function of t and s), so callers can
   * test numerically whether it vanishes on the square at all (for comparisons: the difference; else a constant).
   */
  readonly unknown: readonly UnknownLocus[];
  /**
   * Places where a cap on the number of loci was hit: a floor whose argument crosses more integers inside the square
   * than `cap` (`lines` of them; the one nearest the middle is kept as a locus, so the checks see the jumps, and the
   * rest is left to uniform refinement, as for an unknown locus).
   */
  readonly capped: readonly LociCap[];
}

export interface UnknownLocus {
  readonly kind: LocusKind;
  readonly range: TextRange;
  readonly node: IrNode;
  /**
   * For a singular curve g = 0 from 1/g or g^p (p < 0 constant) with g analytic: |K| ~ d^(−α) with α = 1 or −p where
   * the gradient of g does not vanish (a simple zero). To be checked against the measured growth before use.
   */
  readonly written?: { readonly type: 'power'; readonly exponent: number };
}

export interface LociCap {
  readonly kind: 'integer-lines';
  readonly range: TextRange;
  /** How many lines there are (a double: may exceed 2^53). */
  readonly lines: number;
  readonly cap: number;
}

/** Most jump lines followed for one floor(...) (each is a breakpoint of the mesh). */
export const integerLineCap = 64;

interface Affine { ct: number; cs: number; c0: number }

const rank: Record<LocusKind, number> = { kink: 0, jump: 1, singular: 2 };

export function normaliseLine(a: Affine): Line | null {
  const m = Math.max(Math.abs(a.ct), Math.abs(a.cs));
  if (!(m > 0) || !Number.isFinite(m)) return null;
  let k = 1 / m;
  const lead = Math.abs(a.ct) > 0 ? a.ct : a.cs;
  if (lead < 0) k = -k;
  const clean = (x: number) => (Math.abs(x) < 1e-15 ? 0 : x);
  return { ct: clean(a.ct * k), cs: clean(a.cs * k), c0: clean(a.c0 * k) };
}

export function sameLine(p: Line, q: Line): boolean {
  const tol = 1e-12;
  return Math.abs(p.ct - q.ct) < tol && Math.abs(p.cs - q.cs) < tol && Math.abs(p.c0 - q.c0) < tol * (1 + Math.abs(p.c0));
}

class LociFinder {
  private readonly bindings = new Map<number, IrNode>();
  private readonly affineCache = new Map<IrNode, Affine | null>();
  readonly loci: Locus[] = [];
  readonly unknown: UnknownLocus[] = [];
  readonly capped: LociCap[] = [];
  /** Candidates for Locus.written: the line, what the node says, and the part of the tree that mentions the line. */
  readonly written: { line: Line; type: 'power' | 'log'; exponent: number; inside: IrNode }[] = [];

  constructor(private readonly domain: readonly [number, number]) {}

  closeOver(node: IrNode): IrNode {
    return closeOver(node, this.bindings);
  }

  affine(n: IrNode): Affine | null {
    if (this.affineCache.has(n)) return this.affineCache.get(n)!;
    const r = this.computeAffine(n);
    this.affineCache.set(n, r);
    return r;
  }

  private computeAffine(n: IrNode): Affine | null {
    switch (n.op) {
      case 'const':
        return n.im === 0 ? { ct: 0, cs: 0, c0: n.re } : null;
      case 'var': {
        if (n.slot === 0) return { ct: 1, cs: 0, c0: 0 };
        if (n.slot === 1) return { ct: 0, cs: 1, c0: 0 };
        const b = this.bindings.get(n.slot);
        return b ? this.affine(b) : null;
      }
      case 'neg': {
        const a = this.affine(n.a);
        return a && { ct: -a.ct, cs: -a.cs, c0: -a.c0 };
      }
      case 'add': case 'sub': {
        const a = this.affine(n.a);
        const b = this.affine(n.b);
        if (!a || !b) return null;
        const k = n.op === 'add' ? 1 : -1;
        return { ct: a.ct + k * b.ct, cs: a.cs + k * b.cs, c0: a.c0 + k * b.c0 };
      }
      case 'mul': {
        const a = this.affine(n.a);
        const b = this.affine(n.b);
        if (!a || !b) return null;
        if (a.ct === 0 && a.cs === 0) return { ct: a.c0 * b.ct, cs: a.c0 * b.cs, c0: a.c0 * b.c0 };
        if (b.ct === 0 && b.cs === 0) return { ct: b.c0 * a.ct, cs: b.c0 * a.cs, c0: b.c0 * a.c0 };
        return null;
      }
      case 'div': {
        const a = this.affine(n.a);
        const b = this.affine(n.b);
        if (!a || !b || b.ct !== 0 || b.cs !== 0 || b.c0 === 0) return null;
        return { ct: a.ct / b.c0, cs: a.cs / b.c0, c0: a.c0 / b.c0 };
      }
      case 'let':
        return this.affine(n.body);
      default:
        return null;
    }
  }

  /** The lines whose union is the zero set of n, or null when that set is not known to be a union of lines. */
  zeroLines(n: IrNode): Line[] | null {
    const a = this.affine(n);
    if (a) {
      if (a.ct === 0 && a.cs === 0) return [];
      const l = normaliseLine(a);
      return l ? [l] : null;
    }
    switch (n.op) {
      case 'neg': return this.zeroLines(n.a);
      case 'call':
        if (n.fn === 'abs' || n.fn === 'sqrt' || n.fn === 'conj' || n.fn === 'sinh' || n.fn === 'tanh' || n.fn === 'atan') {
          return this.zeroLines(n.args[0]);
        }
        return null;
      case 'pow': {
        const p = this.affine(n.b);
        if (p && p.ct === 0 && p.cs === 0 && p.c0 > 0) return this.zeroLines(n.a);
        return null;
      }
      case 'mul': {
        const a = this.zeroLines(n.a);
        const b = this.zeroLines(n.b);
        return a && b ? [...a, ...b] : null;
      }
      case 'div': return this.zeroLines(n.a);
      case 'let': return this.zeroLines(n.body);
      default: return null;
    }
  }

  private add(lines: Line[] | null, kind: LocusKind, range: TextRange, zeroOf?: IrNode, removable = false, power?: number): void {
    if (!lines) {
      const node = zeroOf ? this.closeOver(zeroOf) : { op: 'const' as const, re: 0, im: 0, range };
      const analytic = zeroOf !== undefined && power !== undefined && power < 0 && isAnalytic(zeroOf, (slot) => this.bindings.get(slot));
      this.unknown.push(analytic ? { kind, range, node, written: { type: 'power', exponent: -power } } : { kind, range, node });
      return;
    }
    for (const line of lines) {
      const existing = this.loci.findIndex((l) => sameLine(l.line, line));
      const locus: Locus = removable ? { line, kind, range, removable } : { line, kind, range };
      if (existing < 0) this.loci.push(locus);
      else if (rank[kind] > rank[this.loci[existing].kind]) this.loci[existing] = locus;
      else if (this.loci[existing].removable && !removable && kind === this.loci[existing].kind) this.loci[existing] = locus;
    }
  }

  /** The order to which n vanishes on the line (|n| ~ d^order), for products of powers of affine parts; else null. */
  vanishingOrder(n: IrNode, line: Line): number | null {
    const a = this.affine(n);
    if (a) {
      if (a.ct === 0 && a.cs === 0) return a.c0 !== 0 ? 0 : null;
      const l = normaliseLine(a);
      return l && sameLine(l, line) ? 1 : 0;
    }
    switch (n.op) {
      case 'neg': return this.vanishingOrder(n.a, line);
      case 'let': return this.vanishingOrder(n.body, line);
      case 'call':
        if (n.fn === 'abs' || n.fn === 'conj') return this.vanishingOrder(n.args[0], line);
        if (n.fn === 'sqrt') { const o = this.vanishingOrder(n.args[0], line); return o === null ? null : o / 2; }
        return null;
      case 'pow': {
        const p = this.constantValue(n.b);
        const o = this.vanishingOrder(n.a, line);
        return p !== null && p > 0 && o !== null ? p * o : null;
      }
      case 'mul': {
        const x = this.vanishingOrder(n.a, line);
        const y = this.vanishingOrder(n.b, line);
        return x !== null && y !== null ? x + y : null;
      }
      default: return null;
    }
  }

  /** How many maximal affine parts of n are proportional to the line (bindings followed through their uses). */
  mentions(n: IrNode, line: Line, depth = 0): number {
    if (depth > 200) return Infinity;
    const a = this.affine(n);
    if (a) {
      if (a.ct === 0 && a.cs === 0) return 0;
      const l = normaliseLine(a);
      return l && sameLine(l, line) ? 1 : 0;
    }
    switch (n.op) {
      case 'const': return 0;
      case 'var': { const b = this.bindings.get(n.slot); return b ? this.mentions(b, line, depth + 1) : 0; }
      case 'let': return this.mentions(n.body, line, depth + 1);
      case 'neg': case 'not': return this.mentions(n.a, line, depth + 1);
      case 'call': return n.args.reduce((k, x) => k + this.mentions(x, line, depth + 1), 0);
      case 'cond': return this.mentions(n.test, line, depth + 1) + this.mentions(n.then, line, depth + 1) + this.mentions(n.otherwise, line, depth + 1);
      default: return this.mentions(n.a, line, depth + 1) + this.mentions(n.b, line, depth + 1);
    }
  }

  private noteWritten(lines: Line[] | null, base: IrNode, power: number | null): void {
    if (!lines) return;
    for (const line of lines) {
      if (power === null) { this.written.push({ line, type: 'log', exponent: 0, inside: base }); continue; }
      const order = this.vanishingOrder(base, line);
      if (order !== null && order > 0 && power < 0) this.written.push({ line, type: 'power', exponent: -power * order, inside: base });
    }
  }

  /**
   * The lines where n equals the constant c, when n is built from affine parts with abs, negation, constant
   * factors and offsets, and whole powers (so |t − s| < r gives t − s = ±r); null when not known to be lines.
   */
  levelLines(n: IrNode, c: number): Line[] | null {
    const a = this.affine(n);
    if (a) {
      if (a.ct === 0 && a.cs === 0) return [];
      const l = normaliseLine({ ct: a.ct, cs: a.cs, c0: a.c0 - c });
      return l ? [l] : null;
    }
    const constant = (m: IrNode) => this.constantValue(m);
    switch (n.op) {
      case 'neg': return this.levelLines(n.a, -c);
      case 'let': return this.levelLines(n.body, c);
      case 'call':
        if (n.fn !== 'abs') return null;
        if (c < 0) return [];
        if (c === 0) return this.levelLines(n.args[0], 0);
        return merge(this.levelLines(n.args[0], c), this.levelLines(n.args[0], -c));
      case 'add': case 'sub': {
        const ka = constant(n.a);
        const kb = constant(n.b);
        if (kb !== null) return this.levelLines(n.a, n.op === 'add' ? c - kb : c + kb);
        if (ka !== null) return this.levelLines(n.b, n.op === 'add' ? c - ka : ka - c);
        return null;
      }
      case 'mul': {
        const ka = constant(n.a);
        const kb = constant(n.b);
        if (kb !== null && kb !== 0) return this.levelLines(n.a, c / kb);
        if (ka !== null && ka !== 0) return this.levelLines(n.b, c / ka);
        return null;
      }
      case 'div': {
        const kb = constant(n.b);
        return kb !== null && kb !== 0 ? this.levelLines(n.a, c * kb) : null;
      }
      case 'pow': {
        const p = constant(n.b);
        if (p === null || !Number.isInteger(p) || p < 1 || p > 16) return null;
        if (p % 2 === 1) return this.levelLines(n.a, Math.sign(c) * Math.abs(c) ** (1 / p));
        if (c < 0) return [];
        const root = c ** (1 / p);
        return root === 0 ? this.levelLines(n.a, 0) : merge(this.levelLines(n.a, root), this.levelLines(n.a, -root));
      }
      default: return null;
    }
  }

  /** Where a comparison a ⋚ b can change its answer: a − b = 0 for affine sides, else a level set of one side. */
  private comparisonLines(a: IrNode, b: IrNode): Line[] | null {
    const direct = this.difference(a, b);
    if (direct) return direct;
    const cb = this.constantValue(b);
    if (cb !== null) return this.levelLines(a, cb);
    const ca = this.constantValue(a);
    return ca !== null ? this.levelLines(b, ca) : null;
  }

  /** The value of n when it is a constant (an affine expression without t and s), else null. */
  private constantValue(n: IrNode): number | null {
    const x = this.affine(n);
    return x && x.ct === 0 && x.cs === 0 ? x.c0 : null;
  }

  private differenceNode(a: IrNode, b: IrNode): IrNode {
    return { op: 'sub', a, b, range: a.range };
  }

  private difference(a: IrNode, b: IrNode): Line[] | null {
    const x = this.affine(a);
    const y = this.affine(b);
    if (!x || !y) return null;
    const d = { ct: x.ct - y.ct, cs: x.cs - y.cs, c0: x.c0 - y.c0 };
    if (d.ct === 0 && d.cs === 0) return [];
    const l = normaliseLine(d);
    return l ? [l] : null;
  }

  /**
   * Lines x = k for the integers k that the affine x takes inside the square: all of them when there are at most
   * `integerLineCap`; else the one nearest the middle, with `capped` set to how many there are (the rest are left to
   * uniform refinement). Null when x is not finite on the square.
   */
  private integerLines(x: Affine): { lines: Line[]; capped: number | null } | null {
    const [a, b] = this.domain;
    const corners = [[a, a], [a, b], [b, a], [b, b]].map(([t, s]) => x.ct * t + x.cs * s + x.c0);
    const lo = Math.min(...corners);
    const hi = Math.max(...corners);
    // Every double of magnitude at least 2^52 is an integer, so floor is the identity there and jumps nowhere; and
    // k++ would not move beyond 2^53 (the search for floor(s + 1e17) looped forever).
    if (!Number.isFinite(lo) || !Number.isFinite(hi)) return null;
    if (Math.min(Math.abs(lo), Math.abs(hi)) >= 2 ** 52 && Math.sign(lo) === Math.sign(hi)) return { lines: [], capped: null };
    const first = Math.floor(lo) + 1;
    const last = Math.ceil(hi) - 1;
    const total = Math.max(0, last - first + 1);
    const line = (k: number) => normaliseLine({ ct: x.ct, cs: x.cs, c0: x.c0 - k });
    if (total > integerLineCap) {
      const middle = Math.min(last, Math.max(first, Math.round((lo + hi) / 2)));
      const l = line(middle);
      return { lines: l ? [l] : [], capped: total };
    }
    const out: Line[] = [];
    // The trip count is at most integerLineCap whatever the values: an index, not the integer itself, counts.
    for (let i = 0; i < total; i++) {
      const l = line(first + i);
      if (l) out.push(l);
    }
    return { lines: out, capped: null };
  }

  visit(root: IrNode): void {
    const stack: IrNode[] = [root];
    while (stack.length > 0) {
      const n = stack.pop()!;
      switch (n.op) {
        case 'const': case 'var': break;
        case 'neg': case 'not': stack.push(n.a); break;
        case 'let':
          this.bindings.set(n.slot, n.value);
          stack.push(n.body, n.value);
          break;
        case 'cond': stack.push(n.otherwise, n.then, n.test); break;
        case 'lt': case 'le': case 'gt': case 'ge': case 'eq': case 'ne':
        {
          const lines = this.comparisonLines(n.a, n.b);
          this.add(lines, 'jump', n.range, this.differenceNode(n.a, n.b));
          // A comparison only passes on true or false: when the lines where it changes are known, the kinks of its
          // sides (the abs in |t − s| < r) are not kinks of K. Otherwise the sides are searched as well.
          if (!lines) stack.push(n.b, n.a);
          break;
        }
        case 'div': {
          const denominator = this.affine(n.b);
          if (!(denominator && denominator.ct === 0 && denominator.cs === 0)) {
            const line = denominator ? normaliseLine(denominator) : null;
            const lookup = (slot: number) => this.bindings.get(slot);
            if (line && isAnalytic(n.a, lookup) && vanishesOn(n.a, line, (m) => this.affine(m), lookup)) {
              this.add([line], 'kink', n.range, n.b, true);
            } else {
              const lines = this.zeroLines(n.b);
              this.add(lines, 'singular', n.range, n.b, false, -1);
              this.noteWritten(lines, n.b, -1);
            }
          }
          stack.push(n.b, n.a);
          break;
        }
        case 'pow': {
          const p = this.affine(n.b);
          const wholePower = p && p.ct === 0 && p.cs === 0 && Number.isInteger(p.c0) && p.c0 >= 0;
          const base = this.affine(n.a);
          const constantBase = base && base.ct === 0 && base.cs === 0;
          if (!wholePower && !constantBase) {
            const lines = this.zeroLines(n.a);
            const constant = p && p.ct === 0 && p.cs === 0 ? p.c0 : undefined;
            this.add(lines, 'singular', n.range, n.a, false, constant);
            if (constant !== undefined) this.noteWritten(lines, n.a, constant);
          }
          stack.push(n.b, n.a);
          break;
        }
        case 'call': {
          const x = n.args[0];
          switch (n.fn) {
            case 'abs': this.add(this.zeroLines(x), 'kink', n.range, x); break;
            case 'sign': this.add(this.zeroLines(x), 'jump', n.range, x); break;
            case 'sqrt': this.add(this.zeroLines(x), 'singular', n.range, x); break;
            case 'log': {
              const lines = this.zeroLines(x);
              this.add(lines, 'singular', n.range, x);
              if (lines) for (const l of lines) if (this.vanishingOrder(x, l) !== null) this.noteWritten([l], x, null);
              break;
            }
            case 'floor': {
              const a = this.affine(x);
              const found = a ? this.integerLines(a) : null;
              if (found?.capped) {
                this.capped.push({ kind: 'integer-lines', range: n.range, lines: found.capped, cap: integerLineCap });
                this.add(null, 'jump', n.range); // a constant node: the lines surely meet the square
              }
              this.add(found ? found.lines : null, 'jump', n.range, x);
              break;
            }
            case 'min': case 'max':
              for (let i = 0; i < n.args.length; i++) {
                for (let j = i + 1; j < n.args.length; j++) {
                  this.add(this.difference(n.args[i], n.args[j]), 'kink', n.range, this.differenceNode(n.args[i], n.args[j]));
                }
              }
              break;
            default: break;
          }
          for (let k = n.args.length - 1; k >= 0; k--) stack.push(n.args[k]);
          break;
        }
        default:
          stack.push(n.b, n.a);
      }
    }
  }
}

function merge(a: Line[] | null, b: Line[] | null): Line[] | null {
  return a && b ? [...a, ...b] : null;
}

/** Loci of a kernel on the square [a, b]²: only lines that meet the closed square are kept. */
export function findLoci(fn: IrFunction, domain: readonly [number, number]): LociResult {
  const finder = new LociFinder(domain);
  finder.visit(fn.root);
  const [a, b] = domain;
  const meets = (l: Line) => {
    const v = [[a, a], [a, b], [b, a], [b, b]].map(([t, s]) => l.ct * t + l.cs * s + l.c0);
    const scale = Math.max(1, Math.abs(a), Math.abs(b));
    return Math.min(...v) <= 1e-12 * scale && Math.max(...v) >= -1e-12 * scale;
  };
  // Exponents as written: one node decides the growth toward the line, and nothing outside it mentions the line.
  const loci = finder.loci.map((l): Locus => {
    if (l.kind !== 'singular') return l;
    const cands = finder.written.filter((w) => sameLine(w.line, l.line));
    if (cands.length !== 1 || !Number.isFinite(cands[0].exponent)) return l;
    const w = cands[0];
    if (finder.mentions(fn.root, l.line) !== finder.mentions(w.inside, l.line)) return l;
    return { ...l, written: { type: w.type, exponent: w.exponent } };
  });
  // Singular places that are not lines but points or edges of the square (max(t, s)^(−0.7) at the corner).
  const unknown: UnknownLocus[] = [];
  for (const u of finder.unknown) {
    if (u.kind !== 'singular' || u.node.op === 'const') { unknown.push(u); continue; }
    const found = pointLoci(evaluatorOf(u.node), a, b);
    for (const line of found.lines) {
      if (!loci.some((l) => sameLine(l.line, line))) loci.push({ line, kind: 'singular', range: u.range });
      else {
        const k = loci.findIndex((l) => sameLine(l.line, line));
        if (loci[k].kind !== 'singular') loci[k] = { line, kind: 'singular', range: u.range };
      }
    }
    if (!found.explained) unknown.push(u);
  }
  return { loci: loci.filter((l) => meets(l.line)), unknown, capped: finder.capped };
}

function evaluatorOf(node: IrNode): PointLocusFinding['evaluate'] {
  const slots = slotCountOf(node);
  const fn = { root: node, arity: 2, slotCount: slots, complex: mayBeComplex(node, slots) };
  const kernel = compileKernel(fn);
  const t = new Float64Array(1);
  const s = new Float64Array(1);
  const re = new Float64Array(1);
  const im = new Float64Array(1);
  return (x: number, y: number) => {
    t[0] = x; s[0] = y;
    kernel.evaluateColumns([t, s], re, fn.complex ? im : null);
    return fn.complex ? { re: re[0], im: im[0] } : { re: re[0], im: 0 };
  };
}
