/**
 * The few git questions `kernwright compare --base` asks, each one `git` process with its arguments passed as an
 * array (no shell): the repository that holds a path, whether a revision exists, a file's bytes at a revision
 * (`git show <rev>:<path>`), the kernel files under a folder at a revision, and the files changed between two
 * revisions (`git diff --name-status -z`). Read-only: nothing here changes a repository. Every failure comes back
 * as a one-line message.
 *
 * What the user typed reaches git in two places only, and neither can be read as an option or as pathspec magic:
 * a revision, refused when it starts with '-' and otherwise given to `git rev-parse --verify --end-of-options`,
 * which must answer with one commit id (`^HEAD` or a typo names none); and paths, always after `--`, matched
 * literally (`--literal-pathspecs`) or written after `<commit>:`. Every later call names the commit by its id.
 * Paths come back NUL-separated (`-z`) and are never split on newlines.
 */
import { spawnSync } from 'node:child_process';
import * as fs from 'node:fs';
import * as path from 'node:path';

export type GitAnswer<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly message: string };

const maxBuffer = 256 * 1024 * 1024;

function git(cwd: string, args: readonly string[]): { status: number; stdout: Buffer; stderr: string } | { status: 'missing' } {
  const r = spawnSync('git', ['--literal-pathspecs', ...args], { cwd, maxBuffer, windowsHide: true });
  if (r.error) {
    if ((r.error as NodeJS.ErrnoException).code === 'ENOENT') return { status: 'missing' };
    return { status: -1, stdout: Buffer.alloc(0), stderr: r.error.message };
  }
  return { status: r.status ?? -1, stdout: r.stdout, stderr: r.stderr.toString('utf8') };
}

const noGit = 'git is not installed or not on the PATH (compare --base needs it)';

/** The first line of git's complaint, without its `fatal: ` prefix. */
function complaint(stderr: string): string {
  return (stderr.split('\n').find((l) => l.trim() !== '') ?? 'git failed').replace(/^(fatal|error): /, '').trim();
}

/** The top folder of the repository that holds `dir` (an existing folder). */
export function repositoryRoot(dir: string): GitAnswer<string> {
  const r = git(dir, ['rev-parse', '--show-toplevel']);
  if (r.status === 'missing') return { ok: false, message: noGit };
  if (r.status !== 0) return { ok: false, message: `'${dir}' is not inside a git repository` };
  return { ok: true, value: fs.realpathSync(r.stdout.toString('utf8').trim()) };
}

/** Why `revision` cannot be a revision before git is asked (it is empty or would read as an option), or null. */
export function revisionSyntaxProblem(revision: string): string | null {
  if (revision.trim() === '') return 'the revision is empty';
  if (revision.startsWith('-')) return `'${revision}' is not a revision: a revision cannot start with '-'`;
  return null;
}

/** A full object id as `git rev-parse` prints it (SHA-1 or SHA-256). */
const objectId = /^(?:[0-9a-f]{40}|[0-9a-f]{64})$/;

/** A commit: its id, given to git, and the revision as the user wrote it, for messages. */
export interface Commit {
  readonly id: string;
  readonly name: string;
}

/** The commit a revision names, or a message saying that it names none. */
export function resolveRevision(root: string, revision: string): GitAnswer<Commit> {
  const syntax = revisionSyntaxProblem(revision);
  if (syntax !== null) return { ok: false, message: syntax };
  const r = git(root, ['rev-parse', '--verify', '--quiet', '--end-of-options', `${revision}^{commit}`]);
  if (r.status === 'missing') return { ok: false, message: noGit };
  // `^HEAD` passes --verify and prints `^<id>`: only one bare commit id is an answer.
  const id = r.status === 0 ? r.stdout.toString('utf8').trim() : '';
  if (!objectId.test(id)) return { ok: false, message: `'${revision}' names no commit in the repository at '${root}'` };
  return { ok: true, value: { id, name: revision } };
}

/** A repository path (forward slashes, relative to `root`) for a file-system path. */
export function repositoryPath(root: string, file: string): string {
  const abs = path.resolve(file);
  let dir = path.dirname(abs);
  try {
    dir = fs.realpathSync(dir);
  } catch {
    // A folder that no longer exists in the working tree: keep the path as written.
  }
  return path.relative(root, path.join(dir, path.basename(abs))).split(path.sep).join('/');
}

/**
 * The bytes of `file` (a repository path) at `commit`; null when the file does not exist there. `cat-file blob` gives the stored bytes, with no textconv or other filter of the user's configuration.
 */
export function showFile(root: string, commit: Commit, file: string): GitAnswer<Buffer | null> {
  const object = `${commit.id}:${file}`;
  const exists = git(root, ['cat-file', '-e', object]);
  if (exists.status === 'missing') return { ok: false, message: noGit };
  if (exists.status !== 0) return { ok: true, value: null };
  const r = git(root, ['cat-file', 'blob', object]);
  if (r.status === 'missing') return { ok: false, message: noGit };
  if (r.status !== 0) return { ok: false, message: `cannot read '${file}' at '${commit.name}': ${complaint(r.stderr)}` };
  return { ok: true, value: r.stdout };
}

/** Every file under `folder` (a repository path, '' for the whole tree) at `commit`, as repository paths. */
export function listFiles(root: string, commit: Commit, folder: string): GitAnswer<string[]> {
  const r = git(root, ['ls-tree', '-r', '-z', '--name-only', '--full-tree', commit.id, '--', ...(folder === '' ? [] : [folder])]);
  if (r.status === 'missing') return { ok: false, message: noGit };
  if (r.status !== 0) return { ok: false, message: `cannot list the files at '${commit.name}': ${complaint(r.stderr)}` };
  return { ok: true, value: r.stdout.toString('utf8').split('\0').filter((s) => s !== '') };
}

export interface ChangedFile {
  /** A (added), D (deleted), M (modified), R (renamed), C (copied), T (type changed). */
  readonly status: string;
  readonly oldPath: string | null;
  readonly newPath: string | null;
}

/** The files that differ between two commits (renames detected), limited to the paths given, if any. */
export function changedFiles(root: string, base: Commit, head: Commit, pathspecs: readonly string[]): GitAnswer<ChangedFile[]> {
  const r = git(root, ['diff', '--no-ext-diff', '--name-status', '-z', '-M', base.id, head.id, '--', ...pathspecs]);
  if (r.status === 'missing') return { ok: false, message: noGit };
  if (r.status !== 0) return { ok: false, message: `git diff failed: ${complaint(r.stderr)}` };
  const tokens = r.stdout.toString('utf8').split('\0');
  const out: ChangedFile[] = [];
  for (let k = 0; k < tokens.length; ) {
    const status = tokens[k++];
    if (!status) continue;
    const letter = status[0];
    if (letter === 'R' || letter === 'C') {
      const from = tokens[k++];
      const to = tokens[k++];
      out.push({ status: letter, oldPath: letter === 'C' ? null : from, newPath: to });
    } else {
      const file = tokens[k++];
      out.push({ status: letter, oldPath: letter === 'A' ? null : file, newPath: letter === 'D' ? null : file });
    }
  }
  return { ok: true, value: out };
}
