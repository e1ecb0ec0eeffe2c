/**
 * Every quick fix the server offers on the broken examples, applied through the protocol: the problem it fixes is
 * gone after re-analysis, and nothing new of severity error appears.
 */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildBundles } from './build';
import { TestClient, root, type Pos } from './lspClient';

let c: TestClient;
beforeAll(async () => {
  buildBundles();
  c = await TestClient.start();
});
afterAll(async () => {
  await c?.stop();
});

interface LspDiagnostic {
  code?: unknown;
  severity?: number;
  range: { start: Pos; end: Pos };
  message: unknown;
}
interface Action {
  title: string;
  kind?: string;
  isPreferred?: boolean;
  diagnostics?: LspDiagnostic[];
  edit?: { changes?: Record<string, { range: { start: Pos; end: Pos }; newText: string }[]> };
}

const brokenDir = path.join(root, 'examples', 'broken');
const files = readdirSync(brokenDir).filter((f) => f.endsWith('.kw')).sort();
const applied: string[] = [];

describe('quick fixes on the broken examples', () => {
  it.each(files)('%s: each offered fix removes its problem', async (file) => {
    const text = readFileSync(path.join(brokenDir, file), 'utf8');
    const uri = c.uriOf(`fixes/${file}`);
    await c.open(uri, text);
    const diagnostics = (await c.settled(uri)) as LspDiagnostic[];
    for (const d of diagnostics) {
      const actions = await c.request<Action[]>('textDocument/codeAction', {
        textDocument: { uri }, range: d.range, context: { diagnostics: [d], only: ['quickfix'] },
      });
      const mine = actions.filter((a) => a.diagnostics?.some((x) => x.code === d.code && x.range.start.line === d.range.start.line));
      for (const action of mine) {
        expect(action.kind).toBe('quickfix');
        // Apply the fix to a fresh copy of the file, re-analyse, and look for the same problem at the same place.
        await c.replace(uri, text);
        await c.settled(uri);
        const edits = action.edit?.changes?.[uri] ?? [];
        expect(edits.length).toBeGreaterThan(0);
        await c.applyEdits(uri, edits);
        const after = (await c.settled(uri)) as LspDiagnostic[];
        const same = after.filter((x) => x.code === d.code && x.range.start.line === d.range.start.line && String(x.message) === String(d.message));
        expect(same, `${file}: “${action.title}” should remove ${String(d.code)}`).toEqual([]);
        const newErrors = after.filter((x) => x.severity === 1 && !diagnostics.some((y) => y.code === x.code));
        expect(newErrors, `${file}: “${action.title}” introduced errors`).toEqual([]);
        applied.push(`${file}: ${String(d.code)} ${action.title}`);
      }
    }
    await c.close(uri);
  }, 120_000);

  it('applied the fixes the examples are meant to show', () => {
    const joined = applied.join('\n');
    expect(joined).toMatch(/missing-operator\.kw: KW104/u);
    expect(joined).toMatch(/reversed-domain\.kw: KW208/u);
    expect(joined).toMatch(/unknown-expectation\.kw: KW213/u);
    expect(joined).toMatch(/unknown-name\.kw: KW201/u);
    expect(joined).toMatch(/not-symmetric\.kw: KW601 .*symmetric/u);
    expect(joined).toMatch(/KW610 Declare/u);
  });

  it('simplifies the symmetrized kernel (mathjs, loaded by the worker on the first fix)', async () => {
    const uri = c.uriOf('fixes/simplify.kw');
    await c.open(uri, 'domain [0, 1]\nkernel k(t, s) = t * s + t\n  expect hermitian\n');
    const failed = ((await c.settled(uri)) as LspDiagnostic[]).find((d) => d.code === 'KW601')!;
    const actions = await c.request<Action[]>('textDocument/codeAction', { textDocument: { uri }, range: failed.range, context: { diagnostics: [failed] } });
    const symmetrize = actions.find((a) => /symmetric part/u.test(a.title))!;
    const [edit] = symmetrize.edit!.changes![uri];
    // (K(t, s) + K(s, t)) / 2 = (t s + t + s t + s) / 2: the simplifier merges t s and s t.
    expect(edit.newText).not.toMatch(/s \* t/u);
    await c.applyEdits(uri, [edit]);
    expect((await c.settled(uri)).map((d) => String(d.code))).not.toContain('KW601');
  });
});
