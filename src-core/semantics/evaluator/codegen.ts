/**
 * Compiles an IR function to JavaScript with `new Function`: one generated module holding three entries (a point,
 * columns of points, and the tensor grid of a kernel), each with the whole per-point body inlined in its loop so
 * the JIT sees straight-line arithmetic on doubles and nothing is allocated per point.
 *
 * Safety: the generated source is built only from emitBody.ts's output (fixed text, numeric literals, counter
 * names) and the fixed names below. Every helper (Math functions, erf, the complex helpers and their result
 * array) is passed in as a parameter of the generated function, so the code refers to no global at all; it runs in
 * strict mode. Unknown ops or builtin names are internal errors (irShape.ts) before any code is made.
 */
import type { IrFunction } from '../ir';
import { catan, ccos, ccosh, cdiv, clog, complexOut, cpow, csign, csin, csinh, csqrt, ctan, ctanh } from './complexMath';
import { emitBody, type Operand } from './emitBody';
import { erf } from './erf';
import type { CompiledFunction, CompiledKernel, Complex } from './evalTypes';
import { analyzeIr, internalError, type IrShape } from './irShape';

/** The only free names generated code can use, with what they are bound to. */
const helperTable: readonly (readonly [string, unknown])[] = [
  ['exp', Math.exp], ['log', Math.log], ['sqrt', Math.sqrt], ['abs', Math.abs], ['sin', Math.sin], ['cos', Math.cos],
  ['tan', Math.tan], ['sinh', Math.sinh], ['cosh', Math.cosh], ['tanh', Math.tanh], ['atan', Math.atan],
  ['sign', Math.sign], ['floor', Math.floor], ['min', Math.min], ['max', Math.max], ['pow', Math.pow],
  ['hypot', Math.hypot], ['erf', erf],
  ['clog', clog], ['csqrt', csqrt], ['csin', csin], ['ccos', ccos], ['ctan', ctan], ['csinh', csinh],
  ['ccosh', ccosh], ['ctanh', ctanh], ['catan', catan], ['cpow', cpow], ['cdiv', cdiv], ['csign', csign],
  ['o', complexOut],
];

export const helperNames: readonly string[] = helperTable.map(([name]) => name);

export interface GeneratedSource {
  readonly shape: IrShape;
  /** Parameter names of the generated function (the helpers), in order. */
  readonly parameters: readonly string[];
  readonly source: string;
  readonly hasGrid: boolean;
}

function storeLines(result: Operand, complex: boolean, index: string): string[] {
  const lines = [`outRe[${index}] = ${result.re};`];
  if (complex) lines.push(`outIm[${index}] = ${result.im ?? '0'};`);
  return lines;
}

function indentAll(lines: readonly string[], indent: string): string {
  return lines.map((l) => indent + l).join('\n');
}

/** The JavaScript source of the compiled function (exported for inspection and tests). */
export function generateSource(fn: IrFunction): GeneratedSource {
  const shape = analyzeIr(fn);
  const arity = fn.arity;
  const argNames = Array.from({ length: arity }, (_, k) => `x${k}`);
  const { lines, result } = emitBody(shape, argNames);
  const complex = !shape.realPath;
  const hasGrid = arity === 2;

  const pointArgs = argNames.map((x, k) => `  const ${x} = a[${k}];`);
  const columnHeads = argNames.map((_, k) => `  const c${k} = c[${k}];`);
  const columnArgs = argNames.map((x, k) => `    const ${x} = c${k}[k];`);
  const parts = [
    "'use strict';",
    'function point(a, res) {',
    ...pointArgs,
    indentAll(lines, '  '),
    `  res[0] = ${result.re};`,
    `  res[1] = ${complex ? result.im ?? '0' : '0'};`,
    '}',
    'function columns(c, outRe, outIm) {',
    ...columnHeads,
    '  const n = outRe.length;',
    '  for (let k = 0; k < n; k++) {',
    ...columnArgs,
    indentAll(lines, '    '),
    indentAll(storeLines(result, complex, 'k'), '    '),
    '  }',
    '}',
  ];
  if (hasGrid) {
    parts.push(
      'function grid(ts, ss, outRe, outIm) {',
      '  const nt = ts.length, ns = ss.length;',
      '  for (let p = 0; p < nt; p++) {',
      '    const x0 = ts[p];',
      '    const base = p * ns;',
      '    for (let q = 0; q < ns; q++) {',
      '      const x1 = ss[q];',
      indentAll(lines, '      '),
      indentAll(storeLines(result, complex, 'base + q'), '      '),
      '    }',
      '  }',
      '}',
      'return [point, columns, grid];',
    );
  } else {
    parts.push('return [point, columns, null];');
  }
  return { shape, parameters: helperNames, source: parts.join('\n'), hasGrid };
}

type PointFn = (a: readonly number[], res: Float64Array) => void;
type ColumnsFn = (c: readonly Float64Array[], outRe: Float64Array, outIm: Float64Array | null) => void;
type GridFn = (ts: Float64Array, ss: Float64Array, outRe: Float64Array, outIm: Float64Array | null) => void;

function instantiate(generated: GeneratedSource): [PointFn, ColumnsFn, GridFn | null] {
  // The source is built from fixed text, numeric literals and generated names only (see the header).
  const factory = new Function(...generated.parameters, generated.source) as (...helpers: unknown[]) => [PointFn, ColumnsFn, GridFn | null];
  return factory(...helperTable.map(([, value]) => value));
}

/** The outputs hold `length` values (outIm too, on the complex path). */
function checkOut(complex: boolean, outRe: Float64Array, outIm: Float64Array | null, length: number): void {
  if (outRe.length < length) throw new RangeError(`outRe has ${outRe.length} entries, ${length} needed`);
  if (complex && (outIm === null || outIm.length < length)) throw new RangeError(`outIm must hold ${length} entries`);
}

function build(fn: IrFunction): CompiledKernel | CompiledFunction {
  const generated = generateSource(fn);
  const [point, columns, grid] = instantiate(generated);
  const complex = !generated.shape.realPath;
  const arity = fn.arity;
  const scratch = new Float64Array(2);
  const compiled: CompiledFunction = {
    arity,
    complex,
    evaluate(args: readonly number[]): Complex {
      if (args.length < arity) throw new RangeError(`expected ${arity} arguments, got ${args.length}`);
      point(args, scratch);
      return { re: scratch[0], im: scratch[1] };
    },
    evaluateColumns(cols: readonly Float64Array[], outRe: Float64Array, outIm: Float64Array | null): void {
      if (cols.length < arity) throw new RangeError(`expected ${arity} columns, got ${cols.length}`);
      for (let k = 0; k < arity; k++) {
        if (cols[k].length < outRe.length) throw new RangeError(`column ${k} is shorter than outRe`);
      }
      checkOut(complex, outRe, outIm, outRe.length);
      columns(cols, outRe, outIm);
    },
  };
  if (!grid) return compiled;
  return {
    ...compiled,
    evaluateGrid(ts: Float64Array, ss: Float64Array, outRe: Float64Array, outIm: Float64Array | null): void {
      checkOut(complex, outRe, outIm, ts.length * ss.length);
      grid(ts, ss, outRe, outIm);
    },
  };
}

/** Compiles a function of `fn.arity` arguments (slot k = argument k). */
export function compileFunction(fn: IrFunction): CompiledFunction {
  return build(fn);
}

/** Compiles a kernel K(t, s): arity 2, slot 0 = t, slot 1 = s. */
export function compileKernel(fn: IrFunction): CompiledKernel {
  if (fn.arity !== 2) throw internalError(`a kernel has arity 2, not ${fn.arity}`);
  return build(fn) as CompiledKernel;
}
