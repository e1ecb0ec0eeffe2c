import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { discoverFiles } from '../../server/src/cli/discover';
import { decodeSource, maxSourceBytes, readSource } from '../../server/src/cli/readSource';
import { exitCodeFor } from '../../server/src/cli/exitCode';

let root = '';
const at = (...parts: string[]): string => path.join(root, ...parts);
function write(rel: string, content: string | Uint8Array): void {
  fs.mkdirSync(path.dirname(at(rel)), { recursive: true });
  fs.writeFileSync(at(rel), content);
}

beforeAll(() => {
  root = fs.mkdtempSync(path.join(os.tmpdir(), 'kw-inputs-'));
  write('tree/b.kw', 'domain [0, 1]\n');
  write('tree/a.kw', '');
  write('tree/sub/c.kw', '');
  write('tree/sub-d.kw', '');
  write('tree/notes.txt', '');
  write('tree/UPPER.KW', '');
  write('tree/node_modules/pkg/x.kw', '');
  write('tree/.hidden/y.kw', '');
  write('empty/readme.md', '');
});
afterAll(() => fs.rmSync(root, { recursive: true, force: true }));

describe('discoverFiles', () => {
  it('finds .kw files recursively in sorted order, skipping node_modules and dot-folders', () => {
    const found = discoverFiles([at('tree')]);
    expect(found.problems).toEqual([]);
    expect(found.files.map((f) => path.relative(root, f))).toEqual(
      ['tree/UPPER.KW', 'tree/a.kw', 'tree/b.kw', 'tree/sub/c.kw', 'tree/sub-d.kw'].map((p) => path.join(...p.split('/'))),
    );
  });
  it('keeps a file named on the command line as given, and checks a file named twice once', () => {
    const file = at('tree', 'notes.txt');
    const found = discoverFiles([file, at('tree', 'a.kw'), at('tree')]);
    expect(found.files[0]).toBe(file);
    expect(found.files[1]).toBe(at('tree', 'a.kw'));
    expect(found.files.filter((f) => f === at('tree', 'a.kw'))).toHaveLength(1);
  });
  it('reports a missing path and a folder without kernel files, one line each', () => {
    const found = discoverFiles([at('nope.kw'), at('empty')]);
    expect(found.files).toEqual([]);
    expect(found.problems).toEqual([`cannot find '${at('nope.kw')}'`, `no .kw files in folder '${at('empty')}'`]);
  });
});

describe('readSource and decodeSource', () => {
  it('reads UTF-8 text and drops a byte-order mark', () => {
    write('bom.kw', '\uFEFFdomain [0, 1] # π\n');
    expect(readSource(at('bom.kw'))).toEqual({ ok: true, text: 'domain [0, 1] # π\n' });
  });
  it('refuses a binary file, naming the NUL byte', () => {
    const r = decodeSource('x.kw', new Uint8Array([100, 111, 0, 1]));
    expect(r).toEqual({ ok: false, message: `'x.kw' looks like a binary file (NUL byte at offset 2), not a kernel file` });
  });
  it('refuses bytes that are not UTF-8', () => {
    const r = decodeSource('x.kw', new Uint8Array([0x63, 0xff, 0xfe, 0x0a]));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/not valid UTF-8/);
  });
  it('refuses a file over the size limit with its size, before reading it', () => {
    write('big.kw', '#'.repeat(maxSourceBytes + 1));
    const r = readSource(at('big.kw'));
    expect(r).toEqual({ ok: false, message: `'${at('big.kw')}' is too large to check (2 MB, ${maxSourceBytes + 1} bytes; the limit is 2 MB)` });
    expect(readSource(at('tree', 'b.kw')).ok).toBe(true);
  });
  it('accepts a file of exactly the limit', () => {
    expect(decodeSource('x.kw', new Uint8Array(maxSourceBytes).fill(35)).ok).toBe(true);
  });
  it('says why a file cannot be read', () => {
    expect(readSource(at('missing.kw'))).toEqual({ ok: false, message: `cannot read '${at('missing.kw')}': no such file or folder` });
  });
});

describe('exitCodeFor', () => {
  const none = { files: 1, errors: 0, warnings: 0, infos: 3, hints: 4 };
  const warned = { ...none, warnings: 1 };
  const failed = { ...none, errors: 1 };
  it('fails on errors by default, on warnings when asked, never when told so', () => {
    expect([none, warned, failed].map((s) => exitCodeFor(s, 'error'))).toEqual([0, 0, 1]);
    expect([none, warned, failed].map((s) => exitCodeFor(s, 'warning'))).toEqual([0, 1, 1]);
    expect([none, warned, failed].map((s) => exitCodeFor(s, 'never'))).toEqual([0, 0, 0]);
  });
});
