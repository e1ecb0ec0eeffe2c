/**
 * The names visible in a file: declared constants, helpers and kernels (one namespace), plus built-ins.
 * Collects declarations, reports duplicates and reserved names.
 */
import type { Declaration, Name } from '../syntax/ast';
import type { Diagnostic } from '../diagnostics/types';
import { makeDiagnostic } from '../diagnostics/make';
import { isBuiltinConstant, isBuiltinFunction, isKeyword } from './builtins';
import type { ConstantSymbol, FileSymbol, FunctionSymbol, KernelSymbol } from './model';

/** A symbol under construction: kernel fields that binding fills in later are mutable here. */
export type DraftKernel = { -readonly [K in keyof KernelSymbol]: KernelSymbol[K] };
export type DraftSymbol = ConstantSymbol | FunctionSymbol | DraftKernel;

const kindWord: Record<FileSymbol['kind'], string> = { const: 'constant', fn: 'helper function', kernel: 'kernel' };

export function describeSymbol(s: { kind: FileSymbol['kind'] }): string {
  return kindWord[s.kind];
}

export interface Scope {
  readonly symbols: Map<string, DraftSymbol>;
  /** Declarations in source order (duplicates included, so that their bodies are still checked). */
  readonly all: DraftSymbol[];
}

function reservedWhat(name: string): string | null {
  if (isKeyword(name)) return 'keyword';
  if (isBuiltinFunction(name)) return 'built-in function';
  if (isBuiltinConstant(name)) return 'built-in constant';
  return null;
}

export function collectScope(declarations: readonly Declaration[], diagnostics: Diagnostic[]): Scope {
  const symbols = new Map<string, DraftSymbol>();
  const all: DraftSymbol[] = [];
  for (const d of declarations) {
    if (d.kind === 'domain') continue;
    const name: Name = d.name;
    let sym: DraftSymbol;
    if (d.kind === 'const') {
      sym = { kind: 'const', name: name.text, nameRange: name.range, references: [], decl: d, value: null };
    } else if (d.kind === 'fn') {
      sym = { kind: 'fn', name: name.text, nameRange: name.range, references: [], decl: d, params: d.params.map((p) => p.text) };
    } else {
      sym = {
        kind: 'kernel', name: name.text, nameRange: name.range, references: [], decl: d,
        domain: null, ir: null, hash: null, expectations: [],
      };
    }
    all.push(sym);
    if (name.text === '') continue; // missing name: the parser reported it
    const reserved = reservedWhat(name.text);
    if (reserved) {
      diagnostics.push(makeDiagnostic('reserved-name', name.range, { name: name.text, what: reserved }));
      continue;
    }
    const previous = symbols.get(name.text);
    if (previous) {
      diagnostics.push(
        makeDiagnostic('duplicate-name', name.range, { name: name.text, previous: describeSymbol(previous) }, {
          related: [{ range: previous.nameRange, message: `first declared here as a ${describeSymbol(previous)}` }],
        }),
      );
      continue;
    }
    symbols.set(name.text, sym);
  }
  return { symbols, all };
}
