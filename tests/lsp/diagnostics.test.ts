/**
 * The two stages of diagnostics through the real server over stdio: syntax and names at once, numerical findings
 * after; findings of unchanged kernels carried across edits; a burst of edits ends with exactly the diagnostics of
 * the final text; results of older versions never arrive after newer ones; requests are answered while a long
 * analysis runs; settings changes re-analyse.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyzeText, LineIndex } from '@kernwright/core';
import { buildBundles } from './build';
import { TestClient, find, type Published } from './lspClient';

let c: TestClient;
beforeAll(async () => {
  buildBundles();
  c = await TestClient.start({ settings: { numerics: { timeBudgetMs: 5000 } } });
});
afterAll(async () => {
  await c?.stop();
});

const codes = (p: { diagnostics: { code?: unknown }[] }) => p.diagnostics.map((d) => String(d.code));

/** The diagnostics the server should end with for `text`, as code@line:character → message. */
function expected(text: string): string[] {
  const a = analyzeText(text, { timeBudgetMs: 5000 });
  const index = new LineIndex(text);
  return a.diagnostics.filter((d) => d.code !== 'KW401').map((d) => {
    const p = index.position(d.range.start);
    return `${d.code}@${p.line}:${p.character} ${d.message}`;
  });
}

function actual(diagnostics: { code?: unknown; range: { start: { line: number; character: number } }; message: unknown }[]): string[] {
  return diagnostics.filter((d) => d.code !== 'KW401').map((d) => `${String(d.code)}@${d.range.start.line}:${d.range.start.character} ${String(d.message)}`);
}

/** Publications for one uri never go back to an older version. */
function monotonic(pubs: Published[]): boolean {
  let last = -Infinity;
  for (const p of pubs) {
    if ((p.version ?? 0) < last) return false;
    last = p.version ?? 0;
  }
  return true;
}

describe('two stages', () => {
  it('publishes name errors at once and evaluation faults after the numerical stage', async () => {
    const uri = await c.openFile('examples/broken/negative-sqrt.kw');
    const final = await c.settled(uri);
    const pubs = c.publicationsAt(uri, 1);
    expect(pubs.length).toBeGreaterThanOrEqual(2);
    expect(codes(pubs[0])).not.toContain('KW302');
    expect(final.map((d) => String(d.code))).toContain('KW302');
  });

  it('publishes syntax and name diagnostics in the first stage', async () => {
    const uri = await c.openFile('examples/broken/unknown-name.kw');
    await c.until(() => c.publicationsAt(uri, 1).length > 0, 30_000, 'first publication');
    expect(codes(c.publicationsAt(uri, 1)[0]).sort()).toEqual(['KW201', 'KW211']);
  });

  it('keeps the findings of unchanged kernels while another kernel is edited', async () => {
    const uri = c.uriOf('carry.kw');
    const text = 'domain [0, 1]\nkernel bad(t, s) = sqrt(t - s)\nkernel good(t, s) = exp(-abs(t - s))\n';
    await c.open(uri, text);
    const first = await c.settled(uri);
    const fault = first.find((d) => d.code === 'KW302');
    expect(fault).toBeDefined();
    // Insert a line above both kernels and edit the good one: the fault of `bad` moves down one line at once.
    const v2 = await c.replace(uri, '# moved\n' + text.replace('exp(-abs(t - s))', 'exp(-2 * abs(t - s))'));
    await c.until(() => c.publicationsAt(uri, v2).length > 0, 30_000, 'stage one of v2');
    const stageOne = c.publicationsAt(uri, v2)[0].diagnostics.find((d) => d.code === 'KW302');
    expect(stageOne?.range.start.line).toBe(fault!.range.start.line + 1);
    expect(stageOne?.message).toBe(fault!.message);
    // Editing the faulty kernel itself drops its finding from the first stage.
    const v3 = await c.replace(uri, '# moved\n' + text.replace('sqrt(t - s)', 'sqrt(abs(t - s))'));
    await c.until(() => c.publicationsAt(uri, v3).length > 0, 30_000, 'stage one of v3');
    expect(codes(c.publicationsAt(uri, v3)[0])).not.toContain('KW302');
    expect((await c.settled(uri)).map((d) => String(d.code))).not.toContain('KW302');
  });
});

describe('bursts of edits', () => {
  it('ends with exactly the diagnostics of the final text after 50 edits, never going back a version', async () => {
    const uri = c.uriOf('burst.kw');
    const make = (k: number) => [
      'domain [0, 1]',
      `const width = ${(0.1 + k / 100).toFixed(2)}`,
      `kernel smooth(t, s) = exp(-(t - s)^2 / width^2)`,
      `kernel rough(t, s) = sqrt(t - ${(k % 7) / 10} * s) + lenght`,
      k % 2 === 0 ? '  expect hermitian' : '  expect hermitain',
      '',
    ].join('\n');
    await c.open(uri, make(0));
    for (let k = 1; k <= 50; k++) await c.replace(uri, make(k));
    const final = await c.settled(uri);
    expect(c.version(uri)).toBe(51);
    expect(actual(final)).toEqual(expected(make(50)));
    expect(monotonic(c.published.filter((p) => p.uri === uri))).toBe(true);
    // The final publication is for the final version; older versions got at most their first stage.
    const last = c.published.filter((p) => p.uri === uri).at(-1)!;
    expect(last.version).toBe(51);
  });

  it('applies incremental edits the same way as full replacements', async () => {
    const uri = c.uriOf('incremental.kw');
    const text = 'domain [0, 1]\nconst a = 1\nkernel k(t, s) = a * min(t, s)\n';
    await c.open(uri, text);
    await c.settled(uri);
    let current = text;
    let typed = 0;
    for (const ch of ' - t * s') {
      const at = find(current, 'min(t, s)', 'min(t, s)'.length + typed++);
      await c.applyEdits(uri, [{ range: { start: at, end: at }, newText: ch }]);
      current = c.text(uri);
    }
    expect(current).toBe('domain [0, 1]\nconst a = 1\nkernel k(t, s) = a * min(t, s) - t * s\n');
    const final = await c.settled(uri);
    expect(actual(final)).toEqual(expected(current));
    const figures = await c.request<{ text: string }>('kernwright/figures', { uri, kernel: 'k' });
    // min(t, s) - t s on [0, 1]: eigenvalues 1/(n² π²); λ₁ = 1/π² ≈ 0.101321.
    expect(figures.text).toMatch(/λ₁\s+0\.10132/u);
    // The spectrum view's data: the same kernel report, with samples of K for its heat map.
    const data = await c.request<{ version: number; kernels: { report: { name: string; spectrum: { eigenvalues: { re: number }[] } } }[] }>(
      'kernwright/kernelData', { uri, points: 16 });
    expect(data.kernels.map((k) => k.report.name)).toEqual(['k']);
    expect(Math.abs(data.kernels[0].report.spectrum.eigenvalues[0].re - 1 / Math.PI ** 2)).toBeLessThan(1e-10);
  });
});

describe('responsiveness', () => {
  it('answers hovers and completions while a long numerical analysis runs, and reports progress', async () => {
    // A client of its own with the default time budget: about 16 × 250 ms or more of numerics.
    const c = await TestClient.start();
    const uri = c.uriOf('heavy.kw');
    const lines = ['domain [0, 1]'];
    for (let k = 0; k < 16; k++) lines.push(`kernel k${k}(t, s) = abs(t - s)^(-0.${k % 4 + 2}) * exp(-${k + 1} * (t + s)) + sign(t - 0.${k % 9 + 1})`);
    const text = lines.join('\n') + '\n';
    const progressBefore = c.progressCreated;
    await c.open(uri, text);
    await c.until(() => c.publicationsAt(uri, 1).length > 0, 30_000, 'stage one');
    const hover = await c.request<{ contents: { value: string } } | null>('textDocument/hover', { textDocument: { uri }, position: find(text, 'k3(', 1) });
    const completion = await c.request<unknown[]>('textDocument/completion', { textDocument: { uri }, position: find(text, 'exp(', 0) });
    const state = await c.request<{ pending: boolean }>('kernwright/analysisState', { uri });
    // Both answers came while the numerical stage was still running.
    expect(state.pending).toBe(true);
    expect(hover?.contents.value).toContain('kernel k3(t, s)');
    expect(completion.length).toBeGreaterThan(10);
    await c.settled(uri, 300_000);
    expect(c.progressCreated).toBeGreaterThan(progressBefore);
    await c.stop();
  }, 400_000);
});

describe('settings', () => {
  it('re-analyses open files when the settings change', async () => {
    const uri = await c.openFile('examples/heated-rod.kw');
    await c.settled(uri);
    const before = await c.request<{ text: string }>('kernwright/figures', { uri, kernel: 'unit_rod' });
    expect(before.text).toContain('λ₈');
    c.settings = { numerics: { timeBudgetMs: 5000, eigenvalueCount: 3 } };
    const count = c.published.length;
    await c.connection.sendNotification('workspace/didChangeConfiguration', { settings: null });
    await c.until(() => c.published.length > count, 30_000, 'republication');
    await c.settled(uri);
    const after = await c.request<{ text: string }>('kernwright/figures', { uri, kernel: 'unit_rod' });
    expect(after.text).toContain('λ₃');
    expect(after.text).not.toContain('λ₄');

    c.settings = { numerics: { enabled: false } };
    await c.connection.sendNotification('workspace/didChangeConfiguration', { settings: null });
    await c.poll(async () => (await c.request<{ state: string }>('kernwright/analysisState', { uri }))?.state === 'off', 30_000, 'numerics off');
    const state = await c.request<{ state: string }>('kernwright/analysisState', { uri });
    expect(state.state).toBe('off');
    const lenses = await c.request<{ command: { title: string } }[]>('textDocument/codeLens', { textDocument: { uri } });
    expect(lenses[0].command.title).toContain('off');
    c.settings = { numerics: { timeBudgetMs: 5000 } };
    await c.connection.sendNotification('workspace/didChangeConfiguration', { settings: null });
    await c.settled(uri);
  });
});

describe('documents that are not kernel files', () => {
  it('ignores them', async () => {
    const uri = c.uriOf('notes.txt');
    await c.open(uri, 'kernel k(t, s) = 2t\n', 'plaintext');
    const probe = c.uriOf('probe.kw');
    await c.open(probe, 'domain [0, 1]\n');
    await c.until(() => c.publicationsAt(probe, 1).length > 0, 30_000, 'probe publication');
    expect(c.published.filter((p) => p.uri === uri)).toHaveLength(0);
    expect(await c.request('textDocument/hover', { textDocument: { uri }, position: { line: 0, character: 8 } })).toBeNull();
  });
});
