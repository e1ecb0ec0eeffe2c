/** The arguments of compare, fix and export, and the check options for CI (parseArgs in server/src/cli/args.ts). */
import { describe, expect, it } from 'vitest';
import { parseArgs, parseFraction, usageText, type Command } from '../../server/src/cli/args';

function check(argv: string[], expected: Command | RegExp): void {
  const got = parseArgs(argv);
  if (expected instanceof RegExp) {
    expect(got.kind).toBe('usage-error');
    if (got.kind === 'usage-error') {
      expect(got.message).toMatch(expected);
      expect(got.message).not.toMatch(/\n/);
    }
  } else {
    expect(got).toEqual(expected);
  }
}

const none = { failOnFlip: false, maxNormChange: null, maxEigenvalueChange: null, maxTraceChange: null };

describe('check options for CI', () => {
  it('reads --format sarif, --jobs and --time-budget', () => {
    check(['check', '--format', 'sarif', '-j', '3', '--time-budget=500', 'a.kw'], {
      kind: 'check', options: { paths: ['a.kw'], format: 'sarif', failOn: 'error', numerics: true, jobs: 3, timeBudgetMs: 500 },
    });
  });
  it('refuses bad numbers', () => {
    check(['check', '--jobs', '0', 'a.kw'], /--jobs needs a whole number from 1 to 64, got '0'/);
    check(['check', '--time-budget', '1.5', 'a.kw'], /--time-budget needs a whole number/);
    check(['check', '--format', 'markdown', 'a.kw'], /unknown format 'markdown' \(use text, json or sarif\)/);
  });
});

describe('compare', () => {
  it('reads the three forms', () => {
    check(['compare', 'old.kw', 'new.kw'], { kind: 'compare', options: { sources: { kind: 'paths', old: 'old.kw', new: 'new.kw' }, format: 'text', thresholds: none } });
    check(['compare', '--base', 'main'], { kind: 'compare', options: { sources: { kind: 'base', base: 'main', paths: ['.'] }, format: 'text', thresholds: none } });
    check(['compare', '--base', 'v1', 'models', 'x.kw'], { kind: 'compare', options: { sources: { kind: 'base', base: 'v1', paths: ['models', 'x.kw'] }, format: 'text', thresholds: none } });
    check(['compare', '--base=a', '--head=b'], { kind: 'compare', options: { sources: { kind: 'range', base: 'a', head: 'b', paths: [] }, format: 'text', thresholds: none } });
  });
  it('reads the limits and the format', () => {
    check(['compare', '--format', 'markdown', '--fail-on-flip', '--max-norm-change', '5%', '--max-eigenvalue-change=0.1', '--max-trace-change', '2.5%', '--eigenvalues', '4', 'a', 'b'], {
      kind: 'compare',
      options: {
        sources: { kind: 'paths', old: 'a', new: 'b' }, format: 'markdown', eigenCount: 4,
        thresholds: { failOnFlip: true, maxNormChange: 0.05, maxEigenvalueChange: 0.1, maxTraceChange: 0.025 },
      },
    });
  });
  it('refuses the wrong number of paths, --head alone, and options of other commands', () => {
    check(['compare', 'a'], /compare needs two files or two folders \(OLD NEW\), or --base <revision>; got 1 path$/);
    check(['compare', 'a', 'b', 'c'], /got 3 paths/);
    check(['compare', '--head', 'x', 'a', 'b'], /--head needs --base/);
    check(['compare', '--fail-on', 'error', 'a', 'b'], /option --fail-on does not apply to 'compare'/);
    check(['compare', '--fail-on-flip=yes', 'a', 'b'], /option --fail-on-flip takes no value/);
    check(['compare', '--format', 'sarif', 'a', 'b'], /unknown format 'sarif' \(use text, json or markdown\)/);
  });
  it('reads limits as percentages or fractions, never as bare numbers above 1', () => {
    expect(parseFraction('--x', '5%')).toBe(0.05);
    expect(parseFraction('--x', '0.5%')).toBeCloseTo(0.005, 15);
    expect(parseFraction('--x', '.2')).toBe(0.2);
    expect(parseFraction('--x', '0')).toBe(0);
    expect(parseFraction('--x', '5')).toMatch(/needs a percentage/);
    expect(parseFraction('--x', '-1%')).toMatch(/needs a percentage/);
    expect(parseFraction('--x', 'five')).toMatch(/needs a percentage/);
  });
});

describe('fix and export', () => {
  it('reads fix', () => {
    check(['fix', '--dry-run', '--only', 'symmetrize', 'a.kw', 'b.kw'], { kind: 'fix', options: { paths: ['a.kw', 'b.kw'], only: 'symmetrize', dryRun: true } });
    check(['fix', 'a.kw'], { kind: 'fix', options: { paths: ['a.kw'], dryRun: false } });
    check(['fix'], /fix needs at least one file/);
    check(['fix', '--dry-run=no', 'a.kw'], /takes no value/);
  });
  it('reads export', () => {
    check(['export', 'a.kw'], { kind: 'export', options: { file: 'a.kw', format: 'json' } });
    check(['export', 'a.kw', '--kernel', 'k', '--format', 'npy', '-o', 'out', '--grid-points', '51', '--eigenvalues', '3'], {
      kind: 'export', options: { file: 'a.kw', kernel: 'k', format: 'npy', output: 'out', gridPoints: 51, eigenCount: 3 },
    });
    check(['export', 'a.kw', '--format', 'csv'], /name a folder with -o <folder>/);
    check(['export'], /export needs exactly one file, got 0/);
    check(['export', 'a.kw', '--kernel'], /option --kernel needs a value/);
  });
  it('names every command in the help and in the unknown-command message', () => {
    for (const c of ['check', 'compare', 'fix', 'export']) expect(usageText).toContain(`kernwright ${c} `);
    check(['diff', 'a', 'b'], /unknown command 'diff' \(the commands are: check, compare, fix, export\)/);
  });
});
