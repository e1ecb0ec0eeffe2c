/**
 * The extension's manifest, grammar and language configuration agree with each other and with the code: the
 * language id, the activation event, the files it points to, the commands the extension registers, and a grammar
 * whose patterns compile and colour the pieces of a kernel file.
 */
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { keywords } from '@kernwright/core';

const client = path.resolve(__dirname, '..', '..', 'client');
const manifest = JSON.parse(readFileSync(path.join(client, 'package.json'), 'utf8'));
const extensionSource = readFileSync(path.join(client, 'src', 'extension.ts'), 'utf8');
const grammar = JSON.parse(readFileSync(path.join(client, 'syntaxes', 'kernwright.tmLanguage.json'), 'utf8'));

describe('manifest', () => {
  it('activates on the language it contributes, for .kw files', () => {
    expect(manifest.activationEvents).toEqual(['onLanguage:kernwright']);
    const [language] = manifest.contributes.languages;
    expect(language.id).toBe('kernwright');
    expect(language.extensions).toEqual(['.kw']);
    expect(language.aliases[0]).toBe('Kernwright kernel');
    expect(existsSync(path.join(client, language.configuration))).toBe(true);
    const [g] = manifest.contributes.grammars;
    expect(g.language).toBe('kernwright');
    expect(g.scopeName).toBe(grammar.scopeName);
    expect(existsSync(path.join(client, g.path))).toBe(true);
  });
  it('keeps engines and types at VS Code 1.100 or below, and has what packaging needs', () => {
    const root = JSON.parse(readFileSync(path.join(client, '..', 'package.json'), 'utf8'));
    const minor = (v: string) => Number(/1\.(\d+)/u.exec(v)?.[1]);
    expect(minor(manifest.engines.vscode)).toBeLessThanOrEqual(100);
    expect(minor(root.devDependencies['@types/vscode'])).toBeLessThanOrEqual(100);
    expect(manifest.main).toBe('./dist/extension.js');
    expect(manifest.publisher).toBeTruthy();
    expect(existsSync(path.join(client, 'LICENSE'))).toBe(true);
    expect(existsSync(path.join(client, '.vscodeignore'))).toBe(true);
  });
  it('declares exactly the commands the extension registers', () => {
    // The spectrum view registers its own command (client/src/spectrumView/registerSpectrumView.ts).
    const viewSource = readFileSync(path.join(client, 'src', 'spectrumView', 'registerSpectrumView.ts'), 'utf8');
    const viewCommand = /showSpectrumCommand = '([^']+)'/u.exec(viewSource)?.[1];
    const registered = [...[...extensionSource.matchAll(/registerCommand\('([^']+)'/gu)].map((m) => m[1]), viewCommand].sort();
    const declared = manifest.contributes.commands.map((c: { command: string }) => c.command).sort();
    expect(declared).toEqual(registered);
    expect(registered).toEqual(['kernwright.reanalyse', 'kernwright.showFigures', 'kernwright.showSpectrum']);
  });
});

/** Every regular expression of the grammar, with where it sits. */
function patterns(node: unknown, where = '$'): [string, string][] {
  if (Array.isArray(node)) return node.flatMap((n, i) => patterns(n, `${where}[${i}]`));
  if (typeof node !== 'object' || node === null) return [];
  const out: [string, string][] = [];
  for (const [k, v] of Object.entries(node)) {
    if (['match', 'begin', 'end'].includes(k) && typeof v === 'string') out.push([`${where}.${k}`, v]);
    else out.push(...patterns(v, `${where}.${k}`));
  }
  return out;
}

describe('grammar', () => {
  const all = patterns(grammar);
  it('compiles every pattern', () => {
    expect(all.length).toBeGreaterThan(15);
    for (const [where, source] of all) expect(() => new RegExp(source, 'u'), where).not.toThrow();
  });
  const rx = (name: string) => new RegExp(grammar.repository[name].match ?? grammar.repository[name].begin, 'u');
  it('recognises declarations, claims, numbers and comments', () => {
    expect(rx('kernel-header').exec('kernel σ_cov(t, s) = 1')?.[2]).toBe('σ_cov');
    expect(rx('fn-header').exec('fn bump(x) = x')?.[2]).toBe('bump');
    expect(rx('const-header').exec('const ell = 2')?.[2]).toBe('ell');
    expect(rx('expect-clause').test('  expect hermitian')).toBe(true);
    expect(rx('comment').exec('x = 1  # km')?.[0]).toBe('# km');
    const number = rx('number');
    for (const n of ['2', '0.5', '.5', '3e-4', '1.5E+2']) expect(number.exec(` ${n} `)?.[0]).toBe(n);
    expect(number.test('x2')).toBe(false);
  });
  it('knows every keyword, built-in function and claim of the core', async () => {
    const text = JSON.stringify(grammar);
    for (const k of keywords) expect(text).toContain(k);
    const { expectationInfo, builtinFunctions } = await import('@kernwright/core');
    for (const claim of Object.keys(expectationInfo)) expect(text).toContain(claim);
    const builtins = grammar.repository.expression.patterns.find((p: { name?: string }) => p.name === 'support.function.builtin.kernwright').match as string;
    for (const f of Object.keys(builtinFunctions)) expect(new RegExp(builtins, 'u').exec(`${f}(x)`)?.[1], f).toBe(f);
  });
});
