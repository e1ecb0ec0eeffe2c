/**
 * Settings: the extension declares every setting the server reads (each with a description), the server validates
 * what it gets, and severities and tolerances reach the analysis through the protocol.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analysisOptions, defaultSettings, readSettings, severitySettings } from '../../server/src/lsp/settings';
import { buildBundles } from './build';
import { TestClient, root } from './lspClient';

const manifest = JSON.parse(readFileSync(path.join(root, 'client', 'package.json'), 'utf8')) as {
  contributes: { configuration: { properties: Record<string, { markdownDescription?: string; description?: string; default?: unknown }> } };
};
const declared = manifest.contributes.configuration.properties;

describe('declared settings', () => {
  const read = [
    ...Object.keys(defaultSettings.numerics).map((k) => `kernwright.numerics.${k}`),
    'kernwright.codeLens.enabled',
    'kernwright.checks.hermitian.tolerance',
    'kernwright.checks.positivity.tolerance',
    ...Object.keys(severitySettings).map((k) => `kernwright.checks.${k}`),
  ];
  it('declares every setting the server reads, and only those (plus the client’s trace)', () => {
    expect(Object.keys(declared).sort()).toEqual([...read, 'kernwright.trace.server'].sort());
  });
  it('describes every setting and gives defaults equal to the server’s', () => {
    for (const [key, p] of Object.entries(declared)) expect((p.markdownDescription ?? p.description ?? '').length, key).toBeGreaterThan(20);
    expect(declared['kernwright.numerics.timeBudgetMs'].default).toBe(defaultSettings.numerics.timeBudgetMs);
    expect(declared['kernwright.numerics.eigenvalueCount'].default).toBe(defaultSettings.numerics.eigenvalueCount);
    expect(declared['kernwright.checks.hermitian.tolerance'].default).toBe(defaultSettings.checks.hermitianTolerance);
    expect(declared['kernwright.checks.positivity.tolerance'].default).toBe(defaultSettings.checks.positivityTolerance);
  });
  it('names real catalogue entries in the severity settings, and covers every property-check finding', async () => {
    const { catalogue } = await import('@kernwright/core');
    const entries = catalogue as Record<string, { code: string }>;
    for (const { name, code } of Object.values(severitySettings)) expect(entries[name]?.code).toBe(code);
    const covered = new Set(Object.values(severitySettings).map((s) => s.code));
    const checks = Object.values(entries).map((e) => e.code).filter((code) => /^KW5\d\d$/u.test(code));
    expect(checks.filter((code) => !covered.has(code))).toEqual([]);
  });
});

describe('reading settings', () => {
  it('falls back to defaults on wrong types and clamps out-of-range values', () => {
    expect(readSettings(undefined)).toEqual(defaultSettings);
    expect(readSettings('nonsense')).toEqual(defaultSettings);
    const s = readSettings({ numerics: { eigenvalueCount: 1e6, timeBudgetMs: 'fast', enabled: 'yes' }, checks: { hermitian: { severity: 'error' }, positivity: { severity: 'loud' } } });
    expect(s.numerics.eigenvalueCount).toBe(64);
    expect(s.numerics.timeBudgetMs).toBe(defaultSettings.numerics.timeBudgetMs);
    expect(s.numerics.enabled).toBe(true);
    expect(s.checks.severities).toEqual({ 'not-hermitian': 'error' });
    expect(analysisOptions(s)).toMatchObject({ eigenCount: 64, severities: { 'not-hermitian': 'error' } });
  });
});

describe('through the protocol', () => {
  let c: TestClient;
  beforeAll(async () => {
    buildBundles();
    c = await TestClient.start();
  });
  afterAll(async () => {
    await c?.stop();
  });

  it('applies a severity setting to the findings and silences a finding set to off', async () => {
    const uri = c.uriOf('severity.kw');
    await c.open(uri, 'domain [0, 1]\nkernel k(t, s) = exp(-t) * s\n');
    const before = await c.settled(uri);
    const kw501 = before.find((d) => d.code === 'KW501');
    expect(kw501?.severity).toBe(3);
    c.settings = { checks: { hermitian: { severity: 'error' } } };
    await c.connection.sendNotification('workspace/didChangeConfiguration', { settings: null });
    await c.poll(async () => (await c.settled(uri)).find((d) => d.code === 'KW501')?.severity === 1, 60_000, 'KW501 as an error');
    c.settings = { checks: { hermitian: { severity: 'off' } } };
    await c.connection.sendNotification('workspace/didChangeConfiguration', { settings: null });
    await c.poll(async () => !(await c.settled(uri)).some((d) => d.code === 'KW501'), 60_000, 'KW501 silenced');
  });

  it('reads pushed settings from clients that cannot be asked', async () => {
    const d = await TestClient.start({ capabilities: { workspace: { configuration: false } } });
    try {
      const uri = d.uriOf('pushed.kw');
      await d.open(uri, 'domain [0, 1]\nkernel k(t, s) = min(t, s)\n');
      await d.settled(uri);
      await d.connection.sendNotification('workspace/didChangeConfiguration', { settings: { kernwright: { numerics: { enabled: false } } } });
      await d.poll(async () => (await d.request<{ state: string }>('kernwright/analysisState', { uri }))?.state === 'off', 30_000, 'numerics off');
    } finally {
      await d.stop();
    }
  });
});
