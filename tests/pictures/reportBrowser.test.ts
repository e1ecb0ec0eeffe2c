/**
 * The HTML report of the example files (`kernwright report`) in headless Chromium: every kernel has its section and
 * the figures its properties call for; the eigenvalue points drawn are the engine's eigenvalues, number for number
 * (compared with the JSON report made from the same analysis); heat maps have one cell per sample and the non-smooth
 * lines the checks name; the page makes no request besides itself, logs no error, does not overflow at 1280 or 420
 * pixels, and follows the light and dark colour schemes. Screenshots go to test-artifacts/pictures/.
 *
 * Skipped, with a message, when /usr/bin/chromium or playwright-core is missing (.ci/run installs Debian's
 * chromium and fonts-dejavu-core).
 */
import { mkdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analysedFile, analyzeText, drawsEigenvaluesByIndex, fileKernelPictureData, jsonReport, lociToDraw, sectionId, type FileAnalysis, type JsonReport } from '@kernwright/core';
import { parseReportArgs, reportAnalysisOptions, reportFromAnalysis, type ReportOptions } from '../../server/src/cli/reportCommand';
import { chromiumMissing, evalIn, launchChromium, openGuarded, servePages, type Browser, type PageServer } from './browser';
import { countMarks, drawnEigenvalues } from './pictureMarks';

const repo = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
const artifacts = path.join(repo, 'test-artifacts', 'pictures');
const examples = ['heated-rod', 'coherent-beam', 'pollen-dispersal', 'neural-field', 'soil-moisture'];

const missing = chromiumMissing();
if (missing) console.warn(`tests/pictures/reportBrowser.test.ts skipped: missing ${missing}`);

interface Made {
  readonly name: string;
  readonly options: ReportOptions;
  readonly analysis: FileAnalysis;
  readonly json: JsonReport;
  readonly html: string;
}

function optionsFor(file: string): ReportOptions {
  const parsed = parseReportArgs([file, '--time-budget', '400']);
  if (parsed.kind !== 'options') throw new Error(`bad test arguments for ${file}`);
  return parsed.options;
}

describe.skipIf(missing !== null)('the HTML report in Chromium', () => {
  const made = new Map<string, Made>();
  let browser: Browser;
  let server: PageServer;

  beforeAll(async () => {
    mkdirSync(artifacts, { recursive: true });
    for (const name of examples) {
      const file = `examples/${name}.kw`;
      const options = optionsFor(file);
      const analysis = analyzeText(readFileSync(path.join(repo, file), 'utf8'), reportAnalysisOptions(options));
      const json = jsonReport([analysedFile(file, analysis)], { name: 'kernwright', version: 'test' });
      const result = await reportFromAnalysis(options, analysis);
      if (!result.ok) throw new Error(result.message);
      made.set(name, { name, options, analysis, json, html: result.html });
    }
    server = await servePages(new Map([...made.values()].map((m) => [`${m.name}.html`, m.html])));
    browser = await launchChromium();
  });

  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it.each(examples)('%s: the drawn eigenvalues are the engine’s, and every figure is there', async (name) => {
    const m = made.get(name)!;
    const url = server.url(`${name}.html`);
    const { page, requests, errors } = await openGuarded(browser, url, { width: 1280, height: 800 }, 'light');
    try {
      const kernels = m.json.files[0].kernels;
      expect(await page.$$eval('section.kw-kernel', (s) => s.length)).toBe(kernels.length);
      const pictures = fileKernelPictureData(m.analysis, { points: m.options.gridPoints });
      for (const [i, k] of kernels.entries()) {
        const data = pictures[i];
        expect(data.report.name).toBe(k.name);
        const section = `#${sectionId(k.name, i)}`;
        const kinds = await page.$$eval(`${section} figure.kw-figure`, (fs) => fs.map((f) => f.getAttribute('data-kind')));
        // The eigenvalue points: one per eigenvalue of the JSON report, in order, with the very same values.
        const drawn = await drawnEigenvalues(page, section);
        expect(drawn).toHaveLength(k.eigenvalues.length);
        drawn.forEach((d, j) => {
          expect(d, `label of λ${j + 1} of ${k.name}`).not.toBeNull();
          expect(d!.k).toBe(j + 1);
          expect(d!.re).toBe(k.eigenvalues[j].re);
          if (!drawsEigenvaluesByIndex(data)) expect(d!.im).toBe(k.eigenvalues[j].im);
          expect(d!.error).toBe(k.eigenvalues[j].error);
        });
        // Heat maps: one rectangle per sampled cell (these kernels are finite everywhere).
        const n = m.options.gridPoints;
        const maps = k.complex ? 2 : 1;
        expect(await countMarks(page, section, 'kernel_cells')).toBe(maps * n * n);
        expect(kinds.slice(0, maps)).toEqual(k.complex ? ['kernel-re', 'kernel-im'] : ['kernel']);
        // The non-smooth lines the checks name, on every heat map.
        const loci = lociToDraw(data.report, data.samples!.loci).drawn.length;
        for (const kind of [...kinds.slice(0, maps), ...kinds.filter((x) => x === 'defect')]) {
          expect(await countMarks(page, `${section} figure[data-kind="${kind}"]`, 'loci_lines'), `${k.name} ${kind} lines`).toBe(loci);
        }
        // The defect only for a kernel that is not Hermitian; the trace share only for a positive one.
        expect(kinds.includes('defect')).toBe(k.hermitian?.holds === false);
        expect(kinds.includes('trace-share')).toBe(k.positive?.holds === true);
        if (k.positive?.holds === true) expect(await countMarks(page, section, 'share_points')).toBeGreaterThan(0);
        // The leading four eigenfunctions (two curves each when they are complex).
        const complexModes = data.report.spectrum?.eigenfunctions?.im !== null;
        const curves = await countMarks(page, section, 'eigenfunction_lines');
        expect(curves === 4 || (complexModes && curves === 8)).toBe(true);
        // Each figure has a legend and a table of its numbers with errors.
        for (const kind of kinds) {
          const figure = `${section} figure[data-kind="${kind}"]`;
          expect(await page.$$eval(`${figure} .role-legend`, (l) => l.length), `${k.name} ${kind} legend`).toBeGreaterThan(0);
        }
        expect(await page.$$eval(`${section} table.kw-table td`, (cells) => cells.some((c) => c.textContent!.includes('±')))).toBe(true);
      }
      // Nothing overflows sideways.
      expect(await evalIn<number>(page, 'document.documentElement.scrollWidth')).toBeLessThanOrEqual(1280);
      await page.screenshot({ path: path.join(artifacts, `report-${name}-1280x800-light.png`) });
      expect(requests).toEqual([]);
      expect(errors).toEqual([]);
    } finally {
      await page.close();
    }
  });

  it.each(examples)('%s: readable on a narrow window in dark mode', async (name) => {
    const url = server.url(`${name}.html`);
    const { page, requests, errors } = await openGuarded(browser, url, { width: 420, height: 900 }, 'dark');
    try {
      expect(await evalIn<number>(page, 'document.documentElement.scrollWidth')).toBeLessThanOrEqual(420);
      // Every plot fits its card.
      const overflowing = await evalIn<number>(page, `[...document.querySelectorAll('.kw-plot svg')].filter((s) => s.getBoundingClientRect().right > window.innerWidth).length`);
      expect(overflowing).toBe(0);
      // Dark page, light text, and axis labels restyled to the page's colours rather than the SVG's own grey.
      const colours = await evalIn<{ bg: string; fg: string; axis: string | null }>(page, `(() => {
        const body = getComputedStyle(document.body);
        const label = document.querySelector('.kw-plot svg .role-axis-label text');
        return { bg: body.backgroundColor, fg: body.color, axis: label ? getComputedStyle(label).fill : null };
      })()`);
      const luminance = (rgb: string) => {
        const [r, g, b] = rgb.match(/\d+/g)!.map(Number);
        return 0.2126 * r + 0.7152 * g + 0.0722 * b;
      };
      expect(luminance(colours.bg)).toBeLessThan(60);
      expect(luminance(colours.fg)).toBeGreaterThan(180);
      expect(colours.axis).not.toBeNull();
      expect(luminance(colours.axis!)).toBeGreaterThan(140);
      await page.screenshot({ path: path.join(artifacts, `report-${name}-420x900-dark.png`) });
      if (name === 'pollen-dispersal') await page.screenshot({ path: path.join(artifacts, `report-${name}-420-dark-full.png`), fullPage: true });
      expect(requests).toEqual([]);
      expect(errors).toEqual([]);
    } finally {
      await page.close();
    }
  });

  it('the light page at 1280 × 800 in full, and the dark one', async () => {
    for (const scheme of ['light', 'dark'] as const) {
      const { page, errors } = await openGuarded(browser, server.url('pollen-dispersal.html'), { width: 1280, height: 800 }, scheme);
      await page.screenshot({ path: path.join(artifacts, `report-pollen-dispersal-1280-${scheme}-full.png`), fullPage: true });
      if (scheme === 'dark') await page.screenshot({ path: path.join(artifacts, 'report-pollen-dispersal-1280x800-dark.png') });
      expect(errors).toEqual([]);
      await page.close();
    }
  });

  it('the guard is not blind: a page that asks for a remote image is caught', async () => {
    // The report's own head and style, a body that asks for one remote image, and no content security policy.
    const head = made.get('heated-rod')!.html.split('<body>')[0].replace(/<meta http-equiv="Content-Security-Policy"[^>]*>/, '');
    const bad = `${head}<body><main class="kw-page"><img alt="" src="http://192.0.2.1/x.png"></main></body></html>`;
    const local = await servePages(new Map([['bad.html', bad]]));
    try {
      const { page, requests } = await openGuarded(browser, local.url('bad.html'), { width: 800, height: 600 }, 'light');
      expect(requests).toEqual(['http://192.0.2.1/x.png']);
      await page.close();
    } finally {
      await local.close();
    }
  });
});
