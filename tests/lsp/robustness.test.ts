/**
 * The server never crashes: malformed and unknown requests, raw garbage on the wire, huge files, and a worker that
 * dies in the middle of an analysis (restarted, reported once, the analysis redone).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildBundles } from './build';
import { TestClient } from './lspClient';

let c: TestClient;
beforeAll(async () => {
  buildBundles();
  c = await TestClient.start({ env: { KERNWRIGHT_LSP_TEST_HOOKS: '1' } });
});
afterAll(async () => {
  await c?.stop();
});

async function stillAlive(): Promise<void> {
  const uri = c.uriOf(`alive-${Math.random().toString(36).slice(2)}.kw`);
  const text = 'domain [0, 1]\nconst a = 2\nkernel k(t, s) = a * min(t, s)\n';
  await c.open(uri, text);
  const hover = await c.request<{ contents: { value: string } } | null>('textDocument/hover', { textDocument: { uri }, position: { line: 1, character: 6 } });
  expect(hover?.contents.value).toContain('const a = 2');
  await c.close(uri);
}

describe('malformed input', () => {
  it('answers malformed requests without crashing', async () => {
    const uri = c.uriOf('target.kw');
    await c.open(uri, 'domain [0, 1]\nkernel k(t, s) = exp(t * s)\n');
    const calls: [string, unknown][] = [
      ['textDocument/hover', {}],
      ['textDocument/hover', null],
      ['textDocument/hover', { textDocument: { uri }, position: { line: -5, character: -1 } }],
      ['textDocument/hover', { textDocument: { uri }, position: { line: 1e9, character: 1e9 } }],
      ['textDocument/hover', { textDocument: { uri }, position: 'nowhere' }],
      ['textDocument/hover', { textDocument: { uri: 42 }, position: { line: 0, character: 0 } }],
      ['textDocument/completion', { textDocument: { uri: 'file:///not/open.kw' }, position: { line: 0, character: 0 } }],
      ['textDocument/codeAction', { textDocument: { uri } }],
      ['textDocument/codeLens', { textDocument: {} }],
      ['textDocument/rename', { textDocument: { uri }, position: { line: 1, character: 8 } }],
      ['textDocument/formatting', { textDocument: { uri } }],
      ['textDocument/signatureHelp', { textDocument: { uri }, position: { line: 1, character: 1e6 } }],
      ['textDocument/references', { textDocument: { uri }, position: { line: 1, character: 8 } }],
      ['kernwright/figures', { uri: ['not', 'a', 'string'] }],
      ['kernwright/analysisState', 17],
      ['workspace/executeCommand', { command: 'kernwright.showFigures', arguments: [null, {}] }],
    ];
    for (const [method, params] of calls) {
      await c.connection.sendRequest(method, params).catch((e: Error) => e);
    }
    await c.connection.sendNotification('textDocument/didChange', { textDocument: { uri: 'file:///never-opened.kw', version: 3 }, contentChanges: [{ text: 'x' }] });
    await c.connection.sendNotification('textDocument/didOpen', { textDocument: { uri: 'file:///odd.kw' } });
    await c.connection.sendNotification('kernwright/unknownNotification', { x: 1 });
    await stillAlive();
    expect(c.exited).toBe(false);
  });

  it('answers unknown methods with “method not found”', async () => {
    await expect(c.request('kernwright/noSuchThing', {})).rejects.toMatchObject({ code: -32601 });
    await stillAlive();
  });

  it('survives raw garbage on the wire', async () => {
    c.process.stdin.write('Content-Length: 9\r\n\r\n{garbage}');
    c.process.stdin.write('Content-Length: 2\r\n\r\n[]');
    await new Promise((r) => setTimeout(r, 300));
    await stillAlive();
  });
});

describe('large files', () => {
  it('checks syntax and names of a huge file, skips its numerics, and says so once', async () => {
    const line = 'kernel k$(t, s) = exp(-abs(t - s) / 0.5) * cos(t + s) + min(t, s)\n';
    const parts = ['domain [0, 1]\n'];
    for (let k = 0, length = 0; length < 1_100_000; k++) {
      parts.push(line.replace('$', String(k)));
      length += line.length;
    }
    parts.push('kernel bad(t, s) = lenght\n');
    const text = parts.join('');
    const uri = c.uriOf('huge.kw');
    const before = c.messages.length;
    await c.open(uri, text);
    const diagnostics = await c.settled(uri, 120_000);
    expect(diagnostics.map((d) => String(d.code))).toContain('KW201');
    expect(c.messages.slice(before).some((m) => m.message.includes('only syntax and names'))).toBe(true);
    await c.replace(uri, text + '# more\n');
    await c.settled(uri, 120_000);
    expect(c.messages.slice(before).filter((m) => m.message.includes('only syntax and names'))).toHaveLength(1);
    await c.close(uri);
    await stillAlive();
  }, 180_000);
});

describe('worker death', () => {
  it('restarts the worker, says so once, and finishes the analysis', async () => {
    const uri = c.uriOf('crash.kw');
    const text = 'domain [0, 1]\nkernel a(t, s) = sqrt(t - s)\nkernel b(t, s) = abs(t - s)^(-0.3) * exp(t)\n';
    await c.open(uri, text);
    await c.request('kernwright/test/crashWorker', {});
    const diagnostics = await c.settled(uri, 120_000);
    expect(diagnostics.map((d) => String(d.code))).toContain('KW302');
    const notices = () => c.messages.filter((m) => m.message.includes('analysis worker stopped'));
    expect(notices()).toHaveLength(1);
    // A second death is logged but not shown again.
    await c.request('kernwright/test/crashWorker', {});
    await c.replace(uri, text + '# again\n');
    await c.settled(uri, 120_000);
    await c.poll(async () => c.logs.filter((l) => l.includes('analysis worker stopped')).length >= 2, 30_000, 'second restart logged');
    expect(notices()).toHaveLength(1);
    await stillAlive();
  }, 300_000);
});
