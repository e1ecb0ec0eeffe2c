/**
 * Properties of the parser on generated input (fast-check):
 *  - it never throws, whatever the text;
 *  - every range lies in the text and inside its parent's; diagnostics are in order, one per position;
 *  - printing is a fixed point, and parsing the printed text gives back the tree (up to parentheses);
 *  - its precedence and associativity agree with an independent parser, mathjs's: the printed text of a generated
 *    tree, evaluated by mathjs, equals the value of the tree our parser reads from that text.
 */
import fc from 'fast-check';
import { all, create } from 'mathjs';
import { describe, expect, it } from 'vitest';
import type { BinaryOp, Expr, SourceFile, UnaryOp } from '../../src-core/syntax';
import { parse, parseExpression } from '../../src-core/syntax/parser';
import { printExpr } from '../../src-core/syntax/printer';
import { allExprs, rangePairs } from './treeText';

const nowhere = { start: 0, end: 0 };

// ---------- generated text ----------

const tokenTexts = [
  'domain', 'const', 'fn', 'kernel', 'expect', 'on', 'and', 'or', 'not', 't', 's', 'σ', 'min', 'exp',
  '2', '0.5', '.5', '3e-4', '1e', '1.2.3', '+', '-', '*', '/', '^', '<', '<=', '>', '>=', '==', '!=', '=', '?',
  ':', ',', '(', ')', '[', ']', '{', '}', '.', '%', '!', ';', '&&', '||', '=>', '**', '"', "'", '$', '@', '×',
  '\uD800', '\u200B', '\uFEFF', 'hilbert-schmidt', ' ', ' ', '  ', '\t', '\n', '\n', '\r\n', '\r', '# note\n',
];
const tokenSoup = fc.array(fc.constantFrom(...tokenTexts), { maxLength: 80 }).map((parts) => parts.join(''));
const declarationSoup = fc
  .array(
    fc.tuple(
      fc.constantFrom('domain ', 'const c = ', 'fn f(x) = ', 'kernel k(t, s) = ', 'kernel k(t, s) on [0, 1] = ', '  ', 'expect ', '  expect '),
      tokenSoup,
    ),
    { maxLength: 6 },
  )
  .map((lines) => lines.map(([head, rest]) => head + rest).join('\n'));
const anyText = fc.oneof(
  fc.string({ unit: 'binary', maxLength: 200 }),
  fc.string({ unit: 'grapheme', maxLength: 200 }),
  tokenSoup,
  declarationSoup,
);

function checkWellFormed(file: SourceFile): void {
  const n = file.text.length;
  let previousStart = -1;
  for (const d of file.diagnostics) {
    expect(d.range.start).toBeGreaterThanOrEqual(0);
    expect(d.range.end).toBeLessThanOrEqual(n);
    expect(d.range.start).toBeLessThanOrEqual(d.range.end);
    expect(d.range.start).toBeGreaterThan(previousStart); // in order, at most one per position
    expect(d.code).toMatch(/^KW1\d\d$/);
    expect(d.message).not.toMatch(/\{\w+\}/); // every placeholder filled
    previousStart = d.range.start;
  }
  for (const { parent, child, what } of rangePairs(file)) {
    const inside = parent.start <= child.start && child.end <= parent.end && child.start <= child.end;
    expect(inside, `${what}: ${JSON.stringify(child)} in ${JSON.stringify(parent)}`).toBe(true);
  }
  let previousEnd = 0;
  for (const d of file.declarations) {
    expect(d.range.start).toBeGreaterThanOrEqual(previousEnd);
    previousEnd = d.range.end;
  }
  for (const c of file.comments) expect(file.text.slice(c.range.start, c.range.end)).toBe(`#${c.text}`);
}

describe('parse on any text', () => {
  it('never throws, and returns a well-formed tree', () => {
    fc.assert(
      fc.property(anyText, (text) => {
        checkWellFormed(parse(text));
      }),
      { numRuns: 1500 },
    );
  });

  it('parseExpression never throws, and its ranges lie in the text', () => {
    fc.assert(
      fc.property(anyText, (text) => {
        const { expr, diagnostics } = parseExpression(text);
        expect(expr.range.start).toBeGreaterThanOrEqual(0);
        expect(expr.range.end).toBeLessThanOrEqual(text.length);
        for (const d of diagnostics) expect(d.range.end).toBeLessThanOrEqual(text.length);
      }),
      { numRuns: 800 },
    );
  });
});

describe('errors and declarations', () => {
  it('a declaration holds an error node or an empty name only if one of its diagnostics lies in it', () => {
    fc.assert(
      fc.property(declarationSoup, (text) => {
        const file = parse(text);
        for (const d of file.declarations) {
          const own: SourceFile = { ...file, declarations: [d] };
          const holes =
            allExprs(own).some((e) => e.kind === 'error') ||
            ('name' in d && d.name.text === '') ||
            (d.kind !== 'domain' && d.kind !== 'const' && d.params.some((p) => p.text === ''));
          const diagnosed = file.diagnostics.some((g) => d.range.start <= g.range.start && g.range.end <= d.range.end);
          if (holes) expect(diagnosed, JSON.stringify(text)).toBe(true);
        }
      }),
      { numRuns: 1500 },
    );
  });

  it('every diagnostic lies in a declaration, except those about lines that make none', () => {
    fc.assert(
      fc.property(declarationSoup, (text) => {
        const file = parse(text);
        const orphanStarts = file.diagnostics.filter((g) => g.code === 'KW109').map((g) => g.range.start);
        for (const g of file.diagnostics) {
          if (['KW106', 'KW109', 'KW110'].includes(g.code)) continue;
          const inDeclaration = file.declarations.some((d) => d.range.start <= g.range.start && g.range.end <= d.range.end);
          const inOrphanClause = orphanStarts.some((start) => start < g.range.start);
          expect(inDeclaration || inOrphanClause, JSON.stringify(text)).toBe(true);
        }
      }),
      { numRuns: 1500 },
    );
  });
});

// ---------- generated trees ----------

const number = fc
  .constantFrom('0', '2', '10', '0.5', '.5', '3e-4', '1.5E+2', '2.25')
  .map((raw): Expr => ({ kind: 'number', range: nowhere, raw, value: Number(raw) }));
const name = fc
  .constantFrom('t', 's', 'x', 'σ', 'ℓ_2', 'pi', 'e', 'i')
  .map((n): Expr => ({ kind: 'ident', range: nowhere, name: n }));
const arithmeticOps: BinaryOp[] = ['+', '-', '*', '/', '^'];
const comparisonOps: BinaryOp[] = ['<', '<=', '>', '>=', '==', '!='];
const logicOps: BinaryOp[] = ['and', 'or'];

const unary = (op: UnaryOp, operand: Expr): Expr => ({ kind: 'unary', range: nowhere, op, opRange: nowhere, operand });
const binary = (op: BinaryOp, left: Expr, right: Expr): Expr => ({
  kind: 'binary', range: nowhere, op, opRange: nowhere, left, right,
});
const cond = (test: Expr, then: Expr, otherwise: Expr): Expr => ({ kind: 'cond', range: nowhere, test, then, otherwise });

/** Trees of every form; `withNot` adds the `not` operator, `bareThen` allows a conditional as a first branch. */
function trees(leaf: fc.Arbitrary<Expr>, options: { withNot: boolean; withCalls: boolean; bareThen: boolean }) {
  const unaryOps: UnaryOp[] = options.withNot ? ['-', '+', 'not'] : ['-', '+'];
  return fc.letrec<{ expr: Expr; notCond: Expr }>((tie) => {
    const forms = [
      leaf,
      fc.tuple(fc.constantFrom(...unaryOps), tie('expr')).map(([op, e]) => unary(op, e)),
      fc
        .tuple(fc.constantFrom(...arithmeticOps, ...comparisonOps, ...logicOps), tie('expr'), tie('expr'))
        .map(([op, l, r]) => binary(op, l, r)),
      fc.tuple(tie('expr'), options.bareThen ? tie('expr') : tie('notCond'), tie('expr')).map(([c, a, b]) => cond(c, a, b)),
      fc.record({ inner: tie('expr') }).map(({ inner }): Expr => ({ kind: 'paren', range: nowhere, inner })),
    ];
    if (options.withCalls) {
      forms.push(
        fc
          .tuple(fc.constantFrom('min', 'exp', 'f'), fc.array(tie('expr'), { maxLength: 3 }))
          .map(([callee, args]): Expr => ({ kind: 'call', range: nowhere, callee, calleeRange: nowhere, args })),
      );
    }
    return {
      expr: fc.oneof({ depthSize: 'small', withCrossShrink: true }, ...forms),
      notCond: fc.oneof({ depthSize: 'small' }, ...forms.filter((_, i) => i !== 3 && i !== 4)),
    };
  }).expr;
}

/** The tree without its parentheses, as an s-expression. */
function shape(e: Expr): string {
  switch (e.kind) {
    case 'number': return e.raw;
    case 'ident': return e.name;
    case 'error': return 'error';
    case 'paren': return shape(e.inner);
    case 'unary': return `(${e.op} ${shape(e.operand)})`;
    case 'binary': return `(${e.op} ${shape(e.left)} ${shape(e.right)})`;
    case 'call': return `(${[e.callee, ...e.args.map(shape)].join(' ')})`;
    case 'cond': return `(? ${shape(e.test)} ${shape(e.then)} ${shape(e.otherwise)})`;
  }
}

describe('printing and parsing', () => {
  it('printExpr is a fixed point, and the printed text parses back to the same tree', () => {
    fc.assert(
      fc.property(trees(fc.oneof(number, name), { withNot: true, withCalls: true, bareThen: true }), (tree) => {
        const printed = printExpr(tree);
        const { expr, diagnostics } = parseExpression(printed);
        expect(diagnostics).toEqual([]);
        expect(printExpr(expr)).toBe(printed);
        expect(shape(expr)).toBe(shape(tree));
      }),
      { numRuns: 1500 },
    );
  });
});

// ---------- agreement with mathjs ----------

// relTol must be positive in mathjs; 1e-300 makes == exact. `predictable` keeps powers of negative numbers real.
const math = create(all, { relTol: 1e-300, absTol: 0, predictable: true });
const truthy = (x: number) => x !== 0 && !Number.isNaN(x);

function evaluate(e: Expr): number {
  switch (e.kind) {
    case 'number': return e.value;
    case 'paren': return evaluate(e.inner);
    case 'unary': return e.op === '-' ? -evaluate(e.operand) : e.op === '+' ? evaluate(e.operand) : Number(!truthy(evaluate(e.operand)));
    case 'cond': return truthy(evaluate(e.test)) ? evaluate(e.then) : evaluate(e.otherwise);
    case 'binary': {
      const a = evaluate(e.left);
      const b = evaluate(e.right);
      switch (e.op) {
        case '+': return a + b;
        case '-': return a - b;
        case '*': return a * b;
        case '/': return a / b;
        case '^': return Number(math.pow(a, b));
        case '<': return Number(a < b);
        case '<=': return Number(a <= b);
        case '>': return Number(a > b);
        case '>=': return Number(a >= b);
        case '==': return Number(a === b);
        case '!=': return Number(a !== b);
        case 'and': return Number(truthy(a) && truthy(b));
        case 'or': return Number(truthy(a) || truthy(b));
      }
    }
  }
  throw new Error(`cannot evaluate ${e.kind}`);
}

describe('precedence and associativity agree with mathjs', () => {
  // mathjs gives `not` a higher precedence than comparisons (we follow the and/or/not order of most languages),
  // and reads a bare conditional in the first branch of another as a range; both are left out here.
  it('on generated arithmetic, comparison, logic and conditional expressions', () => {
    fc.assert(
      fc.property(trees(number, { withNot: false, withCalls: false, bareThen: false }), (tree) => {
        const printed = printExpr(tree);
        const { expr, diagnostics } = parseExpression(printed);
        expect(diagnostics).toEqual([]);
        const ours = evaluate(expr);
        const theirs = Number(math.evaluate(printed));
        expect(Number.isNaN(ours) ? Number.isNaN(theirs) : ours === theirs, `${printed}: ${ours} vs ${theirs}`).toBe(true);
      }),
      { numRuns: 1500 },
    );
  });

  it('on the classic cases', () => {
    for (const text of ['-2 ^ 2', '2 ^ 3 ^ 2', '2 ^ -1 ^ 2', '8 / 4 / 2', '10 - 4 - 3', '2 + 3 * 4', '0 or 1 and 0', '1 ? 2 : 0 ? 3 : 4']) {
      expect(evaluate(parseExpression(text).expr), text).toBe(Number(math.evaluate(text)));
    }
  });
});
