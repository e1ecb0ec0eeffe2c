/**
 * Finds the kernel files named on the command line: files are taken as given, folders are searched recursively
 * for `*.kw` files. node_modules and dot-folders are skipped and symbolic links to folders are not followed (no
 * loops). Files found in a folder come in sorted order (path component by component, by code unit, so the order is
 * the same on every machine); a file named twice is checked once.
 */
import * as fs from 'node:fs';
import * as path from 'node:path';
import { describeFsError } from './fsErrors';

export interface Discovery {
  readonly files: readonly string[];
  /** One-line problems (missing path, folder without .kw files, unreadable folder). */
  readonly problems: readonly string[];
}

export const kernelFileExtension = '.kw';

export function isKernelFileName(name: string): boolean {
  return name.toLowerCase().endsWith(kernelFileExtension) && name.length > kernelFileExtension.length;
}

function skipFolder(name: string): boolean {
  return name === 'node_modules' || name.startsWith('.');
}

function byCodeUnit(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/** The .kw files under `dir`, in sorted order; unreadable sub-folders are reported in `problems`. */
function walk(dir: string, problems: string[]): string[] {
  let entries: fs.Dirent[];
  try {
    entries = fs.readdirSync(dir, { withFileTypes: true });
  } catch (error) {
    problems.push(`cannot read folder '${dir}': ${describeFsError(error)}`);
    return [];
  }
  entries.sort((a, b) => byCodeUnit(a.name, b.name));
  const found: string[] = [];
  for (const entry of entries) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) {
      if (!skipFolder(entry.name)) found.push(...walk(full, problems));
    } else if (isKernelFileName(entry.name) && (entry.isFile() || isFileLink(entry, full))) {
      found.push(full);
    }
  }
  return found;
}

function isFileLink(entry: fs.Dirent, full: string): boolean {
  if (!entry.isSymbolicLink()) return false;
  try {
    return fs.statSync(full).isFile();
  } catch {
    return false;
  }
}

export function discoverFiles(inputs: readonly string[]): Discovery {
  const files: string[] = [];
  const problems: string[] = [];
  const seen = new Set<string>();
  const add = (file: string): void => {
    const key = path.resolve(file);
    if (seen.has(key)) return;
    seen.add(key);
    files.push(file);
  };
  for (const input of inputs) {
    let stat: fs.Stats;
    try {
      stat = fs.statSync(input);
    } catch (error) {
      const reason = describeFsError(error);
      problems.push(reason === 'no such file or folder' ? `cannot find '${input}'` : `cannot open '${input}': ${reason}`);
      continue;
    }
    if (stat.isDirectory()) {
      const found = walk(input, problems);
      if (found.length === 0) problems.push(`no ${kernelFileExtension} files in folder '${input}'`);
      found.forEach(add);
    } else if (stat.isFile()) {
      add(input);
    } else {
      problems.push(`'${input}' is neither a file nor a folder`);
    }
  }
  return { files, problems };
}
