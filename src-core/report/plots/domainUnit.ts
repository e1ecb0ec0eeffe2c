/**
 * The unit of a kernel's variables, read from the notes the author wrote: the trailing comment of the `domain` line
 * (`domain [0, 3]   # mm across the slit`), or the note of a constant that bounds the domain
 * (`const rod_length = 0.8   # m` with `on [0, rod_length]`). The unit is the note's first word when that word looks
 * like a unit (letters, digits, /, ^, ·, ², …; at most 12 characters; not an ordinary word such as “the”); otherwise
 * the axes are plain `t` and `s`.
 */
import type { Expr, Interval, SourceFile } from '../../syntax/ast';
import type { FileModel, KernelSymbol } from '../../semantics/model';
import type { AxisNames } from './plotTypes';

const notUnits = new Set([
  'a', 'an', 'the', 'of', 'in', 'on', 'at', 'for', 'from', 'to', 'per', 'by', 'along', 'across', 'over', 'between',
  'with', 'is', 'are', 'was', 'this', 'that', 'these', 'and', 'or', 'not', 'no', 'see', 'note', 'todo', 'fixme',
  'unit', 'units', 'length', 'width', 'domain', 'distance', 'position', 'positions', 'time', 'interval', 'scaled',
]);

const unitPattern = /^[\p{L}µ°Å%][\p{L}\p{N}µ°Å%·/^²³⁻⁰¹⁴⁵⁶⁷⁸⁹()*.\-]{0,11}$/u;

/** The unit a note starts with, or null. */
export function unitOfNote(note: string | undefined): string | null {
  if (note === undefined) return null;
  const first = note.trim().split(/\s+/)[0] ?? '';
  let word = first.replace(/[,;:]+$/, '');
  const wrapped = /^[([](.+)[)\]]$/.exec(word);
  if (wrapped) word = wrapped[1];
  if (word === '' || !unitPattern.test(word) || notUnits.has(word.toLowerCase())) return null;
  return word;
}

/** The text of a `#` comment that starts on the same line as `offset`, after it; or undefined. */
function trailingComment(source: SourceFile, offset: number): string | undefined {
  for (const c of source.comments) {
    if (c.range.start < offset) continue;
    const between = source.text.slice(offset, c.range.start);
    if (/[\r\n]/.test(between)) return undefined;
    return c.text;
  }
  return undefined;
}

function boundNote(bound: Expr, model: FileModel): string | undefined {
  let e: Expr = bound;
  while (e.kind === 'paren') e = e.inner;
  if (e.kind === 'unary' && (e.op === '-' || e.op === '+')) return boundNote(e.operand, model);
  if (e.kind !== 'ident') return undefined;
  const symbol = model.symbols.get(e.name);
  return symbol?.kind === 'const' ? symbol.decl.note : undefined;
}

/** The interval the kernel's domain was written as: its own `on [a, b]` or the file's `domain` line. */
function domainInterval(source: SourceFile, kernel: KernelSymbol): { interval: Interval; fileLine: boolean } | null {
  const domain = kernel.domain;
  if (!domain) return null;
  if (domain.own) return kernel.decl.domain ? { interval: kernel.decl.domain, fileLine: false } : null;
  for (const d of source.declarations) {
    if (d.kind === 'domain' && d.range.start <= domain.range.start && domain.range.end <= d.range.end) {
      return { interval: d.interval, fileLine: true };
    }
  }
  return null;
}

/** The unit of the kernel's variables, or null when no note gives one. */
export function domainUnit(source: SourceFile, model: FileModel, kernel: KernelSymbol): string | null {
  const found = domainInterval(source, kernel);
  if (!found || !kernel.domain) return null;
  if (found.fileLine) {
    const unit = unitOfNote(trailingComment(source, kernel.domain.range.end));
    if (unit) return unit;
  }
  return unitOfNote(boundNote(found.interval.upper, model)) ?? unitOfNote(boundNote(found.interval.lower, model));
}

export function axisNames(unit: string | null): AxisNames {
  return unit ? { t: `t (${unit})`, s: `s (${unit})`, unit } : { t: 't', s: 's', unit: null };
}
