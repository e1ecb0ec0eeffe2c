/**
 * Reads one kernel file as text, refusing what cannot be a kernel file: files over the size limit (checked before
 * reading), binary files (a NUL byte) and text that is not valid UTF-8. A leading byte-order mark is dropped.
 */
import * as fs from 'node:fs';
import { describeFsError } from './fsErrors';

export const maxSourceBytes = 2 * 1024 * 1024;

export type SourceResult = { readonly ok: true; readonly text: string } | { readonly ok: false; readonly message: string };

function megabytes(bytes: number): string {
  return `${Number((bytes / (1024 * 1024)).toFixed(1))} MB`;
}

function tooLarge(path: string, bytes: number): SourceResult {
  return {
    ok: false,
    message: `'${path}' is too large to check (${megabytes(bytes)}, ${bytes} bytes; the limit is ${megabytes(maxSourceBytes)})`,
  };
}

/** Turns the bytes of `path` into text, or says in one line why they are not a kernel file. */
export function decodeSource(path: string, bytes: Uint8Array): SourceResult {
  if (bytes.length > maxSourceBytes) return tooLarge(path, bytes.length);
  const nul = bytes.indexOf(0);
  if (nul >= 0) return { ok: false, message: `'${path}' looks like a binary file (NUL byte at offset ${nul}), not a kernel file` };
  try {
    return { ok: true, text: new TextDecoder('utf-8', { fatal: true }).decode(bytes) };
  } catch {
    return { ok: false, message: `'${path}' is not valid UTF-8 text; save it with UTF-8 encoding` };
  }
}

export function readSource(path: string): SourceResult {
  try {
    const size = fs.statSync(path).size;
    if (size > maxSourceBytes) return tooLarge(path, size);
    return decodeSource(path, fs.readFileSync(path));
  } catch (error) {
    return { ok: false, message: `cannot read '${path}': ${describeFsError(error)}` };
  }
}
