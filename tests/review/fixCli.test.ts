/**
 * `kernwright fix` run as a user runs it: fixes applied and written atomically, idempotence, --dry-run diffs and
 * exit codes, --only, line endings, byte-order marks and permissions kept, and refusals that leave every file
 * untouched.
 */
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { writeAtomically } from '../../server/src/cli/fixCommand';
import { bundleCli, expectCleanFailure, writeTree, type Harness, type Run } from './cliHarness';

vi.setConfig({ testTimeout: 600_000 });

let h: Harness;
let work = '';
const messy = [
  '# Invented test scenario: three slips in one file.',
  'domain [1, 0]',
  'const width = 0.3',
  'kernel k(t, s) = exp(-abs(t - s) / widht)',
  'kernel m(t, s) on [0, 1] = 2t * s',
  '',
].join('\n');
const broken = '# Invented test scenario.\ndomain [0, 1]\nkernel k(t, s) = (t + s\n';

function kw(...args: string[]): Run {
  return h.run(work, [...args, '--time-budget', '20000']);
}
const read = (rel: string) => fs.readFileSync(path.join(work, rel));
const leftovers = () => fs.readdirSync(work).filter((n) => n.endsWith('.tmp'));

beforeAll(async () => {
  h = await bundleCli();
  work = fs.mkdtempSync(path.join(os.tmpdir(), 'kw-fix-'));
  writeTree(work, {
    'messy.kw': messy,
    'preview.kw': messy,
    'crlf.kw': Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(messy.replace(/\n/g, '\r\n'))]),
    'only.kw': messy.replace('2t', '2*t'),
    'broken.kw': broken,
    'good.kw': messy,
    'binary.kw': new Uint8Array([1, 0, 2]),
  });
  fs.chmodSync(path.join(work, 'messy.kw'), 0o640);
}, 300_000);

afterAll(() => {
  h?.dispose();
  if (work) fs.rmSync(work, { recursive: true, force: true });
});

describe('kernwright fix', () => {
  it('applies the fixes, writes the file, and changes nothing the second time', () => {
    const first = kw('fix', 'messy.kw');
    expect(first.status).toBe(0);
    expect(first.stderr).toBe('');
    expect(first.stdout).toMatch(/^messy\.kw: applied \d+ fixes in 2 passes \(.*swap-domain ×1.*\)\n$/);
    const fixedText = read('messy.kw').toString('utf8');
    expect(fixedText).toContain('domain [0, 1]');
    expect(fixedText).toContain('/ width)');
    expect(fixedText).toContain('2*t * s');
    expect(fs.statSync(path.join(work, 'messy.kw')).mode & 0o777).toBe(0o640);
    const second = kw('fix', 'messy.kw');
    expect(second.status).toBe(0);
    expect(second.stdout).toBe('messy.kw: nothing to fix\n');
    expect(read('messy.kw').toString('utf8')).toBe(fixedText);
    expect(leftovers()).toEqual([]);
  });

  it('prints a unified diff with --dry-run, exit 1, and leaves the file alone; exit 0 once nothing is left', () => {
    const before = read('preview.kw');
    const r = kw('fix', '--dry-run', 'preview.kw');
    expect(r.status).toBe(1);
    expect(r.stdout).toMatch(/^--- a\/preview\.kw\n\+\+\+ b\/preview\.kw\n@@ -1,5 \+1,\d+ @@\n/);
    expect(r.stdout).toContain('-domain [1, 0]\n+domain [0, 1]\n');
    expect(read('preview.kw').equals(before)).toBe(true);
    expect(kw('fix', 'preview.kw').status).toBe(0);
    const clean = kw('fix', '--dry-run', 'preview.kw');
    expect(clean).toMatchObject({ status: 0, stdout: '' });
  });

  it('keeps CRLF line endings and the byte-order mark', () => {
    expect(kw('fix', 'crlf.kw').status).toBe(0);
    const bytes = read('crlf.kw');
    expect([...bytes.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const text = bytes.subarray(3).toString('utf8');
    expect(text).not.toMatch(/[^\r]\n/);
    expect(text.replace(/\r\n/g, '\n')).toBe(read('messy.kw').toString('utf8'));
  });

  it('applies only the kind given with --only', () => {
    expect(kw('fix', '--only', 'did-you-mean', 'only.kw').status).toBe(0);
    expect(read('only.kw').toString('utf8')).toBe(messy.replace('2t', '2*t').replace('widht', 'width'));
  });

  it('refuses a file that does not parse cleanly, and then writes no file at all', () => {
    const r = kw('fix', 'good.kw', 'broken.kw');
    expectCleanFailure(r, 2, /not fixing 'broken\.kw': it does not parse cleanly and no fix repairs it \(line 3, column \d+: /);
    expect(r.stderr).toContain('nothing was written');
    expect(read('broken.kw').toString('utf8')).toBe(broken);
    expect(read('good.kw').toString('utf8')).toBe(messy);
    expect(leftovers()).toEqual([]);
  });

  it('exit 2 for missing, binary and empty inputs and bad options', () => {
    expectCleanFailure(kw('fix', 'nope.kw'), 2, /cannot find 'nope\.kw'/);
    expectCleanFailure(kw('fix', 'binary.kw'), 2, /looks like a binary file/);
    expectCleanFailure(kw('fix'), 2, /fix needs at least one file/);
    expectCleanFailure(kw('fix', '--only', 'Bad Kind!', 'messy.kw'), 2, /option --only needs a fix kind/);
    expectCleanFailure(kw('fix', '--format', 'json', 'messy.kw'), 2, /option --format does not apply to 'fix'/);
  });
});

describe('writeAtomically', () => {
  it('does not replace a file that changed on disk meanwhile, and leaves no temporary file', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'kw-atomic-'));
    try {
      const file = path.join(dir, 'a.kw');
      fs.writeFileSync(file, 'edited by someone else\n');
      expect(() => writeAtomically(file, Buffer.from('fixed\n'), Buffer.from('original\n'))).toThrow(/changed on disk/);
      expect(fs.readFileSync(file, 'utf8')).toBe('edited by someone else\n');
      expect(fs.readdirSync(dir)).toEqual(['a.kw']);
      writeAtomically(file, Buffer.from('fixed\n'), Buffer.from('edited by someone else\n'));
      expect(fs.readFileSync(file, 'utf8')).toBe('fixed\n');
      expect(fs.readdirSync(dir)).toEqual(['a.kw']);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});
