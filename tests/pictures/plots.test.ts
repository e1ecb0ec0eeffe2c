/**
 * The plot specifications as data (no browser, no renderer): units read from notes, the sampled square and its
 * non-smooth lines, which figures each kind of kernel gets, that the drawn data is the engine's data, colour ranges,
 * logarithmic ticks, the trace shares, the defect, and the HTML page's pure pieces.
 */
import { describe, expect, it } from 'vitest';
import {
  analyzeText, axisNames, colourRange, defectValues, fileKernelPictureData, inlineSvg, kernelFigures,
  kernelPictureData, kernelSamples, lociToDraw, reportPageHtml, shareRows, unitOfNote, type KernelPictureData, type PlotFigure,
  type VegaLiteSpec,
} from '@kernwright/core';
import { logTicks } from '../../src-core/report/plots/specCommon';
import { compileKernel } from '../../src-core/semantics/evaluator';

const header = '# Invented test scenario; the values mean nothing beyond this test.\n';

function pictures(body: string, options: { eigenCount?: number } = {}): KernelPictureData[] {
  const analysis = analyzeText(header + body, { eigenCount: options.eigenCount ?? 8, timeBudgetMs: 400 });
  return fileKernelPictureData(analysis, { points: 16 });
}

function one(body: string): KernelPictureData {
  const all = pictures(body);
  expect(all).toHaveLength(1);
  return all[0];
}

/** Every layer of a figure's spec with the given mark name. */
function layerNamed(figure: PlotFigure, name: string): VegaLiteSpec & { data: { values: Record<string, unknown>[] }; encoding: Record<string, Record<string, unknown>> } {
  const layers = figure.spec.layer as VegaLiteSpec[];
  const found = layers.find((l) => l.name === name);
  if (!found) throw new Error(`no layer ${name} in ${figure.kind}`);
  return found as never;
}

describe('units from notes', () => {
  it.each([
    ['mm across the slit', 'mm'],
    [' km, correlation length', 'km'],
    ['m', 'm'],
    ['rad/mm', 'rad/mm'],
    ['(µm)', 'µm'],
    ['the length of the rod', null],
    ['along the road', null],
    ['3 samples', null],
    ['', null],
    ['<b>', null],
  ])('%j → %j', (note, unit) => {
    expect(unitOfNote(note)).toBe(unit);
  });

  it('reads the domain line’s comment, or the note of a constant that bounds the domain', () => {
    const all = pictures(`domain [0, 3]   # mm across the slit
const reach = 2   # km
kernel a(t, s) = t * s
kernel b(t, s) on [0, reach] = t + s
kernel c(t, s) on [0, 1] = 1
`);
    expect(all.map((d) => d.axes)).toEqual([axisNames('mm'), axisNames('km'), axisNames(null)]);
    expect(axisNames('mm')).toEqual({ t: 't (mm)', s: 's (mm)', unit: 'mm' });
    expect(axisNames(null)).toEqual({ t: 't', s: 's', unit: null });
  });
});

describe('the sampled square', () => {
  it('holds K at the cell centres, row t and column s, as the compiled evaluator gives it', () => {
    const analysis = analyzeText(`${header}kernel k(t, s) on [-1, 2] = exp(-abs(t - s)) * cos(3 * t) + s\n`, { numerics: false });
    const symbol = analysis.model.kernels[0];
    const samples = kernelSamples(symbol, 7)!;
    const f = compileKernel(symbol.ir!);
    expect(samples.points).toBe(7);
    expect(samples.grid[0]).toBeCloseTo(-1 + 3 / 14, 14);
    expect(samples.grid[6]).toBeCloseTo(2 - 3 / 14, 14);
    for (let i = 0; i < 7; i++) {
      for (let j = 0; j < 7; j++) expect(samples.re[i * 7 + j]).toBe(f.evaluate([samples.grid[i], samples.grid[j]]).re);
    }
    expect(samples.im).toBeNull();
    expect(samples.loci).toEqual([{ kind: 'kink', label: 'the diagonal t = s', from: [-1, -1], to: [2, 2] }]);
  });

  it('keeps imaginary parts for a complex kernel and null where K is not finite', () => {
    const analysis = analyzeText(`${header}kernel z(t, s) on [0, 1] = exp(i * (t - s)) / abs(t - s)\n`, { numerics: false });
    const samples = kernelSamples(analysis.model.kernels[0], 5)!;
    expect(samples.im).not.toBeNull();
    for (let i = 0; i < 5; i++) {
      expect(samples.re[i * 5 + i]).toBeNull();
      expect(samples.re[i * 5 + ((i + 1) % 5)]).not.toBeNull();
    }
    expect(samples.im![1]).toBeCloseTo(Math.sin(0.1 - 0.3) / 0.2, 12);
    expect(samples.loci.map((l) => l.kind)).toEqual(['singular']);
  });

  it('has nothing to sample when the definition has errors', () => {
    const analysis = analyzeText(`${header}kernel broken(t, s) on [0, 1] = t * nowhere\n`, { numerics: false });
    expect(kernelSamples(analysis.model.kernels[0])).toBeNull();
  });
});

describe('which figures each kernel gets', () => {
  it.each([
    ['a Hermitian positive kernel', 'kernel g(t, s) on [0, 1] = min(t, s) - t * s', ['kernel', 'eigenvalues', 'trace-share', 'eigenfunctions']],
    ['a complex Hermitian kernel', 'kernel c(t, s) on [0, 2] = exp(i * 2 * (t - s)) * exp(-abs(t - s))', ['kernel-re', 'kernel-im', 'eigenvalues', 'trace-share', 'eigenfunctions']],
    ['a symmetric kernel that is not positive', 'kernel h(t, s) on [-1, 1] = t * s + cos(t - s) - 1.5', ['kernel', 'eigenvalues', 'eigenfunctions']],
    ['a kernel that is not Hermitian', 'kernel v(t, s) on [0, 1] = exp(-t) * s', ['kernel', 'defect', 'eigenvalues', 'eigenfunctions']],
    ['an unbounded kernel (no spectrum)', 'kernel w(t, s) on [0, 1] = 1 / abs(t - s)', ['kernel']],
    ['a kernel with errors', 'kernel e(t, s) on [0, 1] = t * nowhere', []],
  ])('%s', (_what, source, kinds) => {
    expect(kernelFigures(one(`${source}\n`)).map((f) => f.kind)).toEqual(kinds);
  });

  it('draws at most four eigenfunctions, fewer when asked', () => {
    const data = one('kernel g(t, s) on [0, 1] = min(t, s) - t * s\n');
    const curves = (n?: number) => {
      const f = kernelFigures(data, { eigenfunctions: n }).find((x) => x.kind === 'eigenfunctions')!;
      return new Set(layerNamed(f, 'eigenfunction_lines').data.values.map((r) => r.mode)).size;
    };
    expect([curves(), curves(2), curves(1), curves(9)]).toEqual([4, 2, 1, 4]);
  });
});

describe('the drawn data is the engine’s data', () => {
  it('Hermitian: |λ| by index, the sign by shape and colour, every eigenvalue with its error', () => {
    const data = one('kernel h(t, s) on [-1, 1] = t * s + cos(t - s) - 1.5\n');
    const fig = kernelFigures(data).find((f) => f.kind === 'eigenvalues')!;
    const rows = layerNamed(fig, 'eigenvalue_points').data.values;
    const engine = data.report.spectrum!.eigenvalues.filter((e) => e.re !== 0);
    expect(rows.map((r) => r.k)).toEqual(engine.map((_, i) => i + 1));
    expect(rows.map((r) => r.abs)).toEqual(engine.map((e) => Math.abs(e.re)));
    expect(rows.map((r) => r.sign)).toEqual(engine.map((e) => (e.re > 0 ? 'λ > 0' : 'λ < 0')));
    expect(rows.some((r) => r.sign === 'λ < 0')).toBe(true);
    expect(rows.map((r) => r.label)).toEqual(engine.map((e, i) => `λ${i + 1} = ${e.re} ± ${e.error}`));
    expect(fig.tables[0].rows).toHaveLength(engine.length + 1);
    expect(fig.tables[0].rows.every((r) => r[1].includes('±'))).toBe(true);
  });

  it('not Hermitian: the complex plane, equal scales, and the disc of radius ‖T‖', () => {
    const data = one('kernel v(t, s) on [0, 1] = exp(-t) * s + sin(3 * t) * cos(s)\n');
    const fig = kernelFigures(data).find((f) => f.kind === 'eigenvalues')!;
    const points = layerNamed(fig, 'eigenvalue_points');
    expect(points.encoding.x.field).toBe('re');
    expect(points.encoding.y.field).toBe('im');
    expect(points.encoding.x.scale).toEqual(points.encoding.y.scale);
    expect(points.data.values.map((r) => [r.re, r.im])).toEqual(data.report.spectrum!.eigenvalues.map((e) => [e.re, e.im]));
    const disc = layerNamed(fig, 'norm_bound');
    const extent = (points.encoding.x.scale as { domain: number[] }).domain[1];
    const radiusPx = Math.sqrt((disc.mark as { size: number }).size / Math.PI);
    expect(radiusPx).toBeCloseTo((data.report.spectrum!.norm!.value / extent) * 120, 9);
  });

  it('the defect figure marks the point where the check found the largest defect', () => {
    const data = one('kernel v(t, s) on [0, 1] = exp(-t) * s\n');
    const fig = kernelFigures(data).find((f) => f.kind === 'defect')!;
    const worst = layerNamed(fig, 'worst_point').data.values[0];
    expect([worst.t, worst.s]).toEqual([data.report.hermitian!.worst!.t, data.report.hermitian!.worst!.s]);
  });

  it('the non-smooth lines drawn are those the checks name', () => {
    // A smooth bump plus a box: the box jumps on t − s = ±3; the diagonal (where abs(t − s) has its kink before it
    // is squared) is a candidate the checks clear.
    const data = one('kernel box(t, s) on [0, 10] = exp(-abs(t - s)^2) + (abs(t - s) < 3 ? 1 : 0)\n');
    const { drawn } = lociToDraw(data.report, data.samples!.loci);
    expect(data.samples!.loci.map((l) => l.label)).toContain('the diagonal t = s');
    expect(drawn.map((l) => l.label).sort()).toEqual(['the line t − s = -3', 'the line t − s = 3']);
    // A jump on a curve that is not a straight line is named but cannot be drawn: the caption says so.
    const curved = one('kernel hyperbola(t, s) on [0, 10] = t * s < 20 ? 1 : 0\n');
    expect(lociToDraw(curved.report, curved.samples!.loci).notDrawn.length).toBeGreaterThan(0);
    expect(kernelFigures(curved).find((f) => f.kind === 'kernel')!.caption).toContain('Not drawn');
    const exp = one('kernel ou(t, s) on [0, 2] = exp(-abs(t - s))\n');
    expect(lociToDraw(exp.report, exp.samples!.loci).drawn.map((l) => l.label)).toEqual(['the diagonal t = s']);
  });

  it('survives the trip through JSON to the editor (non-finite numbers arrive as null)', () => {
    const source = [
      'kernel a(t, s) on [0, 1] = exp(-abs(t - s))',
      'kernel w(t, s) on [0, 1] = 1 / abs(t - s)',
      'kernel r(t, s) on [0, 1] = log(abs(t - s))',
      'kernel v(t, s) on [0, 1] = exp(i * t) * s',
    ].join('\n');
    for (const data of pictures(`${source}\n`)) {
      const sent: KernelPictureData = JSON.parse(JSON.stringify(data));
      const here = kernelFigures(data);
      const there = kernelFigures(sent);
      expect(there.map((f) => f.kind)).toEqual(here.map((f) => f.kind));
      for (const f of there) {
        const text = JSON.stringify(f.tables) + f.caption;
        expect(text, `${data.report.name} ${f.kind}`).not.toMatch(/-∞|null|undefined|NaN/);
      }
      const points = (figs: PlotFigure[]) => {
        const f = figs.find((x) => x.kind === 'eigenvalues');
        return f ? layerNamed(f, 'eigenvalue_points').data.values : [];
      };
      expect(points(there)).toEqual(points(here));
    }
  });

  it('every spec is plain JSON with inline data only', () => {
    for (const data of pictures('kernel a(t, s) on [0, 1] = exp(-abs(t - s))\nkernel b(t, s) on [0, 1] = exp(i * (t - s)) * s\n')) {
      for (const f of kernelFigures(data)) {
        const text = JSON.stringify(f.spec);
        expect(JSON.parse(text)).toEqual(JSON.parse(JSON.stringify(JSON.parse(text))));
        expect(text).not.toMatch(/"url"|https?:/);
      }
    }
  });
});

describe('numbers behind the pictures', () => {
  it.each([
    ['one sign', [1, 2, 3], false, { kind: 'sequential', lo: 1, hi: 3, clipped: false }],
    ['negative only', [-3, -1], false, { kind: 'sequential', lo: -3, hi: -1, clipped: false }],
    ['both signs', [-1, 4, 2], false, { kind: 'diverging', lo: -4, hi: 4, clipped: false }],
    ['a constant', [2, 2, 2], false, { kind: 'sequential', lo: 0, hi: 2, clipped: false }],
    ['zero', [0, 0], false, { kind: 'diverging', lo: -1, hi: 1, clipped: false }],
    ['a missing value', [1, null, 3], false, { kind: 'sequential', lo: 1, hi: 3, clipped: true }],
  ] as const)('colour range: %s', (_what, values, clip, expected) => {
    expect(colourRange(values, clip)).toEqual(expected);
  });

  it('colour range: clipping ignores the few largest cells', () => {
    const values = [...Array.from({ length: 99 }, (_, k) => k / 100), 1e6];
    const r = colourRange(values, true)!;
    expect(r.hi).toBeLessThan(1);
    expect(r.clipped).toBe(true);
  });

  it.each([
    [0.001, 1, [0.001, 0.002, 0.005, 0.01, 0.02, 0.05, 0.1, 0.2, 0.5, 1]],
    [1e-6, 1, [1e-6, 1e-5, 1e-4, 1e-3, 1e-2, 0.1, 1]],
    [1e-20, 1, [1e-18, 1e-15, 1e-12, 1e-9, 1e-6, 1e-3, 1]],
    [1e-12, 0.5, [1e-12, 1e-10, 1e-8, 1e-6, 1e-4, 1e-2]],
    [0, 1, []],
  ])('logarithmic ticks over [%d, %d]', (lo, hi, ticks) => {
    expect(logTicks(lo, hi)).toEqual(ticks);
  });

  it('trace shares: the partial sums over the trace, rising, with errors', () => {
    const data = one('kernel g(t, s) on [0, 1] = min(t, s) - t * s\n');
    const rows = shareRows(data.report);
    const s = data.report.spectrum!;
    let sum = 0;
    rows.forEach((r, k) => {
      sum += s.eigenvalues[k].re;
      expect(r.captured).toBeCloseTo(sum / s.trace!.value, 14);
      expect(r.remaining).toBeCloseTo(1 - r.captured, 14);
      expect(r.error).toBeGreaterThan(0);
      if (k > 0) expect(r.captured).toBeGreaterThan(rows[k - 1].captured);
    });
    // min(t, s) − ts has eigenvalues 1/(n²π²) and trace 1/6 (a classical identity: Σ 1/n² = π²/6).
    expect(rows[0].captured).toBeCloseTo(6 / Math.PI ** 2, 9);
  });

  it('the defect of a real kernel is antisymmetric, and zero for a symmetric one', () => {
    const v = one('kernel v(t, s) on [0, 1] = exp(-t) * s\n').samples!;
    const d = defectValues(v);
    const n = v.points;
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) expect((d[i * n + j] as number) + (d[j * n + i] as number)).toBe(0);
    const sym = one('kernel g(t, s) on [0, 1] = exp(-(t - s)^2)\n').samples!;
    expect(defectValues(sym).every((x) => x === 0)).toBe(true);
  });
});

describe('the page’s pure pieces', () => {
  it('scopes the ids of an inlined SVG', () => {
    const svg = '<svg x="1"><defs><linearGradient id="gradient_0"/><clipPath id="clip1"/></defs><rect fill="url(#gradient_0)" clip-path="url(#clip1)"/><use href="#clip1" xlink:href="#clip1"/></svg>';
    const out = inlineSvg(svg, 'fig-3', 'A <title>');
    expect(out).toBe('<svg role="img" aria-label="A &lt;title&gt;" x="1"><defs><linearGradient id="fig-3-gradient_0"/><clipPath id="fig-3-clip1"/></defs>'
      + '<rect fill="url(#fig-3-gradient_0)" clip-path="url(#fig-3-clip1)"/><use href="#fig-3-clip1" xlink:href="#fig-3-clip1"/></svg>');
  });

  it('escapes what the user wrote, loads nothing and runs no script', () => {
    const html = reportPageHtml({
      source: 'a<b>.kw',
      generator: 'kernwright test',
      summary: '1 kernel',
      kernels: [{
        name: 'k<script>', domain: [0, 1], unit: null, complex: false,
        properties: [{ name: 'Hermitian', holds: false, figure: '‖K − K*‖ = 1 & more' }],
        notes: ['line 3: error <oops>'],
        figures: [{ kind: 'kernel', title: 'K', caption: 'c & d', svg: '<svg></svg>', tables: [{ caption: 't', columns: ['a'], rows: [['<x>']] }] }],
      }],
    });
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toMatch(/https?:\/\//);
    expect(html).toContain('k&lt;script&gt;');
    expect(html).toContain('error &lt;oops&gt;');
    expect(html).toContain('&amp; more');
    expect(html).toContain("default-src 'none'");
    expect(html).toContain('prefers-color-scheme: dark');
    expect(html).toContain('✗');
  });

  it('folds long tables away, keeps short ones open', () => {
    const data = one('kernel g(t, s) on [0, 1] = min(t, s) - t * s\n');
    expect(kernelPictureData(analyzeText('', { numerics: false }), 'g')).toBeNull();
    const fig = kernelFigures(data).find((f) => f.kind === 'eigenvalues')!;
    const page = reportPageHtml({ source: 'x.kw', generator: 'g', summary: 's', kernels: [{
      name: 'g', domain: [0, 1], unit: null, complex: false, properties: [], notes: [],
      figures: [{ kind: fig.kind, title: fig.title, caption: fig.caption, svg: '<svg></svg>', tables: fig.tables }],
    }] });
    expect(page).toContain('<details class="kw-details">');
  });
});
