/**
 * What binding produces besides diagnostics: constant values, kernels that call kernels, which declarations are
 * analysed further, and when a name counts as used. The fixtures show the diagnostics; these cases show the model.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeText } from '../../src-core/analysis/analyze';
import { interpret } from '../../src-core/semantics/evaluator';
import type { FileModel, KernelSymbol } from '../../src-core/semantics/model';

const fixture = (name: string) => readFileSync(join(__dirname, 'fixtures', name), 'utf8');
const bind = (text: string): FileModel => analyzeText(text, { numerics: false }).model;
const kernel = (model: FileModel, name: string): KernelSymbol => {
  const k = model.kernels.find((x) => x.name === name);
  if (!k) throw new Error(`no kernel ${name}`);
  return k;
};
/** K(t, s) through the kernel's IR (real part; the cases here are real). */
const valueAt = (k: KernelSymbol, t: number, s: number): number => {
  const r = interpret(k.ir!, [t, s]);
  expect(r.ok).toBe(true);
  return r.re;
};
const points: [number, number][] = [[0, 0], [0.25, 0.75], [0.75, 0.25], [0.5, 0.5], [1, 0.125]];

describe('constants', () => {
  const model = bind(fixture('constants.kw'));
  const value = (name: string) => {
    const sym = model.symbols.get(name);
    return sym?.kind === 'const' ? sym.value : undefined;
  };

  it('are evaluated in dependency order, through helpers and kernels declared later', () => {
    expect(value('early')).toEqual({ re: 2.5, im: 0 });
    expect(value('late')).toEqual({ re: 1.25, im: 0 });
    expect(value('viaHelper')).toEqual({ re: 1.5, im: 0 }); // scaled(3) = 3 * factor
    expect(value('viaKernel')).toEqual({ re: 2.5 * 0.5 + 1.5 * 0.25, im: 0 }); // probe(0.5, 0.25)
  });

  it('that are not finite have no value, nor does anything built on them', () => {
    for (const name of ['overflow', 'division', 'undefined', 'complexInf', 'dependsOnBroken', 'dependsTwice']) {
      expect(value(name), name).toBeNull();
    }
    expect(kernel(model, 'usesBroken').ir).toBeNull();
    expect(kernel(model, 'brokenViaHelper').ir).toBeNull();
    expect(kernel(model, 'brokenDomain').domain).toBeNull();
    expect(kernel(model, 'brokenClaim').expectations).toEqual([]);
  });

  it('fold into the kernels that use them', () => {
    const k = kernel(model, 'scaledProbe');
    for (const [t, s] of points) expect(valueAt(k, t, s)).toBeCloseTo(1.625 * (2.5 * t + 1.5 * s), 14);
  });
});

describe('kernels calling kernels', () => {
  const model = bind(fixture('cycles.kw'));

  it('evaluate to the combination they write', () => {
    const k3 = kernel(model, 'k3');
    const k4 = kernel(model, 'k4');
    const k1 = (t: number, s: number) => Math.min(t, s);
    const k2 = (t: number, s: number) => Math.exp(-Math.abs(t - s));
    const f3 = (t: number, s: number) => k1(t, s) + 2 * k2(s, t);
    for (const [t, s] of points) {
      expect(valueAt(k3, t, s)).toBeCloseTo(f3(t, s), 14);
      expect(valueAt(k4, t, s)).toBeCloseTo(f3(t, s) - f3(s, t), 14);
    }
  });

  it('are not lowered when they reach a cycle', () => {
    for (const name of ['echo', 'forward', 'backward', 'itself']) expect(kernel(model, name).ir, name).toBeNull();
    for (const name of ['k1', 'k2', 'k3', 'k4']) expect(kernel(model, name).ir, name).not.toBeNull();
  });

  it('are analysed numerically like any kernel', () => {
    const text = 'domain [0, 1]\nkernel k1(t, s) = min(t, s)\nkernel k2(t, s) = exp(-abs(t - s))\nkernel k3(t, s) = k1(t, s) + 2*k2(s, t)\n';
    const r = analyzeText(text, { numerics: true, timeBudgetMs: 2000 });
    expect(r.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
    const report = r.kernels.find((k) => k.name === 'k3')!;
    expect(report.spectrum).not.toBeNull();
    // k3 is positive (a sum of two positive kernels): its eigenvalues are ≥ 0 and add up to the trace, so 0 < λ1 ≤ trace.
    const top = report.spectrum!.eigenvalues[0];
    expect(top.re).toBeGreaterThan(0);
    expect(top.re).toBeLessThanOrEqual(report.spectrum!.trace!.value + report.spectrum!.trace!.error + top.error);
  });
});

describe('declarations with errors', () => {
  it('other than the first of a name, or with a reserved name, are not analysed further', () => {
    const model = bind(fixture('duplicates.kw'));
    const drafts = model.kernels.filter((k) => k.name === 'draft');
    expect(drafts.map((k) => k.ir !== null)).toEqual([true, false]);
    expect(kernel(model, 'gain').ir).toBeNull();
    expect(kernel(model, 'sqrt').ir).toBeNull();
    expect(model.symbols.get('gain')?.kind).toBe('const');
    expect(model.symbols.has('pi')).toBe(false);
  });

  it('use the first domain line of the file', () => {
    const model = bind(fixture('duplicates.kw'));
    expect(model.defaultDomain && [model.defaultDomain.a, model.defaultDomain.b]).toEqual([0, 2]);
    expect(kernel(model, 'draft').domain?.b).toBe(2);
  });
});

describe('an unused constant', () => {
  const unusedHints = (text: string) =>
    analyzeText(text, { numerics: false }).diagnostics.filter((d) => d.code === 'KW211').map((d) => text.slice(d.range.start, d.range.end));
  const kernelLine = 'kernel k(t, s) = t * s';

  it('is reported when nothing uses it', () => {
    expect(unusedHints(`domain [0, 1]\nconst bound = 4\n${kernelLine}\n`)).toEqual(['bound']);
  });

  const uses: [where: string, text: string][] = [
    ['a kernel', `domain [0, 1]\nconst bound = 4\nkernel k(t, s) = bound * t * s\n`],
    ['a helper that a kernel calls', `domain [0, 1]\nconst bound = 4\nfn g(x) = x / bound\nkernel k(t, s) = g(t) * s\n`],
    ['another constant', `domain [0, 1]\nconst bound = 4\nconst twice = 2 * bound\nkernel k(t, s) = twice * t\n`],
    ['the default domain', `domain [0, bound]\nconst bound = 4\n${kernelLine}\n`],
    ['a kernel’s own domain', `const bound = 4\nkernel k(t, s) on [-bound, bound] = t * s\n`],
    ['a claim’s value', `domain [0, 1]\nconst bound = 4\n${kernelLine}\n  expect norm <= bound\n`],
    ['a rank claim', `domain [0, 1]\nconst bound = 4\n${kernelLine}\n  expect rank <= bound\n`],
    ['a resolvent claim', `domain [0, 1]\nconst bound = 4\n${kernelLine}\n  expect resolvent bound\n`],
    ['a second domain line (ignored, but its names are checked)', `domain [0, 1]\nconst bound = 4\n${kernelLine}\ndomain [0, bound]\n`],
  ];
  for (const [where, text] of uses) {
    it(`is not reported when used in ${where}`, () => expect(unusedHints(text)).toEqual([]));
  }
});
