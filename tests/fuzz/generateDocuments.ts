/**
 * Seeded generator and mutator of kernel documents (.kw files), for the fuzz test in the suite (fuzz.test.ts) and
 * the long run outside it (fuzz/run.ts). Everything here is a pure function of a seed: the same seed gives the same
 * document on every machine, so a failing document can always be regenerated from the seed that the run printed.
 *
 * generateDocument(seed) writes a well-formed file in the format of README.md ("The kernel file format"): an
 * optional `domain` line, constants (real, complex, extreme: 1e-300, 1e300, 1e17), `fn` helpers of 1–3 parameters
 * that call earlier helpers (nested, and partial applications such as `f(s)` or `g(x, 2)`), kernels with and
 * without their own domain, `expect` claims, conditionals, abs/min/max/floor/sign/log/sqrt/powers/exp, complex
 * values, and singular kernels (log|t − s|, |t − s|^(−α), 1/(t − s)). mutateDocument(text, seed, pieces) damages a
 * document: deletes, inserts, duplicates and swaps tokens and lines, flips characters, truncates, and splices in
 * pieces of other files (the examples). The mutator works on code points and never writes a NUL, so the result
 * is still a text file (the command-line program refuses binary files as a whole, which is not what we test).
 */

/** A small seeded generator (mulberry32): fast, 32-bit state, good enough to pick among choices. */
export class Rng {
  private state: number;

  constructor(seed: number) {
    this.state = (seed >>> 0) ^ 0x9e3779b9;
  }

  /** A float in [0, 1). */
  next(): number {
    let t = (this.state = (this.state + 0x6d2b79f5) >>> 0);
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  }

  /** An integer in [lo, hi]. */
  int(lo: number, hi: number): number {
    return lo + Math.floor(this.next() * (hi - lo + 1));
  }

  pick<T>(xs: readonly T[]): T {
    return xs[Math.floor(this.next() * xs.length)];
  }

  chance(p: number): boolean {
    return this.next() < p;
  }
}

interface HelperSig {
  readonly name: string;
  readonly arity: number;
}

interface Scope {
  /** Variables usable here: t and s in a kernel, the parameters in a helper, none in a constant. */
  readonly vars: readonly string[];
  readonly consts: readonly string[];
  readonly helpers: readonly HelperSig[];
  /** The imaginary unit and complex constants may appear. */
  readonly complex: boolean;
}

const plainNumbers = ['0', '1', '2', '0.5', '.25', '3', '1.5', '10', '3e-4', '1.5E+2', '0.1', '7'];
/** Values near the ends of the double range and arguments that have made loops run long. */
const extremeNumbers = ['1e-300', '1e300', '1e17', '1e308', '1e-320', '5e-324', '1e100', '1e-12', '1e15', '700', '1e6'];
const unaryReal = ['exp', 'log', 'sqrt', 'sin', 'cos', 'tan', 'sinh', 'cosh', 'tanh', 'atan', 'abs', 'sign', 'floor', 'erf'];
const unaryComplex = ['conj', 're', 'im', 'exp', 'abs', 'cos', 'sin'];
const comparisons = ['<', '<=', '>', '>=', '==', '!='];

function numberLeaf(r: Rng): string {
  return r.chance(0.12) ? r.pick(extremeNumbers) : r.pick(plainNumbers);
}

function leaf(r: Rng, sc: Scope): string {
  const roll = r.next();
  if (sc.vars.length > 0 && roll < 0.5) return r.pick(sc.vars);
  if (sc.consts.length > 0 && roll < 0.65) return r.pick(sc.consts);
  if (roll < 0.7) return r.pick(['pi', 'e']);
  if (sc.complex && roll < 0.78) return 'i';
  return numberLeaf(r);
}

/** A real-valued expression for comparisons and the real-only built-ins. */
function realExpr(r: Rng, sc: Scope, depth: number): string {
  return expr(r, { ...sc, complex: false, consts: sc.complex ? [] : sc.consts, helpers: sc.complex ? [] : sc.helpers }, depth);
}

export function expr(r: Rng, sc: Scope, depth: number): string {
  if (depth <= 0 || r.chance(0.2)) return leaf(r, sc);
  const d = depth - 1;
  switch (r.int(0, 13)) {
    case 0:
    case 1:
      return `${expr(r, sc, d)} ${r.pick(['+', '-', '*', '/'])} ${expr(r, sc, d)}`;
    case 2:
      return `(${expr(r, sc, d)} ${r.pick(['+', '-'])} ${expr(r, sc, d)})`;
    case 3:
      return `${r.pick(['', '-', '+'])}${leaf(r, sc)}^${r.pick(['2', '3', '0.5', '-1', '-0.5', '(-0.25)', '1.5', leaf(r, sc)])}`;
    case 4:
      return `${r.pick(unaryReal)}(${realExpr(r, sc, d)})`;
    case 5:
      return sc.complex ? `${r.pick(unaryComplex)}(${expr(r, sc, d)})` : `exp(-${realExpr(r, sc, d)})`;
    case 6: {
      const n = r.int(2, 3);
      const args = Array.from({ length: n }, () => realExpr(r, sc, d));
      return `${r.pick(['min', 'max'])}(${args.join(', ')})`;
    }
    case 7:
      return `(${realExpr(r, sc, d)} ${r.pick(comparisons)} ${realExpr(r, sc, d)} ? ${expr(r, sc, d)} : ${expr(r, sc, d)})`;
    case 8: {
      const test = `${realExpr(r, sc, 0)} ${r.pick(comparisons)} ${realExpr(r, sc, 0)}`;
      const more = r.chance(0.5) ? ` ${r.pick(['and', 'or'])} ${r.chance(0.3) ? 'not ' : ''}${realExpr(r, sc, 0)} < ${numberLeaf(r)}` : '';
      return `(${test}${more})`;
    }
    case 9:
    case 10: {
      if (sc.helpers.length === 0) return `abs(${realExpr(r, sc, d)})`;
      const h = r.pick(sc.helpers);
      // Partial application: a helper applied to one variable only, or to a mix of variables and constants.
      const args = Array.from({ length: h.arity }, () => (r.chance(0.4) ? leaf(r, sc) : expr(r, sc, d)));
      return `${h.name}(${args.join(', ')})`;
    }
    case 11:
      return `floor(${realExpr(r, sc, 0)} ${r.pick(['+', '*'])} ${r.pick(['1e17', '1e9', '3', '1e300', '0.5', '1e6'])})`;
    case 12:
      return `${r.pick(['log', 'sqrt'])}(abs(${realExpr(r, sc, 0)} - ${realExpr(r, sc, 0)}))`;
    default:
      return `(${expr(r, sc, d)})`;
  }
}

const singularBodies = [
  'log(abs(t - s))',
  'abs(t - s)^(-0.5)',
  'abs(t - s)^(-0.9)',
  '1 / abs(t - s)',
  '1 / (t - s)',
  'abs(t - s)^(-1.5)',
  '(t + s)^(-0.5)',
  'log(t + s)',
  '1 / sqrt(abs(t - 0.5))',
  'abs(t - s)^(-0.25) * exp(-t * s)',
  'min(t, s)^(-1)',
  't / s',
];

const extremeBodies = [
  '1e-300',
  '1e-300 * t * s',
  '1e300 * exp(t + s)',
  'exp(700 * t * s)',
  'exp(1e3 * (t - s))',
  'floor(s + 1e17)',
  'floor(1e17 * t) - floor(1e17 * s)',
  'floor(1e9 * (t - s))',
  '1e308 * t + 1e308 * s',
  '5e-324',
  'sin(1e15 * t) * sin(1e15 * s)',
  'tan(t * s * 1e6)',
  '(t - s)^1e6',
  'exp(-1e300 * (t - s)^2)',
];

const claims = ['hermitian', 'positive', 'continuous', 'bounded', 'hilbert-schmidt'];

function claimList(r: Rng): string {
  const n = r.int(1, 4);
  const out: string[] = [];
  for (let k = 0; k < n; k++) {
    switch (r.int(0, 4)) {
      case 0: out.push(`norm ${r.pick(['<', '<='])} ${r.pick(['0.5', '2', '1e-300', '1e300', '0.045', '1'])}`); break;
      case 1: out.push(`rank ${r.pick(['=', '<='])} ${r.int(0, 6)}`); break;
      case 2: out.push(`resolvent ${r.pick(['0.5', '2', '-1', '1 + i', '0', '1e-300'])}`); break;
      default: out.push(r.pick(claims));
    }
  }
  return out.join(', ');
}

function domainText(r: Rng): string {
  const pairs = [['0', '1'], ['0', '2'], ['-1', '1'], ['0', 'pi'], ['0', '1e-300'], ['-1e300', '1e300'], ['1', '0'], ['0', '1e6'], ['0.25', '0.75'], ['0', '0']];
  const [a, b] = r.pick(pairs);
  return `[${a}, ${b}]`;
}

/** A well-formed document (it may still have name or evaluation problems: a constant used before a cycle, …). */
export function generateDocument(seed: number): string {
  const r = new Rng(seed);
  const lines: string[] = [`# fuzz document, seed ${seed}`];
  if (r.chance(0.85)) lines.push(`domain ${domainText(r)}`);
  const complexFile = r.chance(0.25);
  const consts: string[] = [];
  for (let k = 0, n = r.int(0, 3); k < n; k++) {
    const name = r.pick(['c', 'ell', 'σ', 'ℓ', 'amp', 'rate']) + k;
    const value = r.chance(0.3) ? r.pick(extremeNumbers) : expr(r, { vars: [], consts, helpers: [], complex: complexFile && r.chance(0.3) }, 2);
    lines.push(`const ${name} = ${value}${r.chance(0.3) ? '   # m²/s' : ''}`);
    consts.push(name);
  }
  const helpers: HelperSig[] = [];
  for (let k = 0, n = r.int(0, 3); k < n; k++) {
    const arity = r.int(1, 3);
    const params = ['x', 'y', 'z'].slice(0, arity);
    const body = expr(r, { vars: params, consts, helpers, complex: complexFile }, 3);
    const name = `h${k}`;
    lines.push(`fn ${name}(${params.join(', ')}) = ${body}`);
    helpers.push({ name, arity });
  }
  for (let k = 0, n = r.int(1, 3); k < n; k++) {
    const sc: Scope = { vars: ['t', 's'], consts, helpers, complex: complexFile };
    const roll = r.next();
    let body: string;
    if (roll < 0.12) body = r.pick(singularBodies);
    else if (roll < 0.22) body = r.pick(extremeBodies);
    else if (roll < 0.3) body = `${r.pick(singularBodies)} ${r.pick(['+', '*'])} ${expr(r, sc, 2)}`;
    else body = expr(r, sc, r.int(1, 4));
    const on = r.chance(0.25) ? ` on ${domainText(r)}` : '';
    lines.push(`kernel k${k}(t, s)${on} = ${body}`);
    for (let c = 0, m = r.int(0, 2); c < m; c++) lines.push(`${r.chance(0.8) ? '  ' : ''}expect ${claimList(r)}`);
  }
  return `${lines.join('\n')}\n`;
}

const tokenPattern = /\s+|#[^\n]*|[\p{L}_][\p{L}\p{M}\p{Nd}_]*|\d*\.?\d+(?:[eE][+-]?\d+)?|<=|>=|==|!=|&&|\|\||\*\*|=>|[^]/gu;

/** Tokens for insertion: keywords, operators, punctuation, numbers, names, and things the format rejects. */
export const insertable: readonly string[] = [
  'domain', 'const', 'fn', 'kernel', 'expect', 'on', 'and', 'or', 'not', 't', 's', 'x', 'i', 'pi', 'e',
  '+', '-', '*', '/', '^', '(', ')', '[', ']', ',', '=', '<', '<=', '==', '?', ':', '.', '%', '!', ';', '&&', '**',
  '{', '}', '"str"', "'", '\n', '\n  ', '\t', ' ', '#', '0', '1e-300', '1e300', '1e999', '1e', '0x1F', '..', '1.2.3',
  'exp', 'log', 'floor', 'min', 'max', 'abs', 'conj', 'hermitian', 'norm', 'rank', 'resolvent',
  'σ', 'ℓ', '\u00a0', '\u200b', '\ufeff', '\r', '\r\n', '😀', 'é', 'e\u0301',
];

/** Replacement characters for flips: printable ASCII, tabs and line ends, a few non-ASCII letters and spaces. */
function flipChar(r: Rng): string {
  const roll = r.next();
  if (roll < 0.7) return String.fromCharCode(r.int(32, 126));
  return r.pick(['\t', '\n', '\r', '\u00a0', '\u2028', 'σ', 'ℓ', '😀', '\u0301', '\u00ff', '\u007f', '\u0001', '\ufffd']);
}

/** Splits into code points so that a mutation never leaves half a surrogate pair behind. */
function codePoints(text: string): string[] {
  return Array.from(text);
}

function mutateOnce(text: string, r: Rng, pieces: readonly string[]): string {
  const op = r.int(0, 11);
  if (op <= 3) {
    const tokens = text.match(tokenPattern) ?? [];
    if (tokens.length === 0) return r.pick(insertable);
    const k = r.int(0, tokens.length - 1);
    if (op === 0) tokens.splice(k, 1);
    else if (op === 1) tokens.splice(k, 0, r.pick(insertable));
    else if (op === 2) tokens.splice(k, 0, tokens[k]);
    else {
      const j = r.int(0, tokens.length - 1);
      [tokens[k], tokens[j]] = [tokens[j], tokens[k]];
    }
    return tokens.join('');
  }
  if (op <= 6) {
    const lines = text.split('\n');
    const k = r.int(0, lines.length - 1);
    if (op === 4) lines.splice(k, 1);
    else if (op === 5) lines.splice(k, 0, lines[k]);
    else {
      const j = r.int(0, lines.length - 1);
      [lines[k], lines[j]] = [lines[j], lines[k]];
    }
    return lines.join('\n');
  }
  if (op <= 8) {
    const cps = codePoints(text);
    if (cps.length === 0) return flipChar(r);
    cps[r.int(0, cps.length - 1)] = flipChar(r);
    return cps.join('');
  }
  if (op === 9) {
    const cps = codePoints(text);
    return cps.slice(0, r.int(0, cps.length)).join('');
  }
  // Splice a few lines of another file (an example) in at a line boundary.
  if (pieces.length === 0) return text;
  const src = r.pick(pieces).split('\n');
  const from = r.int(0, src.length - 1);
  const piece = src.slice(from, from + r.int(1, 4)).join('\n');
  const lines = text.split('\n');
  lines.splice(r.int(0, lines.length), op === 10 ? 0 : 1, piece);
  return lines.join('\n');
}

/** Applies 1–4 random mutations. Never produces a NUL character. */
export function mutateDocument(text: string, seed: number, pieces: readonly string[] = []): string {
  const r = new Rng(seed ^ 0x5bd1e995);
  let out = text;
  for (let k = 0, n = r.int(1, 4); k < n; k++) out = mutateOnce(out, r, pieces);
  return out.replace(/\0/g, ' ');
}

export interface FuzzDocument {
  readonly seed: number;
  readonly kind: 'generated' | 'mutated' | 'mutated example';
  readonly text: string;
}

/**
 * Document number `seed` of a run: a generated document (40 %), a mutated generated document (45 %) or a mutated
 * example (15 %, when examples are given).
 */
export function fuzzDocument(seed: number, examples: readonly string[] = []): FuzzDocument {
  const r = new Rng(seed * 2654435761);
  const roll = r.next();
  if (roll < 0.4) return { seed, kind: 'generated', text: generateDocument(seed) };
  if (roll < 0.85 || examples.length === 0) return { seed, kind: 'mutated', text: mutateDocument(generateDocument(seed), seed, examples) };
  return { seed, kind: 'mutated example', text: mutateDocument(r.pick(examples), seed, examples) };
}
