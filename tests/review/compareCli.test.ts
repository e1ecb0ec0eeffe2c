/**
 * `kernwright compare` run as a user runs it: two files, two folders, the working tree against a git revision and
 * two revisions (in temporary repositories made here), the three formats, the limits and every exit code, and the
 * bad inputs (missing and binary files, unknown revisions, folders outside a repository, broken versions), revisions
 * that look like options, and file names with spaces, newlines, tabs, quotes, escape sequences and non-ASCII letters.
 */
import { spawnSync } from 'node:child_process';
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { bundleCli, expectCleanFailure, fixture, writeTree, type Harness, type Run } from './cliHarness';

// Each run starts the program afresh and analyses with a generous time budget: slow on a loaded machine.
vi.setConfig({ testTimeout: 600_000 });

let h: Harness;
let work = '';
const cases = ['sign-breaks-symmetry', 'length-scale', 'renamed', 'reformatted', 'becomes-unbounded'];
const budget = ['--time-budget', '20000'];

function kw(...args: string[]): Run {
  return h.run(work, [...args, ...budget]);
}

function gitIn(dir: string, ...args: string[]): void {
  const r = spawnSync('git', ['-c', 'user.email=test@example.invalid', '-c', 'user.name=Test', '-c', 'commit.gpgsign=false', ...args], { cwd: dir, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`git ${args.join(' ')} failed: ${r.stderr}`);
}

beforeAll(async () => {
  h = await bundleCli();
  work = fs.mkdtempSync(path.join(os.tmpdir(), 'kw-compare-'));
  const files: Record<string, string | Uint8Array> = {};
  for (const c of cases) {
    files[`old/${c}.kw`] = fixture(c, 'old');
    files[`new/${c}.kw`] = fixture(c, 'new');
  }
  files['old/gone.kw'] = '# Invented test scenario.\ndomain [0, 1]\nkernel gone(t, s) = t * s\n';
  files['new/sub/fresh.kw'] = '# Invented test scenario.\ndomain [0, 1]\nkernel fresh(t, s) = t + s\n';
  files['binary.kw'] = new Uint8Array([0x6b, 0x00, 0x01]);
  files['broken/old.kw'] = '# Invented.\ndomain [0, 1]\nkernel k(t, s) = 2t\n';
  files['broken/new.kw'] = '# Invented.\ndomain [0, 1]\nkernel k(t, s) = (t + s\n';
  files['broken/fine.kw'] = '# Invented.\ndomain [0, 1]\nkernel k(t, s) = t * s\n';
  files['broken/typo.kw'] = '# Invented.\ndomain [0, 1]\nkernel k(t, s) = t * sss\n';
  files['nokw/readme.txt'] = 'nothing';
  files['latin1.kw'] = Buffer.from('# caf\xe9 in Latin-1\ndomain [0, 1]\n', 'latin1');
  writeTree(work, files);
  fs.symlinkSync(path.join(work, 'vanished-target.kw'), path.join(work, 'dangling.kw'));
}, 300_000);

afterAll(() => {
  h?.dispose();
  if (work) fs.rmSync(work, { recursive: true, force: true });
});

describe('compare OLD NEW (files)', () => {
  it('reports a flip and fails only with --fail-on-flip', () => {
    const plain = kw('compare', 'old/sign-breaks-symmetry.kw', 'new/sign-breaks-symmetry.kw');
    expect(plain.status).toBe(0);
    expect(plain.stderr).toBe('');
    expect(plain.stdout).toContain('Hermitian flipped: yes → no');
    const strict = kw('compare', '--fail-on-flip', 'old/sign-breaks-symmetry.kw', 'new/sign-breaks-symmetry.kw');
    expect(strict.status).toBe(1);
    expect(strict.stdout).toMatch(/limits exceeded:\n {2}new\/sign-breaks-symmetry\.kw: “drift”: Hermitian flipped from yes to no/);
  });

  it('sets the exit code by --max-norm-change and --max-eigenvalue-change', () => {
    const args = ['old/length-scale.kw', 'new/length-scale.kw'];
    expect(kw('compare', '--max-norm-change', '5%', ...args).status).toBe(1);
    expect(kw('compare', '--max-norm-change=50%', ...args).status).toBe(0);
    expect(kw('compare', '--max-norm-change', '0.5', ...args).status).toBe(0);
    expect(kw('compare', '--max-eigenvalue-change', '10%', ...args).status).toBe(1);
    expect(kw('compare', '--max-eigenvalue-change', '10%', '--eigenvalues', '1', ...args).status).toBe(1);
    expect(kw('compare', '--max-eigenvalue-change', '40%', '--eigenvalues', '2', ...args).status).toBe(0);
    expect(kw('compare', '--max-trace-change', '0%', ...args).status).toBe(0);
  });

  it('reports a reformatted file as unchanged and a renamed kernel as renamed, exit 0', () => {
    const same = kw('compare', '--fail-on-flip', '--max-norm-change', '0%', 'old/reformatted.kw', 'new/reformatted.kw');
    expect(same.status).toBe(0);
    expect(same.stdout).toBe('new/reformatted.kw: unchanged (1 kernel)\ncompared 1 file, 1 kernel: 1 unchanged\n');
    const renamed = kw('compare', 'old/renamed.kw', 'new/renamed.kw');
    expect(renamed.status).toBe(0);
    expect(renamed.stdout).toContain('“green” → “rod_green”: renamed (same definition)');
  });

  it('prints markdown and JSON', () => {
    const md = kw('compare', '--format', 'markdown', 'old/becomes-unbounded.kw', 'new/becomes-unbounded.kw');
    expect(md.status).toBe(0);
    expect(md.stdout).toMatch(/^### Kernel changes\n/);
    expect(md.stdout).toContain('| `interaction` | **boundedness flipped** | hilbert-schmidt | **unbounded** | flipped |');
    const json = kw('compare', '--format', 'json', '--fail-on-flip', 'old/becomes-unbounded.kw', 'new/becomes-unbounded.kw');
    expect(json.status).toBe(1);
    const doc = JSON.parse(json.stdout);
    expect(doc.verdict.failed).toBe(true);
    expect(doc.files[0].kernels[0].flips).toContainEqual({ property: 'boundedness', old: 'hilbert-schmidt', new: 'unbounded' });
  });
});

describe('compare OLD NEW (folders)', () => {
  it('pairs files by relative path; files on one side only are added or removed', () => {
    const r = kw('compare', 'old', 'new');
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('gone.kw: file removed\n  “gone”: removed');
    expect(r.stdout).toContain('sub/fresh.kw: file added\n  “fresh”: added');
    expect(r.stdout).toContain('reformatted.kw: unchanged (1 kernel)');
    expect(r.stdout.trimEnd().split('\n').pop()).toMatch(/^compared 7 files, 8 kernels: /);
    expect(kw('compare', '--fail-on-flip', 'old', 'new').status).toBe(1);
  });
});

describe('compare: bad input', () => {
  it('exit 2 with one clear line for a missing file, a binary file, file against folder, and bad usage', () => {
    expectCleanFailure(kw('compare', 'old/nope.kw', 'new/renamed.kw'), 2, /cannot find 'old\/nope\.kw'/);
    expectCleanFailure(kw('compare', 'binary.kw', 'new/renamed.kw'), 2, /'binary\.kw' looks like a binary file/);
    expectCleanFailure(kw('compare', 'old', 'new/renamed.kw'), 2, /must both be files or both be folders/);
    expectCleanFailure(kw('compare', 'nokw', 'nokw'), 2, /no \.kw files in 'nokw' or 'nokw'/);
    expectCleanFailure(kw('compare', 'new/renamed.kw', 'latin1.kw'), 2, /'latin1\.kw' is not valid UTF-8 text/);
    expectCleanFailure(kw('compare', 'new/renamed.kw', 'dangling.kw'), 2, /cannot find 'dangling\.kw'/);
    expectCleanFailure(kw('compare', 'old/renamed.kw'), 2, /compare needs two files or two folders/);
    expectCleanFailure(kw('compare', '--max-norm-change', '5', 'a', 'b'), 2, /needs a percentage like 5% or a fraction like 0\.05, got '5'/);
    expectCleanFailure(kw('compare', '--head', 'HEAD', 'a', 'b'), 2, /--head needs --base/);
    expectCleanFailure(kw('compare', '--dry-run', 'a', 'b'), 2, /option --dry-run does not apply to 'compare'/);
  });

  it('refuses a file neither of whose versions parses (exit 2), and fails one whose new version has errors (exit 1)', () => {
    expectCleanFailure(kw('compare', 'broken/old.kw', 'broken/new.kw'), 2, /cannot compare 'broken\/new\.kw': neither version parses cleanly/);
    const typo = kw('compare', 'broken/fine.kw', 'broken/typo.kw');
    expect(typo.status).toBe(1);
    expect(typo.stdout).toContain('“k”: not comparable');
    expect(typo.stdout).toMatch(/limits exceeded:\n {2}broken\/typo\.kw: the new version has errors \(line 3: /);
    // The other way round, the change repairs the file: nothing fails.
    expect(kw('compare', 'broken/typo.kw', 'broken/fine.kw').status).toBe(0);
  });
});

describe('compare --base (git)', () => {
  let repo = '';
  const run = (...args: string[]) => h.run(repo, [...args, ...budget]);

  beforeAll(() => {
    repo = fs.mkdtempSync(path.join(os.tmpdir(), 'kw-git-'));
    gitIn(repo, 'init', '-q');
    writeTree(repo, {
      'models/drift.kw': fixture('sign-breaks-symmetry', 'old'),
      'models/cov.kw': fixture('reformatted', 'old'),
      'models/old-name.kw': fixture('renamed', 'old'),
      'models/doomed.kw': '# Invented test scenario.\ndomain [0, 1]\nkernel doomed(t, s) = t * s\n',
      'models/.hidden/skip.kw': '# Invented.\ndomain [0, 1]\nkernel k(t, s) = t\n',
      'notes.txt': 'not a kernel file\n',
    });
    gitIn(repo, 'add', '-A');
    gitIn(repo, 'commit', '-q', '-m', 'first');
    // Second commit: drift breaks symmetry, cov is reformatted, doomed is deleted, old-name.kw is moved.
    writeTree(repo, { 'models/drift.kw': fixture('sign-breaks-symmetry', 'new'), 'models/cov.kw': fixture('reformatted', 'new') });
    fs.rmSync(path.join(repo, 'models/doomed.kw'));
    gitIn(repo, 'mv', 'models/old-name.kw', 'models/new-name.kw');
    gitIn(repo, 'add', '-A');
    gitIn(repo, 'commit', '-q', '-m', 'second');
    gitIn(repo, 'tag', 'v2');
    // Working tree, not committed: drift becomes 1/|t − s|.
    writeTree(repo, { 'models/drift.kw': '# Invented test scenario.\ndomain [0, 1]\nkernel drift(t, s) = 1 / abs(t - s)\n' });
  }, 120_000);

  afterAll(() => {
    if (repo) fs.rmSync(repo, { recursive: true, force: true });
  });

  it('compares the working tree with a revision, for a folder and for one file', () => {
    const all = run('compare', '--base', 'HEAD', '--fail-on-flip');
    expect(all.status).toBe(1);
    expect(all.stdout).toContain('models/drift.kw: modified');
    expect(all.stdout).toContain('boundedness flipped: hilbert-schmidt → unbounded');
    expect(all.stdout).toContain('models/cov.kw: unchanged');
    expect(all.stdout).not.toContain('skip.kw');
    const one = run('compare', '--base', 'HEAD~1', 'models/cov.kw');
    expect(one.status).toBe(0);
    expect(one.stdout).toBe('models/cov.kw: unchanged (1 kernel)\ncompared 1 file, 1 kernel: 1 unchanged\n');
    // From a subfolder, paths are relative to it.
    const sub = h.run(path.join(repo, 'models'), ['compare', '--base', 'HEAD', 'cov.kw', ...budget]);
    expect(sub.status).toBe(0);
    expect(sub.stdout).toContain('cov.kw: unchanged');
  });

  it('reports a file that exists at the revision but not in the working tree as removed', () => {
    const r = run('compare', '--base', 'HEAD~1', 'models/doomed.kw');
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('models/doomed.kw: file removed\n  “doomed”: removed');
  });

  it('compares two revisions: every changed .kw file, with deletions and renames', () => {
    const r = run('compare', '--base', 'HEAD~1', '--head', 'v2', '--format', 'json');
    expect(r.status).toBe(0);
    const doc = JSON.parse(r.stdout);
    const byPath = Object.fromEntries(doc.files.map((f: { path: string; status: string }) => [f.path, f.status]));
    expect(byPath).toEqual({
      'models/cov.kw': 'unchanged',
      'models/doomed.kw': 'removed',
      'models/drift.kw': 'modified',
      'models/new-name.kw': 'unchanged',
    });
    const strict = run('compare', '--base', 'HEAD~1', '--head', 'HEAD', '--fail-on-flip', 'models/drift.kw');
    expect(strict.status).toBe(1);
    expect(strict.stdout).toContain('Hermitian flipped: yes → no');
    const none = run('compare', '--base', 'HEAD', '--head', 'HEAD');
    expect(none.status).toBe(0);
    expect(none.stdout).toBe('compared 0 files, 0 kernels: none\n');
  });

  it('exit 2 for an unknown revision, a path outside any repository and a path that exists nowhere', () => {
    expectCleanFailure(run('compare', '--base', 'no-such-rev'), 2, /'no-such-rev' names no commit/);
    expectCleanFailure(run('compare', '--base', 'HEAD', '--head', 'nope'), 2, /'nope' names no commit/);
    expectCleanFailure(run('compare', '--base', '--weird'), 2, /option --base needs a value/);
    expectCleanFailure(run('compare', '--base', 'HEAD', 'models/never.kw'), 2, /cannot find 'models\/never\.kw' in the working tree or at 'HEAD'/);
    expectCleanFailure(h.run(work, ['compare', '--base', 'HEAD', 'old']), 2, /'old' is not inside a git repository/);
  });

  it('exit 2 for a binary file at the revision', () => {
    const bin = fs.mkdtempSync(path.join(os.tmpdir(), 'kw-gitbin-'));
    try {
      gitIn(bin, 'init', '-q');
      writeTree(bin, { 'k.kw': new Uint8Array([0x00, 0x01, 0x02]) });
      gitIn(bin, 'add', '-A');
      gitIn(bin, 'commit', '-q', '-m', 'binary');
      writeTree(bin, { 'k.kw': fixture('reformatted', 'new') });
      expectCleanFailure(h.run(bin, ['compare', '--base', 'HEAD', 'k.kw']), 2, /'HEAD:k\.kw' looks like a binary file/);
    } finally {
      fs.rmSync(bin, { recursive: true, force: true });
    }
  });
});

// File names with a newline or a tab cannot exist on Windows.
describe.skipIf(process.platform === 'win32')('compare --base: revisions that look like options, and paths of every kind', () => {
  let repo = '';
  const run = (...args: string[]) => h.run(repo, [...args, ...budget]);
  const product = '# Invented test scenario.\ndomain [0, 1]\nkernel k(t, s) = t * s\n';
  const sum = '# Invented test scenario.\ndomain [0, 1]\nkernel k(t, s) = t + s\n';
  const square = '# Invented test scenario.\ndomain [0, 1]\nkernel square(t, s) = t * t * s * s\n';
  const newline = 'line\nbreak.kw';
  const tab = 'tab\there.kw';
  const escape = 'clear\u001b[2J.kw';
  const statuses = (r: Run) => {
    expect(r.stderr).toBe('');
    return Object.fromEntries(JSON.parse(r.stdout).files.map((f: { path: string; status: string }) => [f.path, f.status]));
  };

  beforeAll(() => {
    repo = fs.mkdtempSync(path.join(os.tmpdir(), 'kw-gitnames-'));
    gitIn(repo, 'init', '-q');
    writeTree(repo, { 'a b.kw': product, [newline]: product, [tab]: product, '核.kw': product, 'say "hi".kw': product });
    gitIn(repo, 'add', '-A');
    gitIn(repo, 'commit', '-q', '-m', 'first');
    // Second commit: the newline file changes, 'a b.kw' is moved to 'Übung 1.kw', a file with an escape sequence appears.
    writeTree(repo, { [newline]: sum, [escape]: square });
    gitIn(repo, 'mv', 'a b.kw', 'Übung 1.kw');
    gitIn(repo, 'add', '-A');
    gitIn(repo, 'commit', '-q', '-m', 'second');
    // Working tree, not committed: the tab file changes.
    writeTree(repo, { [tab]: sum });
  }, 120_000);

  afterAll(() => {
    if (repo) fs.rmSync(repo, { recursive: true, force: true });
  });

  it('refuses a revision that starts with "-" (exit 2) and git never reads it as an option', () => {
    const written = path.join(repo, 'written-by-git');
    for (const rev of ['-p', `--output=${written}`, '--end-of-options']) {
      const escaped = rev.replace(/[.\\/-]/g, (ch) => `\\${ch}`);
      const refusal = new RegExp(`'${escaped}' is not a revision: a revision cannot start with '-'`);
      expectCleanFailure(run('compare', `--base=${rev}`), 2, refusal);
      expectCleanFailure(run('compare', `--base=${rev}`, 'a b.kw'), 2, refusal);
      expectCleanFailure(run('compare', '--base', 'HEAD', `--head=${rev}`), 2, refusal);
      expectCleanFailure(run('compare', `--base=${rev}`, '--head', 'HEAD'), 2, refusal);
    }
    expect(fs.existsSync(written)).toBe(false);
  });

  it('a revision that names no commit is a clear error (exit 2), not every file "added"', () => {
    expectCleanFailure(run('compare', '--base=^HEAD', '核.kw'), 2, /'\^HEAD' names no commit in the repository at /);
    expectCleanFailure(run('compare', '--base', '^HEAD'), 2, /'\^HEAD' names no commit/);
    expectCleanFailure(run('compare', '--base', 'HEAD', '--head', '^HEAD'), 2, /'\^HEAD' names no commit/);
    expectCleanFailure(run('compare', '--base', 'no-such-rev'), 2, /'no-such-rev' names no commit/);
    expectCleanFailure(run('compare', '--base', 'HEAD~5'), 2, /'HEAD~5' names no commit/);
    // A tree is an object but not a commit.
    expectCleanFailure(run('compare', '--base', 'HEAD^{tree}'), 2, /'HEAD\^\{tree\}' names no commit/);
  });

  it('compares the working tree with HEAD and with HEAD~1, whatever the file names hold', () => {
    expect(statuses(run('compare', '--base', 'HEAD', '--format', 'json'))).toEqual({
      [escape]: 'unchanged',
      [newline]: 'unchanged',
      'say "hi".kw': 'unchanged',
      [tab]: 'modified',
      'Übung 1.kw': 'unchanged',
      '核.kw': 'unchanged',
    });
    expect(statuses(run('compare', '--base', 'HEAD~1', '--format', 'json', newline, tab, '核.kw', 'say "hi".kw', 'Übung 1.kw'))).toEqual({
      [newline]: 'modified',
      [tab]: 'modified',
      '核.kw': 'unchanged',
      'say "hi".kw': 'unchanged',
      'Übung 1.kw': 'added',
    });
  });

  it('compares two revisions, with and without paths, whatever the file names hold', () => {
    expect(statuses(run('compare', '--base', 'HEAD~1', '--head', 'HEAD', '--format', 'json'))).toEqual({
      [escape]: 'added',
      [newline]: 'modified',
      'Übung 1.kw': 'unchanged',
    });
    // With both names of the moved file given, git sees the move; with the new name only, an added file.
    expect(statuses(run('compare', '--base', 'HEAD~1', '--head', 'HEAD', '--format', 'json', newline, 'a b.kw', 'Übung 1.kw'))).toEqual({
      [newline]: 'modified',
      'Übung 1.kw': 'unchanged',
    });
    expect(statuses(run('compare', '--base', 'HEAD~1', '--head', 'HEAD', '--format', 'json', 'Übung 1.kw'))).toEqual({ 'Übung 1.kw': 'added' });
    // Paths are matched as written, never as patterns.
    expect(statuses(run('compare', '--base', 'HEAD~1', '--head', 'HEAD', '--format', 'json', '*.kw'))).toEqual({});
  });

  it('prints a path with a newline, a tab or an escape sequence quoted and escaped, so it cannot fake a line', () => {
    const text = run('compare', '--base', 'HEAD~1', '--head', 'HEAD');
    expect(text.status).toBe(0);
    expect(text.stdout).toContain('"line\\nbreak.kw": modified\n');
    expect(text.stdout).toContain('"clear\\x1b[2J.kw": file added\n');
    expect(text.stdout).toContain('Übung 1.kw: unchanged (1 kernel)\n');
    expect(text.stdout).not.toMatch(/^break\.kw/m);
    expect(text.stdout).not.toContain('\u001b');
    const tabbed = run('compare', '--base', 'HEAD', tab, 'say "hi".kw', '核.kw');
    expect(tabbed.stdout).toContain('"tab\\there.kw": modified\n');
    expect(tabbed.stdout).toContain('say "hi".kw: unchanged (1 kernel)\n');
    expect(tabbed.stdout).toContain('核.kw: unchanged (1 kernel)\n');
    expect(tabbed.stdout).not.toContain('\t');
    const md = run('compare', '--base', 'HEAD~1', '--head', 'HEAD', '--format', 'markdown');
    expect(md.stdout).toContain('"line\\nbreak.kw"');
    expect(md.stdout).not.toMatch(/^break\.kw/m);
    // Messages on standard error stay one line each.
    expectCleanFailure(run('compare', '--base', 'HEAD', 'missing\nfile.kw'), 2, /cannot find 'missing\\nfile\.kw' in the working tree or at 'HEAD'/);
  });
});
