/**
 * Is a kernel Hermitian by construction? The expression K(t, s) and the expression conj K(s, t) (t and s swapped,
 * complex conjugate applied) are both brought to a canonical form and compared. Equal forms prove K = K* up to a
 * set of measure zero, without sampling noise; different forms prove nothing (the numerical check decides then).
 *
 * The canonical form is a sum of terms, each a complex coefficient times a product of factors with integer
 * exponents, terms and factors sorted by their text. On the way:
 *  - sums, differences and products are flattened (small products of sums are multiplied out), whole powers of
 *    a single term multiply its exponents, and equal terms are merged;
 *  - even functions (abs, cos, cosh, even whole powers) take the orientation of their argument x or −x whose text
 *    sorts first; odd ones (sin, sinh, tanh, atan, erf, sign, odd powers) do the same and carry the sign outside;
 *  - min and max sort their arguments;
 *  - a comparison becomes the indicator of “D < 0” for the difference D of its sides (or 1 minus the indicator of
 *    “−D < 0”), so that t < s and s > t agree; < and ≤ are not told apart, since they differ only where D = 0, a
 *    set of measure zero when D depends on t or s. A conditional with such a test becomes B + I·(A − B);
 *  - the conjugate is pushed through +, −, ·, /, whole powers, exp, sin, cos, sinh, cosh, tanh and sign (entire
 *    functions with real Taylor coefficients, and z/|z|), is dropped on real subexpressions, and is kept as a
 *    marked factor elsewhere (log, sqrt and fractional powers, whose principal branches do not commute with it on
 *    the negative real axis).
 * Everything is exact arithmetic on the expression except the coefficients, which are compared to 13 digits.
 */
import type { IrFunction, IrNode } from '../semantics/ir';
import { collectBindings } from '../semantics/irTools';

interface Cx { readonly re: number; readonly im: number }
interface Term { readonly coef: Cx; readonly mono: ReadonlyMap<string, number> }
type Poly = ReadonlyMap<string, Term>;

class GiveUp extends Error {}

const maxTerms = 64;
const maxKeyLength = 100_000;

const cmul = (a: Cx, b: Cx): Cx => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });
const isZero = (c: Cx) => c.re === 0 && c.im === 0;

function coefText(c: Cx): string {
  const f = (x: number) => (x === 0 ? '0' : x.toPrecision(13));
  return c.im === 0 ? f(c.re) : `${f(c.re)},${f(c.im)}`;
}

function monoKey(m: ReadonlyMap<string, number>): string {
  return [...m.entries()].map(([k, e]) => (e === 1 ? k : `${k}^${e}`)).sort().join('*');
}

function polyKey(p: Poly): string {
  if (p.size === 0) return '0';
  const key = [...p.values()].map((t) => `${coefText(t.coef)}·${monoKey(t.mono)}`).sort().join(' + ');
  if (key.length > maxKeyLength) throw new GiveUp();
  return key;
}

function constant(c: Cx): Poly {
  return isZero(c) ? new Map() : new Map([['', { coef: c, mono: new Map() }]]);
}

/** Indicator factors (keys starting with “?”) are idempotent: I·I = I. */
function factor(key: string, exponent = 1): Poly {
  if (exponent === 0) return constant({ re: 1, im: 0 });
  const mono = new Map([[key, key.startsWith('?') ? 1 : exponent]]);
  return new Map([[monoKey(mono), { coef: { re: 1, im: 0 }, mono }]]);
}

function addTerm(out: Map<string, Term>, t: Term): void {
  const k = monoKey(t.mono);
  const old = out.get(k);
  const coef = old ? { re: old.coef.re + t.coef.re, im: old.coef.im + t.coef.im } : t.coef;
  if (isZero(coef)) out.delete(k);
  else out.set(k, { coef, mono: t.mono });
  if (out.size > maxTerms * 4) throw new GiveUp();
}

function add(p: Poly, q: Poly, sign = 1): Poly {
  const out = new Map(p);
  for (const t of q.values()) addTerm(out, sign === 1 ? t : { coef: { re: -t.coef.re, im: -t.coef.im }, mono: t.mono });
  return out;
}

function scale(p: Poly, c: Cx): Poly {
  const out = new Map<string, Term>();
  for (const t of p.values()) addTerm(out, { coef: cmul(t.coef, c), mono: t.mono });
  return out;
}

function mulMono(a: ReadonlyMap<string, number>, b: ReadonlyMap<string, number>): Map<string, number> {
  const out = new Map(a);
  for (const [k, e] of b) {
    const sum = k.startsWith('?') ? 1 : (out.get(k) ?? 0) + e;
    if (sum === 0) out.delete(k);
    else out.set(k, sum);
  }
  return out;
}

function opaque(p: Poly): Poly {
  const c = constantOf(p);
  if (c) return p;
  if (p.size === 1) return p;
  return factor(`[${polyKey(p)}]`);
}

function mul(p: Poly, q: Poly): Poly {
  if (p.size * q.size > maxTerms) return mul(opaque(p), opaque(q));
  const out = new Map<string, Term>();
  for (const x of p.values()) for (const y of q.values()) addTerm(out, { coef: cmul(x.coef, y.coef), mono: mulMono(x.mono, y.mono) });
  return out;
}

function constantOf(p: Poly): Cx | null {
  if (p.size === 0) return { re: 0, im: 0 };
  const only = p.get('');
  return p.size === 1 && only ? only.coef : null;
}

function neg(p: Poly): Poly {
  return scale(p, { re: -1, im: 0 });
}

/** The orientation of an argument for even and odd functions: x or −x, whichever sorts first; flipped tells which. */
function orient(p: Poly): { key: string; flipped: boolean } {
  const k = polyKey(p);
  const kn = polyKey(neg(p));
  return kn < k ? { key: kn, flipped: true } : { key: k, flipped: false };
}

function power(p: Poly, n: number): Poly {
  if (n === 0) return constant({ re: 1, im: 0 });
  if (p.size === 1) {
    const t = [...p.values()][0];
    let coef: Cx = { re: 1, im: 0 };
    const base = n > 0 ? t.coef : invert(t.coef);
    for (let k = 0; k < Math.abs(n); k++) coef = cmul(coef, base);
    const mono = new Map<string, number>();
    for (const [key, e] of t.mono) mono.set(key, key.startsWith('?') ? 1 : e * n);
    return new Map([[monoKey(mono), { coef, mono }]]);
  }
  if (n > 0 && p.size ** n <= maxTerms) {
    let acc = p;
    for (let k = 1; k < n; k++) acc = mul(acc, p);
    return acc;
  }
  const o = orient(p);
  const sign = o.flipped && n % 2 !== 0 ? -1 : 1;
  return scale(factor(`[${o.key}]`, n), { re: sign, im: 0 });
}

function invert(c: Cx): Cx {
  const d = c.re * c.re + c.im * c.im;
  if (d === 0) throw new GiveUp();
  return { re: c.re / d, im: -c.im / d };
}

const evenFunctions = new Set(['abs', 'cos', 'cosh']);
const oddFunctions = new Set(['sin', 'sinh', 'tanh', 'atan', 'erf', 'sign']);
/** Functions that commute with complex conjugation everywhere (entire with real coefficients, and z/|z|). */
const conjCommuting = new Set(['exp', 'sin', 'cos', 'sinh', 'cosh', 'tanh', 'sign']);
const comparisons = new Set(['lt', 'le', 'gt', 'ge', 'eq', 'ne']);

class Canonicaliser {
  private readonly bindings: Map<number, IrNode>;
  private readonly memo = new Map<IrNode, (Poly | undefined)[]>();
  private readonly realMemo = new Map<IrNode, boolean>();

  constructor(root: IrNode, private readonly complex: boolean) {
    this.bindings = collectBindings(root);
  }

  private resolve(n: IrNode): IrNode {
    let x = n;
    for (let k = 0; k < 10_000; k++) {
      if (x.op === 'var' && x.slot >= 2) {
        const b = this.bindings.get(x.slot);
        if (!b) throw new GiveUp();
        x = b;
      } else if (x.op === 'let') x = x.body;
      else return x;
    }
    throw new GiveUp();
  }

  /** True when the node's value is real wherever it is defined (so conj leaves it unchanged). */
  isReal(node: IrNode): boolean {
    if (!this.complex) return true;
    const n = this.resolve(node);
    const known = this.realMemo.get(n);
    if (known !== undefined) return known;
    let r: boolean;
    switch (n.op) {
      case 'const': r = n.im === 0; break;
      case 'var': r = true; break;
      case 'neg': r = this.isReal(n.a); break;
      case 'not': case 'lt': case 'le': case 'gt': case 'ge': case 'eq': case 'ne': case 'and': case 'or': r = true; break;
      case 'add': case 'sub': case 'mul': case 'div': r = this.isReal(n.a) && this.isReal(n.b); break;
      case 'pow': {
        const e = this.resolve(n.b);
        const wholeExponent = e.op === 'const' && e.im === 0 && Number.isInteger(e.re);
        r = this.isReal(n.a) && (wholeExponent || (this.nonNegative(n.a) && this.isReal(n.b)));
        break;
      }
      case 'cond': r = this.isReal(n.then) && this.isReal(n.otherwise); break;
      case 'call':
        switch (n.fn) {
          case 'abs': case 're': case 'im': case 'min': case 'max': case 'floor': case 'erf': r = true; break;
          case 'log': case 'sqrt': r = this.nonNegative(n.args[0]); break;
          default: r = n.args.every((a) => this.isReal(a));
        }
        break;
      default: r = false;
    }
    this.realMemo.set(n, r);
    return r;
  }

  private nonNegative(node: IrNode): boolean {
    const n = this.resolve(node);
    if (n.op === 'const') return n.im === 0 && n.re >= 0;
    if (n.op === 'call' && (n.fn === 'abs' || (n.fn === 'exp' && this.isReal(n.args[0])))) return true;
    return false;
  }

  canon(node: IrNode, swap: boolean, conj: boolean): Poly {
    const c = conj && this.complex && !this.isReal(node);
    const slot = (swap ? 1 : 0) + (c ? 2 : 0);
    let row = this.memo.get(node);
    if (!row) { row = []; this.memo.set(node, row); }
    const known = row[slot];
    if (known) return known;
    const result = this.compute(node, swap, c);
    row[slot] = result;
    return result;
  }

  private compute(n: IrNode, swap: boolean, conj: boolean): Poly {
    switch (n.op) {
      case 'const': return constant({ re: n.re, im: conj ? -n.im : n.im });
      case 'var': {
        if (n.slot >= 2) {
          const b = this.bindings.get(n.slot);
          if (!b) throw new GiveUp();
          return this.canon(b, swap, conj);
        }
        return factor((n.slot === 0) !== swap ? 't' : 's');
      }
      case 'let': return this.canon(n.body, swap, conj);
      case 'neg': return neg(this.canon(n.a, swap, conj));
      case 'add': return add(this.canon(n.a, swap, conj), this.canon(n.b, swap, conj));
      case 'sub': return add(this.canon(n.a, swap, conj), this.canon(n.b, swap, conj), -1);
      case 'mul': return mul(this.canon(n.a, swap, conj), this.canon(n.b, swap, conj));
      case 'div': {
        return mul(this.canon(n.a, swap, conj), power(this.canon(n.b, swap, conj), -1));
      }
      case 'pow': {
        const e = constantOf(this.canon(n.b, false, false));
        if (e && e.im === 0 && Number.isInteger(e.re) && Math.abs(e.re) <= 16) return power(this.canon(n.a, swap, conj), e.re);
        if (conj) return this.conjugated(n, swap);
        return factor(`pow(${polyKey(this.canon(n.a, swap, false))};${polyKey(this.canon(n.b, swap, false))})`);
      }
      case 'lt': case 'le': case 'gt': case 'ge': case 'eq': case 'ne': case 'and': case 'or': case 'not':
        return this.indicator(n, swap);
      case 'cond': {
        const a = this.canon(n.then, swap, conj);
        const b = this.canon(n.otherwise, swap, conj);
        if (this.isLogic(n.test)) return add(b, mul(this.indicator(n.test, swap), add(a, b, -1)));
        return factor(`cond(${polyKey(this.canon(n.test, swap, false))};${polyKey(a)};${polyKey(b)})`);
      }
      case 'call': return this.call(n, swap, conj);
    }
  }

  /** conj of a node the conjugate cannot be pushed into: a marked factor around its unconjugated form. */
  private conjugated(n: IrNode, swap: boolean): Poly {
    return factor(`~(${polyKey(this.canon(n, swap, false))})`);
  }

  private call(n: Extract<IrNode, { op: 'call' }>, swap: boolean, conj: boolean): Poly {
    const fn = n.fn;
    if (fn === 'conj') return this.canon(n.args[0], swap, !conj);
    if (conj && !conjCommuting.has(fn)) return this.conjugated(n, swap);
    if (fn === 'min' || fn === 'max') {
      const keys = n.args.map((a) => polyKey(this.canon(a, swap, false))).sort();
      return factor(`${fn}(${keys.join(';')})`);
    }
    const argConj = fn === 'abs' || fn === 're' || fn === 'im' ? false : conj;
    const p = this.canon(n.args[0], swap, argConj);
    if (evenFunctions.has(fn)) return factor(`${fn}(${orient(p).key})`);
    if (oddFunctions.has(fn)) {
      const o = orient(p);
      const f = factor(`${fn}(${o.key})`);
      return o.flipped ? neg(f) : f;
    }
    return factor(`${fn}(${polyKey(p)})`);
  }

  private isLogic(node: IrNode): boolean {
    const n = this.resolve(node);
    return comparisons.has(n.op) || n.op === 'and' || n.op === 'or' || n.op === 'not';
  }

  /** The 0/1 value of a comparison or a logical combination of comparisons, as a polynomial in indicators. */
  private indicator(node: IrNode, swap: boolean): Poly {
    const n = this.resolve(node);
    const one = constant({ re: 1, im: 0 });
    switch (n.op) {
      case 'not':
        return this.isLogic(n.a) ? add(one, this.indicator(n.a, swap), -1) : factor(`not(${polyKey(this.canon(n.a, swap, false))})`);
      case 'and': case 'or': {
        if (!this.isLogic(n.a) || !this.isLogic(n.b)) {
          const keys = [polyKey(this.canon(n.a, swap, false)), polyKey(this.canon(n.b, swap, false))].sort();
          return factor(`${n.op}(${keys.join(';')})`);
        }
        const x = this.indicator(n.a, swap);
        const y = this.indicator(n.b, swap);
        return n.op === 'and' ? mul(x, y) : add(add(x, y), mul(x, y), -1);
      }
      case 'lt': case 'le': case 'gt': case 'ge': case 'eq': case 'ne': {
        const a = this.canon(n.a, swap, false);
        const b = this.canon(n.b, swap, false);
        const d = n.op === 'gt' || n.op === 'ge' ? add(b, a, -1) : add(a, b, -1);
        const c = constantOf(d);
        if (n.op === 'eq' || n.op === 'ne') {
          const isEq = c ? (c.re === 0 && c.im === 0 ? one : constant({ re: 0, im: 0 })) : factor(`?eq0(${orient(d).key})`);
          return n.op === 'eq' ? isEq : add(one, isEq, -1);
        }
        if (c) return c.re < 0 ? one : constant({ re: 0, im: 0 });
        const o = orient(d);
        const lt0 = factor(`?lt0(${o.key})`);
        // D < 0 with D flipped: −D > 0, which is 1 − [−D ≤ 0], equal to 1 − [−D < 0] except where D = 0.
        return o.flipped ? add(one, lt0, -1) : lt0;
      }
      default:
        throw new GiveUp();
    }
  }
}

/**
 * True when K(t, s) and conj K(s, t) have the same canonical form: the kernel is Hermitian by construction
 * (symmetric, for a real kernel). False means only that this test could not prove it.
 */
export function isHermitianByConstruction(ir: IrFunction): boolean {
  if (ir.arity !== 2) return false;
  try {
    const c = new Canonicaliser(ir.root, ir.complex);
    return polyKey(c.canon(ir.root, false, false)) === polyKey(c.canon(ir.root, true, true));
  } catch (err) {
    if (err instanceof GiveUp || err instanceof RangeError) return false;
    throw err;
  }
}
