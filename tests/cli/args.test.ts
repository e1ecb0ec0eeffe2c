import { describe, expect, it } from 'vitest';
import { parseArgs, type Command } from '../../server/src/cli/args';

function check(argv: string[], expected: Command | { kind: 'usage-error'; message: RegExp }): void {
  const got = parseArgs(argv);
  if (expected.kind === 'usage-error' && expected.message instanceof RegExp) {
    expect(got.kind).toBe('usage-error');
    if (got.kind === 'usage-error') expect(got.message).toMatch(expected.message);
  } else {
    expect(got).toEqual(expected);
  }
}

const defaults = { format: 'text', failOn: 'error', numerics: true } as const;

describe('parseArgs', () => {
  it('reads a check of files and folders with the default options', () => {
    check(['check', 'a.kw', 'examples/'], { kind: 'check', options: { ...defaults, paths: ['a.kw', 'examples/'] } });
  });
  it('reads every option, before or after the paths, with a space or an equals sign', () => {
    check(['check', '--format', 'json', 'a.kw', '--fail-on=warning', '--no-numerics'], {
      kind: 'check',
      options: { paths: ['a.kw'], format: 'json', failOn: 'warning', numerics: false },
    });
    check(['--format=text', 'check', '--fail-on', 'never', 'b.kw'], {
      kind: 'check',
      options: { ...defaults, failOn: 'never', paths: ['b.kw'] },
    });
  });
  it('takes everything after -- as a path', () => {
    check(['check', '--', '--odd-name.kw'], { kind: 'check', options: { ...defaults, paths: ['--odd-name.kw'] } });
  });
  it('answers --help and --version wherever they stand', () => {
    check(['--help'], { kind: 'help' });
    check(['check', '-h'], { kind: 'help' });
    check(['--version'], { kind: 'version' });
    check(['-v', 'check', 'x.kw'], { kind: 'version' });
  });
  it('refuses a missing command, a missing path and an unknown command', () => {
    check([], { kind: 'usage-error', message: /no command given/ });
    check(['check'], { kind: 'usage-error', message: /at least one file or folder/ });
    check(['lint', 'a.kw'], { kind: 'usage-error', message: /unknown command 'lint'/ });
    check(['a.kw'], { kind: 'usage-error', message: /did you mean: kernwright check a\.kw/ });
  });
  it('refuses unknown options and bad option values, naming them', () => {
    check(['check', '--frobnicate', 'a.kw'], { kind: 'usage-error', message: /unknown option '--frobnicate'/ });
    check(['check', '-x', 'a.kw'], { kind: 'usage-error', message: /unknown option '-x'/ });
    check(['check', '--format', 'xml', 'a.kw'], { kind: 'usage-error', message: /unknown format 'xml'/ });
    check(['check', 'a.kw', '--format'], { kind: 'usage-error', message: /--format needs a value/ });
    check(['check', '--format', '--no-numerics', 'a.kw'], { kind: 'usage-error', message: /--format needs a value/ });
    check(['check', '--fail-on=info', 'a.kw'], { kind: 'usage-error', message: /unknown --fail-on value 'info'/ });
    check(['check', '--no-numerics=yes', 'a.kw'], { kind: 'usage-error', message: /takes no value/ });
  });
  it('keeps every usage message on one line', () => {
    for (const argv of [[], ['check'], ['x'], ['check', '--bad'], ['check', '--format', 'z', 'a']]) {
      const got = parseArgs(argv);
      expect(got.kind).toBe('usage-error');
      if (got.kind === 'usage-error') expect(got.message).not.toMatch(/\n/);
    }
  });
});
