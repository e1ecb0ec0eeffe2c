/**
 * Rendering the specifications to SVG with vega in Node: every figure of every example renders without a warning,
 * holds the marks its data calls for, and is safe to inline under a strict content security policy (no style
 * attributes, no scripts, no references outside itself). Also: the esbuild bundle (CommonJS, as scripts/build.mjs
 * makes them) renders, given the `vega-canvas` alias the bundles need.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';
import { describe, expect, it } from 'vitest';
import { analyzeText, fileKernelPictureData, kernelFigures } from '@kernwright/core';
import { renderSvg } from '../../server/src/pictures/renderSvg';
import { charWidthEm, textWidth } from '../../server/src/pictures/textWidth';

const repo = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
const exampleFiles = [
  ...readdirSync(path.join(repo, 'examples')).filter((f) => f.endsWith('.kw')).map((f) => `examples/${f}`),
  'examples/broken/not-symmetric.kw',
  'examples/broken/singular.kw',
  'examples/broken/not-positive.kw',
];

describe('rendering with vega in Node', () => {
  it.each(exampleFiles)('%s: every figure renders cleanly', async (file) => {
    const analysis = analyzeText(readFileSync(path.join(repo, file), 'utf8'), { eigenCount: 8, timeBudgetMs: 300 });
    for (const data of fileKernelPictureData(analysis, { points: 20 })) {
      for (const figure of kernelFigures(data)) {
        const warnings: string[] = [];
        const svg = await renderSvg(figure.spec, { onWarning: (w) => warnings.push(w) });
        const what = `${data.report.name} ${figure.kind}`;
        expect(warnings, what).toEqual([]);
        expect(svg.startsWith('<svg'), what).toBe(true);
        expect(svg, what).not.toMatch(/\sstyle="|<script|<foreignObject|https?:\/\/(?!www\.w3\.org\/)/);
        expect(svg.match(/\shref="([^"]*)"/g) ?? [], what).toEqual([]);
        expect(svg, what).toContain('role-legend');
        if (figure.kind === 'eigenvalues') {
          const points = svg.match(/aria-label="λ\d+ = [^"]*"/g) ?? [];
          expect(points.length, what).toBe(data.report.spectrum!.eigenvalues.filter((e) => e.re !== 0 || e.im !== 0).length);
        }
        if (figure.kind === 'kernel' || figure.kind === 'kernel-re') {
          const cells = /<g class="mark-rect role-mark kernel_cells_marks"[^>]*>(.*?)<\/g>/s.exec(svg)?.[1] ?? '';
          const finite = data.samples!.re.filter((v) => v !== null).length;
          expect((cells.match(/<path /g) ?? []).length, what).toBe(finite);
        }
      }
    }
  });

  it('refuses to load data from anywhere', async () => {
    const spec = { data: { url: 'file:///etc/hostname' }, mark: 'point', encoding: { x: { field: 'a', type: 'quantitative' } } };
    const warnings: string[] = [];
    const svg = await renderSvg(spec, { onWarning: (w) => warnings.push(w) });
    expect(svg).not.toContain('aria-label="a:');
    expect(warnings.join('\n')).toMatch(/load no external data/);
  });

  it('measures text by character, narrow letters narrower than wide ones', () => {
    expect(charWidthEm('i')).toBeLessThan(charWidthEm('e'));
    expect(charWidthEm('e')).toBeLessThan(charWidthEm('M'));
    expect(textWidth('iiii', 10)).toBeLessThan(textWidth('MMMM', 10));
    expect(textWidth('0.001', 11)).toBeCloseTo(11 * (0.64 * 4 + 0.3), 9);
  });
});

describe('the CommonJS bundle', () => {
  it('renders once vega-canvas is aliased to the stand-in (as scripts/build.mjs must do)', async () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), 'kw-render-bundle-'));
    try {
      const entry = path.join(dir, 'entry.ts');
      writeFileSync(entry, `import { renderSvg } from ${JSON.stringify(path.join(repo, 'server/src/pictures/renderSvg'))};
renderSvg({ data: { values: [{ x: 1, y: 2 }] }, mark: 'point', encoding: { x: { field: 'x', type: 'quantitative' }, y: { field: 'y', type: 'quantitative' } } })
  .then((svg) => process.stdout.write(svg), (e) => { process.stderr.write(String(e)); process.exit(1); });
`);
      const out = path.join(dir, 'bundle.cjs');
      await build({
        entryPoints: [entry], outfile: out, bundle: true, platform: 'node', target: 'node20', format: 'cjs', logLevel: 'silent',
        alias: { '@kernwright/core': path.join(repo, 'src-core/index.ts'), 'vega-canvas': path.join(repo, 'server/src/pictures/noCanvas.ts') },
      });
      const run = spawnSync(process.execPath, [out], { encoding: 'utf8', timeout: 60_000 });
      expect(run.stderr).toBe('');
      expect(run.status).toBe(0);
      expect(run.stdout).toMatch(/^<svg[^>]*>.*aria-roledescription="point"/s);
      // Without the alias the bundle cannot be made: vega-canvas's Node build awaits at the top level.
      await expect(build({
        entryPoints: [entry], outfile: path.join(dir, 'plain.cjs'), bundle: true, platform: 'node', format: 'cjs', logLevel: 'silent',
        alias: { '@kernwright/core': path.join(repo, 'src-core/index.ts') },
      })).rejects.toThrow(/Top-level await/);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
