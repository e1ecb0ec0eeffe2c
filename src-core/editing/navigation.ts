/**
 * Go to definition, find references and rename for the names of a kernel file: constants, helpers and kernels
 * (file-wide, from the bound model's reference lists) and parameters (inside their declaration). Plain data in
 * offsets.
 */
import type { SourceFile } from '../syntax/ast';
import type { TextRange } from '../syntax/textRange';
import type { TextEdit } from '../diagnostics/types';
import type { FileModel } from '../semantics/model';
import { isBuiltinConstant, isBuiltinFunction, isKeyword } from '../semantics/builtins';
import { nodeAt, parameterUses } from './nodeAt';

/** Where the name at `offset` is declared, or null (built-ins, unknown names, no name). */
export function definitionAt(source: SourceFile, model: FileModel, offset: number): TextRange | null {
  const node = nodeAt(source, model, offset);
  if (!node) return null;
  if (node.kind === 'symbol') return node.symbol.nameRange;
  if (node.kind === 'parameter') return node.owner.params[node.index].range;
  return null;
}

/** Every occurrence of the name at `offset`, in source order; the declaration first when asked for. */
export function referencesAt(source: SourceFile, model: FileModel, offset: number, includeDeclaration: boolean): TextRange[] | null {
  const node = nodeAt(source, model, offset);
  if (!node) return null;
  let declaration: TextRange;
  let uses: TextRange[];
  if (node.kind === 'symbol') {
    declaration = node.symbol.nameRange;
    uses = [...node.symbol.references];
  } else if (node.kind === 'parameter') {
    declaration = node.owner.params[node.index].range;
    uses = parameterUses(node.owner, node.name);
  } else return null;
  uses.sort((a, b) => a.start - b.start);
  return includeDeclaration ? [declaration, ...uses] : uses;
}

const identifier = /^[\p{L}_][\p{L}\p{M}\p{Nd}_]*$/u;

/** Why `name` cannot be declared at all (malformed, a keyword or a built-in), or null. */
function malformedOrReserved(name: string): string | null {
  if (!identifier.test(name)) return `“${name}” is not a valid name: use a letter or _ followed by letters, digits and _.`;
  if (isKeyword(name)) return `“${name}” is a keyword.`;
  if (isBuiltinFunction(name) || isBuiltinConstant(name)) return `“${name}” is a built-in name.`;
  return null;
}

/** Why `name` cannot be a new file-level name, or null when it can. */
export function invalidNewName(model: FileModel, name: string): string | null {
  return malformedOrReserved(name) ?? (model.symbols.has(name) ? `“${name}” is already declared in this file.` : null);
}

export interface RenameTarget {
  readonly range: TextRange;
  readonly placeholder: string;
}

/** The name that a rename at `offset` would change, or null when there is nothing renamable there. */
export function renameTargetAt(source: SourceFile, model: FileModel, offset: number): RenameTarget | null {
  const node = nodeAt(source, model, offset);
  if (!node || (node.kind !== 'symbol' && node.kind !== 'parameter')) return null;
  return { range: node.range, placeholder: node.kind === 'symbol' ? node.symbol.name : node.name };
}

export type RenameResult = { readonly edits: TextEdit[] } | { readonly error: string };

/** The edits that rename the name at `offset` to `newName` everywhere it is used. */
export function renameAt(source: SourceFile, model: FileModel, offset: number, newName: string): RenameResult {
  const node = nodeAt(source, model, offset);
  if (!node || (node.kind !== 'symbol' && node.kind !== 'parameter')) {
    return { error: 'Only constants, helpers, kernels and parameters can be renamed.' };
  }
  const oldName = node.kind === 'symbol' ? node.symbol.name : node.name;
  if (newName === oldName) return { edits: [] };
  let problem: string | null;
  if (node.kind === 'symbol') {
    problem = invalidNewName(model, newName);
    // A parameter of the same name would capture the renamed constant inside that definition.
    if (!problem) {
      const captured = node.symbol.references.some((r) => {
        const owner = source.declarations.find((d) => d.range.start <= r.start && r.end <= d.range.end);
        return owner && (owner.kind === 'fn' || owner.kind === 'kernel') && owner.params.some((p) => p.text === newName);
      });
      if (captured) problem = `“${newName}” is a parameter where “${oldName}” is used; it would hide the new name.`;
    }
  } else {
    const others = node.owner.params.map((p) => p.text).filter((_, i) => i !== node.index);
    problem = malformedOrReserved(newName)
      ?? (others.includes(newName) ? `“${newName}” is already a parameter here.` : null)
      // A parameter named like a declared name would hide it inside the body (a warning, but a trap).
      ?? (model.symbols.has(newName) ? `“${newName}” is declared in this file; the parameter would hide it.` : null);
  }
  if (problem) return { error: problem };
  const ranges = referencesAt(source, model, offset, true) ?? [];
  return { edits: ranges.map((range) => ({ range, newText: newName })) };
}
