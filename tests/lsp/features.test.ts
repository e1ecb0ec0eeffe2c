/**
 * The editing features through the real server: hover, code lens, completion, signature help, definition,
 * references, rename, outline, folding, formatting and semantic tokens, on the examples and small files.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildBundles } from './build';
import { TestClient, applyEdit, find, root, type Pos } from './lspClient';

let c: TestClient;
beforeAll(async () => {
  buildBundles();
  c = await TestClient.start();
});
afterAll(async () => {
  await c?.stop();
});

const read = (file: string) => readFileSync(path.join(root, file), 'utf8');

async function hover(uri: string, at: Pos): Promise<string | null> {
  const h = await c.request<{ contents: { value: string } } | null>('textDocument/hover', { textDocument: { uri }, position: at });
  return h?.contents.value ?? null;
}

describe('hover', () => {
  it('shows a kernel’s norm with error and bracket, eigenvalues with errors, trace and method', async () => {
    const uri = await c.openFile('examples/heated-rod.kw');
    await c.settled(uri);
    const text = read('examples/heated-rod.kw');
    const h = (await hover(uri, find(text, 'rod_green', 2)))!;
    expect(h).toContain('kernel rod_green(t, s) on [0, 0.8]');
    // ‖T‖ = L²/(k π²) = 0.64 / (1.5 π²) = 0.0432303716…
    expect(h).toMatch(/\| ‖T‖ \| 0\.04323037\d* ± [\d.e-]+ in \\\[0\.0432\d*, [\d.]+\\\] \|/u);
    expect(h).toMatch(/\| λ₁ \| 0\.04323037\d* ± [\d.e-]+ \|\n\| λ₂ \| 0\.01080759\d* ± /u);
    expect(h).toMatch(/\| trace \| 0\.0711111\d* ± [\d.e-]+ \|/u);
    expect(h).toMatch(/Hermitian ✓ \(by construction\) · positive ✓ \(λ\\_min = /u);
  });

  it('shows a constant’s value and unit note, a helper’s definition, a parameter’s role', async () => {
    const rod = read('examples/heated-rod.kw');
    const uri = c.uriOf('examples/heated-rod.kw');
    const h = (await hover(uri, find(rod, 'rod_length', 1)))!;
    expect(h).toContain('const rod_length = 0.8');
    expect(h).toContain('Value: `0.8`');
    expect(h).toContain('Note: m');
    const field = read('examples/neural-field.kw');
    const nf = await c.openFile('examples/neural-field.kw');
    expect(await hover(nf, find(field, 'gaussian(t - s', 2))).toContain('fn gaussian(x, width) = exp(-x ^ 2 / (2 * width ^ 2))');
    expect(await hover(nf, find(field, 'mexican_hat(t, s)', 12))).toContain('the output point t');
  });

  it('explains a claim and says whether the numbers agree', async () => {
    const text = read('examples/heated-rod.kw');
    const uri = c.uriOf('examples/heated-rod.kw');
    const h = (await hover(uri, find(text, 'positive', 2)))!;
    expect(h).toContain('Positive semidefinite');
    expect(h).toContain('✓');
    const broken = await c.openFile('examples/broken/unknown-expectation.kw');
    await c.settled(broken);
    const bad = (await hover(broken, find(read('examples/broken/unknown-expectation.kw'), 'symmetric', 2)))!;
    expect(bad).toContain('not a known claim');
  });

  it('gives the signature of a built-in function and the value of a built-in constant', async () => {
    const text = read('examples/pollen-dispersal.kw');
    const uri = await c.openFile('examples/pollen-dispersal.kw');
    expect(await hover(uri, find(text, 'exp(', 1))).toContain('exp(z)');
    expect(await hover(uri, find(text, 'pi *', 0))).toContain('3.14159');
  });
});

describe('code lens', () => {
  it('puts the norm and λ₁ with their errors above each kernel', async () => {
    const uri = c.uriOf('examples/heated-rod.kw');
    await c.settled(uri);
    const lenses = await c.request<{ range: { start: Pos }; command: { title: string; command: string; arguments: unknown[] } }[]>(
      'textDocument/codeLens', { textDocument: { uri } });
    expect(lenses).toHaveLength(2);
    for (const lens of lenses) {
      expect(lens.command.title).toMatch(/^‖T‖ = [\d.e-]+ ± [\d.e-]+ · λ₁ = [\d.e-]+ ± [\d.e-]+/u);
      expect(lens.command.command).toBe('kernwright.showFigures');
    }
    expect(lenses.map((l) => l.command.arguments[1])).toEqual(['rod_green', 'unit_rod']);
    const shown = await c.request<string>('workspace/executeCommand', { command: 'kernwright.showFigures', arguments: [uri, 'unit_rod'] });
    expect(shown).toContain('kernel unit_rod on [0, 1]');
    expect(c.messages.some((m) => m.message.includes('kernel unit_rod'))).toBe(true);
  });
});

describe('completion and signature help', () => {
  const text = 'domain [0, 1]\nconst ell = 0.3  # m\nfn bump(x, width) = exp(-x^2 / width^2)\nkernel k(t, s) = bump(t - s, ell)\n  expect \n';
  let uri: string;
  beforeAll(async () => {
    uri = c.uriOf('complete.kw');
    await c.open(uri, text);
  });
  const labels = async (at: Pos) =>
    (await c.request<{ label: string; insertText?: string }[]>('textDocument/completion', { textDocument: { uri }, position: at })).map((i) => i.label);

  it('offers declaration keywords at the start of a line', async () => {
    expect(await labels({ line: 5, character: 0 })).toEqual(expect.arrayContaining(['kernel', 'const', 'fn', 'domain', 'expect']));
  });
  it('offers claims after expect', async () => {
    const got = await labels({ line: 4, character: 9 });
    expect(got).toEqual(expect.arrayContaining(['hermitian', 'positive', 'hilbert-schmidt', 'norm', 'rank', 'resolvent']));
    expect(got).not.toContain('exp');
  });
  it('offers parameters, constants, helpers and built-ins in a kernel body', async () => {
    const got = await labels(find(text, 'bump(t - s', 5));
    expect(got).toEqual(expect.arrayContaining(['t', 's', 'ell', 'bump', 'exp', 'min', 'pi', 'i']));
    const items = await c.request<{ label: string; detail?: string; insertText?: string }[]>('textDocument/completion', { textDocument: { uri }, position: find(text, 'bump(t - s', 5) });
    expect(items.find((i) => i.label === 'bump')?.insertText).toBe('bump(${1:x}, ${2:width})');
    expect(items.find((i) => i.label === 'ell')?.detail).toBe('= 0.3');
  });
  it('shows the signature and the active argument inside a call', async () => {
    const help = await c.request<{ signatures: { label: string }[]; activeParameter: number }>('textDocument/signatureHelp', {
      textDocument: { uri }, position: find(text, ', ell)', 2),
    });
    expect(help.signatures[0].label).toBe('bump(x, width)');
    expect(help.activeParameter).toBe(1);
  });
});

describe('navigation and rename', () => {
  const text = 'domain [0, 1]\nconst ell = 0.3\nfn bump(x) = exp(-x^2 / ell^2)\nkernel k(t, s) = bump(t - s) * ell\n';
  let uri: string;
  beforeAll(async () => {
    uri = c.uriOf('navigate.kw');
    await c.open(uri, text);
    await c.settled(uri);
  });

  it('goes to the definition of a constant, a helper and a parameter', async () => {
    const def = await c.request<{ range: { start: Pos } }>('textDocument/definition', { textDocument: { uri }, position: find(text, 'ell', 0, 2) });
    expect(def.range.start).toEqual({ line: 1, character: 6 });
    const fn = await c.request<{ range: { start: Pos } }>('textDocument/definition', { textDocument: { uri }, position: find(text, 'bump(t', 1) });
    expect(fn.range.start).toEqual({ line: 2, character: 3 });
    const param = await c.request<{ range: { start: Pos } }>('textDocument/definition', { textDocument: { uri }, position: find(text, 't - s', 0) });
    expect(param.range.start).toEqual(find(text, 't, s)'));
  });

  it('finds every reference', async () => {
    const refs = await c.request<{ range: { start: Pos } }[]>('textDocument/references', {
      textDocument: { uri }, position: find(text, 'ell', 0), context: { includeDeclaration: true },
    });
    expect(refs.map((r) => r.range.start.line)).toEqual([1, 2, 3]);
  });

  it('renames a constant everywhere and refuses names that clash', async () => {
    const prep = await c.request<{ placeholder: string }>('textDocument/prepareRename', { textDocument: { uri }, position: find(text, 'ell', 1, 1) });
    expect(prep.placeholder).toBe('ell');
    const edit = await c.request<{ changes: Record<string, { range: { start: Pos; end: Pos }; newText: string }[]> }>('textDocument/rename', {
      textDocument: { uri }, position: find(text, 'ell', 1, 1), newName: 'width',
    });
    const edits = edit.changes[uri];
    expect(edits).toHaveLength(3);
    let renamed = text;
    for (const e of [...edits].sort((a, b) => b.range.start.line - a.range.start.line || b.range.start.character - a.range.start.character)) renamed = applyEdit(renamed, e);
    expect(renamed).toBe('domain [0, 1]\nconst width = 0.3\nfn bump(x) = exp(-x^2 / width^2)\nkernel k(t, s) = bump(t - s) * width\n');
    await expect(c.request('textDocument/rename', { textDocument: { uri }, position: find(text, 'ell', 1, 1), newName: 'bump' })).rejects.toThrow(/already declared/u);
    await expect(c.request('textDocument/rename', { textDocument: { uri }, position: find(text, 'ell', 1, 1), newName: 'exp' })).rejects.toThrow(/built-in/u);
    await expect(c.request('textDocument/rename', { textDocument: { uri }, position: find(text, 'ell', 1, 1), newName: 'x' })).rejects.toThrow(/hide/u);
  });

  it('renames a kernel parameter inside its declaration only', async () => {
    const edit = await c.request<{ changes: Record<string, { range: { start: Pos }; newText: string }[]> }>('textDocument/rename', {
      textDocument: { uri }, position: find(text, 't, s)'), newName: 'u',
    });
    expect(edit.changes[uri].map((e) => e.range.start.line)).toEqual([3, 3]);
  });
});

describe('outline, folding, formatting, semantic tokens', () => {
  it('lists constants, helpers and kernels with their claims', async () => {
    const uri = c.uriOf('examples/soil-moisture.kw');
    await c.openFile('examples/soil-moisture.kw');
    const symbols = await c.request<{ name: string; children?: { name: string }[] }[]>('textDocument/documentSymbol', { textDocument: { uri } });
    expect(symbols.map((s) => s.name)).toEqual(['domain', 'sill', 'range_km', 'moisture_exp', 'moisture_smooth']);
    expect(symbols[3].children?.map((s) => s.name)).toEqual(['hermitian', 'positive', 'continuous', 'bounded', 'hilbert-schmidt', 'norm']);
  });

  it('folds kernels with their claims and comment blocks', async () => {
    const uri = c.uriOf('examples/soil-moisture.kw');
    const folds = await c.request<{ startLine: number; endLine: number; kind?: string }[]>('textDocument/foldingRange', { textDocument: { uri } });
    const text = read('examples/soil-moisture.kw');
    const kernelLine = find(text, 'kernel moisture_exp').line;
    expect(folds).toContainEqual({ startLine: kernelLine, endLine: kernelLine + 2, kind: 'region' });
    expect(folds.some((f) => f.kind === 'comment' && f.startLine === 0)).toBe(true);
  });

  it('formats to the canonical layout, keeping comments', async () => {
    const uri = c.uriOf('messy.kw');
    const messy = 'domain [ 0,1 ]   # km\nconst  a=2*(3)   # note\nkernel k(t,s)=a*exp( -(t-s)^2 )\n    + 1\n  # about the claims\n expect hermitian,positive\n\n\n\n# end\n';
    await c.open(uri, messy);
    const edits = await c.request<{ range: { start: Pos; end: Pos }; newText: string }[]>('textDocument/formatting', {
      textDocument: { uri }, options: { tabSize: 2, insertSpaces: true },
    });
    let formatted = messy;
    for (const e of [...edits].reverse()) formatted = applyEdit(formatted, e);
    expect(formatted).toBe('domain [0, 1]    # km\nconst a = 2 * 3  # note\nkernel k(t, s) = a * exp(-(t - s) ^ 2) + 1\n  # about the claims\n  expect hermitian, positive\n\n# end\n');
    const broken = c.uriOf('broken-format.kw');
    await c.open(broken, 'kernel k(t, s) = 2t\n');
    expect(await c.request('textDocument/formatting', { textDocument: { uri: broken }, options: { tabSize: 2, insertSpaces: true } })).toEqual([]);
  });

  it('classifies parameters, constants, helpers and built-ins', async () => {
    const uri = c.uriOf('tokens.kw');
    await c.open(uri, 'const a = 1\nfn f(x) = x * a\nkernel k(t, s) = f(t) * exp(s) * pi\n');
    const tokens = await c.request<{ data: number[] }>('textDocument/semanticTokens/full', { textDocument: { uri } });
    // Decode (line delta, char delta, length, type, modifiers) into absolute tokens.
    const out: string[] = [];
    let line = 0;
    let ch = 0;
    const types = ['parameter', 'variable', 'function', 'class', 'enumMember'];
    for (let k = 0; k < tokens.data.length; k += 5) {
      const [dl, dc, len, type, mods] = tokens.data.slice(k, k + 5);
      line += dl;
      ch = dl === 0 ? ch + dc : dc;
      out.push(`${line}:${ch}:${len}:${types[type]}${mods & 1 ? '+decl' : ''}${mods & 4 ? '+lib' : ''}`);
    }
    expect(out).toEqual([
      '0:6:1:variable+decl', '1:3:1:function+decl', '1:5:1:parameter+decl', '1:10:1:parameter', '1:14:1:variable',
      '2:7:1:class+decl', '2:9:1:parameter+decl', '2:12:1:parameter+decl', '2:17:1:function', '2:19:1:parameter',
      '2:24:3:function+lib', '2:28:1:parameter', '2:33:2:variable+lib',
    ]);
  });
});
