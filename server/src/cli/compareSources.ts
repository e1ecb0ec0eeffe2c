/**
 * The pairs of texts `kernwright compare` compares, from its three forms:
 *   OLD NEW                  two files, or two folders paired by the relative paths of their .kw files;
 *   --base REV [paths...]    the working tree against REV, each path read at REV with `git show REV:path` in the
 *                            repository that holds it (folders: every .kw file under them on either side);
 *   --base REV --head REV2   every .kw file that differs between the revisions (`git diff --name-status -z`).
 * A file present on one side only pairs with null (added or removed). Every problem (a missing path, an unknown
 * revision, a folder outside a repository, an unreadable or binary file) is collected as a one-line message; the
 * command prints them and stops before comparing anything. A revision is checked before any repository is looked
 * at (gitFiles.ts says how it reaches git); paths stay whole strings from the command line or from git's `-z`
 * output to the pairs, whatever characters they hold.
 */
import * as fs from 'node:fs';
import * as path from 'node:path';
import type { VersionText } from '@kernwright/core';
import type { CompareSources } from './args';
import { discoverFiles, isKernelFileName } from './discover';
import { describeFsError } from './fsErrors';
import { changedFiles, listFiles, repositoryPath, repositoryRoot, resolveRevision, revisionSyntaxProblem, showFile, type Commit } from './gitFiles';
import { decodeSource, readSource } from './readSource';

export interface SourcePair {
  /** The path shown for the pair. */
  readonly path: string;
  readonly old: VersionText | null;
  readonly new: VersionText | null;
}

export interface GatheredPairs {
  readonly pairs: SourcePair[];
  readonly problems: string[];
}

const slash = (p: string): string => p.split(path.sep).join('/');

function byCodeUnit(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/** A path under node_modules or a dot-folder is skipped, as `check` skips it. */
function skipped(repoPath: string): boolean {
  return repoPath.split('/').slice(0, -1).some((seg) => seg === 'node_modules' || seg.startsWith('.'));
}

class Collector {
  readonly pairs: SourcePair[] = [];
  readonly problems: string[] = [];

  fromDisk(file: string): VersionText | null {
    const r = readSource(file);
    if (r.ok) return { path: file, text: r.text };
    this.problems.push(r.message);
    return null;
  }

  fromBytes(label: string, bytes: Buffer): VersionText | null {
    const r = decodeSource(label, bytes);
    if (r.ok) return { path: label, text: r.text };
    this.problems.push(r.message);
    return null;
  }
}

function statOf(p: string, c: Collector): fs.Stats | null {
  try {
    return fs.statSync(p);
  } catch (error) {
    const reason = describeFsError(error);
    c.problems.push(reason === 'no such file or folder' ? `cannot find '${p}'` : `cannot open '${p}': ${reason}`);
    return null;
  }
}

/** The .kw files under a folder, as paths relative to it (forward slashes). */
function kernelFilesUnder(dir: string, c: Collector): Map<string, string> {
  const found = discoverFiles([dir]);
  for (const p of found.problems) if (!p.startsWith('no .kw files')) c.problems.push(p);
  return new Map(found.files.map((f) => [slash(path.relative(dir, f)), f]));
}

function gatherPaths(oldPath: string, newPath: string, c: Collector): void {
  const o = statOf(oldPath, c);
  const n = statOf(newPath, c);
  if (!o || !n) return;
  if (o.isFile() && n.isFile()) {
    const old = c.fromDisk(oldPath);
    const now = c.fromDisk(newPath);
    if (old && now) c.pairs.push({ path: newPath, old, new: now });
    return;
  }
  if (!o.isDirectory() || !n.isDirectory()) {
    c.problems.push(`'${oldPath}' and '${newPath}' must both be files or both be folders`);
    return;
  }
  const olds = kernelFilesUnder(oldPath, c);
  const news = kernelFilesUnder(newPath, c);
  if (olds.size === 0 && news.size === 0) c.problems.push(`no .kw files in '${oldPath}' or '${newPath}'`);
  for (const rel of [...new Set([...olds.keys(), ...news.keys()])].sort(byCodeUnit)) {
    const of = olds.get(rel);
    const nf = news.get(rel);
    c.pairs.push({ path: rel, old: of ? c.fromDisk(of) : null, new: nf ? c.fromDisk(nf) : null });
  }
}

/** The working tree's version and the version at `revision` of every .kw file under each path. */
function gatherBase(revision: string, inputs: readonly string[], c: Collector): void {
  const syntax = revisionSyntaxProblem(revision);
  if (syntax !== null) { c.problems.push(syntax); return; }
  const seen = new Set<string>();
  const commits = new Map<string, Commit | null>();
  for (const input of inputs) {
    const exists = fs.existsSync(input);
    const dir = exists && fs.statSync(input).isDirectory() ? input : path.dirname(path.resolve(input));
    if (!fs.existsSync(dir)) {
      c.problems.push(`cannot find '${input}'`);
      continue;
    }
    const root = repositoryRoot(dir);
    if (!root.ok) { c.problems.push(root.message); continue; }
    if (!commits.has(root.value)) {
      const commit = resolveRevision(root.value, revision);
      if (!commit.ok) c.problems.push(commit.message);
      commits.set(root.value, commit.ok ? commit.value : null);
    }
    const commit = commits.get(root.value);
    if (!commit) continue;
    const files = new Map<string, string>(); // repository path → path on disk (as shown)
    if (exists && fs.statSync(input).isFile()) {
      files.set(repositoryPath(root.value, input), input);
    } else {
      if (exists) for (const f of kernelFilesUnder(input, c).values()) files.set(repositoryPath(root.value, f), f);
      const listed = listFiles(root.value, commit, repositoryPath(root.value, input));
      if (!listed.ok) { c.problems.push(listed.message); continue; }
      for (const rp of listed.value) {
        if (!isKernelFileName(rp) || skipped(rp) || files.has(rp)) continue;
        files.set(rp, path.relative(process.cwd(), path.join(root.value, rp)));
      }
      if (!exists && files.size === 0) {
        c.problems.push(`cannot find '${input}' in the working tree or at '${revision}'`);
        continue;
      }
    }
    for (const [rp, shown] of [...files].sort((a, b) => byCodeUnit(a[0], b[0]))) {
      const key = `${root.value}\0${rp}`;
      if (seen.has(key)) continue;
      seen.add(key);
      const then = showFile(root.value, commit, rp);
      if (!then.ok) { c.problems.push(then.message); continue; }
      const label = slash(shown);
      const old = then.value ? c.fromBytes(`${revision}:${rp}`, then.value) : null;
      const now = fs.existsSync(shown) ? c.fromDisk(shown) : null;
      if (!then.value && !now) {
        c.problems.push(`cannot find '${input}' in the working tree or at '${revision}'`);
        continue;
      }
      c.pairs.push({ path: label, old, new: now });
    }
  }
}

/** Every .kw file that differs between two revisions of the repository that holds the working folder. */
function gatherRange(base: string, head: string, pathspecs: readonly string[], c: Collector): void {
  const syntax = [base, head].map(revisionSyntaxProblem).filter((p) => p !== null);
  if (syntax.length > 0) { c.problems.push(...syntax); return; }
  const root = repositoryRoot(process.cwd());
  if (!root.ok) { c.problems.push(root.message); return; }
  const b = resolveRevision(root.value, base);
  const h = resolveRevision(root.value, head);
  if (!b.ok) c.problems.push(b.message);
  if (!h.ok) c.problems.push(h.message);
  if (!b.ok || !h.ok) return;
  const specs = pathspecs.map((p) => repositoryPath(root.value, p));
  const changed = changedFiles(root.value, b.value, h.value, specs);
  if (!changed.ok) { c.problems.push(changed.message); return; }
  for (const f of changed.value) {
    const relevant = [f.oldPath, f.newPath].some((p) => p !== null && isKernelFileName(p));
    if (!relevant) continue;
    const shown = slash(path.relative(process.cwd(), path.join(root.value, f.newPath ?? f.oldPath!)));
    const read = (commit: Commit, p: string | null): VersionText | null => {
      if (p === null) return null;
      const bytes = showFile(root.value, commit, p);
      if (!bytes.ok) { c.problems.push(bytes.message); return null; }
      return bytes.value ? c.fromBytes(`${commit.name}:${p}`, bytes.value) : null;
    };
    c.pairs.push({ path: shown, old: read(b.value, f.oldPath), new: read(h.value, f.newPath) });
  }
}

export function gatherPairs(sources: CompareSources): GatheredPairs {
  const c = new Collector();
  switch (sources.kind) {
    case 'paths':
      gatherPaths(sources.old, sources.new, c);
      break;
    case 'base':
      gatherBase(sources.base, sources.paths, c);
      break;
    case 'range':
      gatherRange(sources.base, sources.head, sources.paths, c);
      break;
  }
  return { pairs: c.pairs, problems: c.problems };
}
