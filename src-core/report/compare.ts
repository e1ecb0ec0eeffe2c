/**
 * Compares two versions of a kernel file, kernel by kernel (see src-core/review/): added, removed, renamed, changed
 * or unchanged, and for a changed kernel the properties that flipped, the figures that moved beyond their errors
 * and the largest change of K itself. Pure: two texts in, plain data out.
 *
 * Work is spent only where something changed: both versions are first read without numerics (parse, names, the
 * hash of each kernel's resolved definition); only when a kernel's definition differs are the two versions
 * analysed numerically, and kernels whose hash did not change are then served from the analysis caches (their
 * figures are never compared).
 *
 * A version whose text does not parse cleanly still takes part (its kernels with errors are reported as not
 * comparable), but when neither version parses cleanly there is nothing to compare and the file is refused.
 *
 * The analyser is a parameter (the in-thread `analyzeText` by default), so that a front end can run the numerics
 * under its safety net. A kernel that the net stopped in either version (KW406, KW407 in that version's analysis)
 * has no figures there: the comparison says so and compares no figure of it, rather than report its figures as
 * vanished or appeared.
 */
import { analyzeText } from '../analysis/analyze';
import { catalogue } from '../diagnostics/catalogue';
import type { AnalysisOptions, FileAnalysis, KernelReport } from '../analysis/types';
import type { Diagnostic } from '../diagnostics/types';
import type { KernelSymbol } from '../semantics/model';
import { LineIndex, type TextRange } from '../syntax/textRange';
import { diffKernel, kernelOnlyIn, type KernelVersion } from '../review/kernelDiff';
import { matchKernels } from '../review/matchKernels';
import { defaultGridPoints } from '../review/pointwise';
import type { Comparison, ComparisonSummary, FileComparison, FileStatus, KernelComparison, KernelStatus } from '../review/types';

export interface VersionText {
  /** The path shown for this version. */
  readonly path: string;
  readonly text: string;
}

export interface CompareOptions {
  /** Options of the numerical analysis (time budget, number of eigenvalues, …). */
  readonly analysis: Partial<AnalysisOptions>;
  /** Points per axis of the grid on which K is compared. */
  readonly gridPoints: number;
}

export const defaultCompareOptions: CompareOptions = { analysis: {}, gridPoints: defaultGridPoints };

export type CompareAnalyzer = (text: string, options: Partial<AnalysisOptions>) => FileAnalysis;

export type FileCompareResult = { readonly ok: true; readonly file: FileComparison } | { readonly ok: false; readonly message: string };

interface ReadVersion {
  readonly text: string;
  readonly analysis: FileAnalysis;
  readonly index: LineIndex;
}

const isSyntaxError = (d: Diagnostic): boolean => d.severity === 'error' && /^KW1\d\d$/.test(d.code);

function describe(d: Diagnostic, index: LineIndex): string {
  return `line ${index.position(d.range.start).line + 1}: ${d.message.replace(/\s*[\r\n]+\s*/g, ' ')}`;
}

function firstError(v: ReadVersion, within?: TextRange): string | null {
  const d = v.analysis.diagnostics.find(
    (x) => x.severity === 'error' && (!within || (x.range.start >= within.start && x.range.start <= within.end)),
  );
  return d ? describe(d, v.index) : null;
}

/** The kernel symbols in the order of `analysis.kernels` (which skips kernels without a name). */
function symbolsOf(analysis: FileAnalysis): (KernelSymbol | undefined)[] {
  const named = analysis.model.kernels.filter((k) => k.name !== '');
  if (named.length === analysis.kernels.length) return named;
  return analysis.kernels.map((r) => analysis.model.kernels.find((k) => k.name === r.name && k.decl.range.start === r.range.start));
}

function versionsOf(v: ReadVersion): KernelVersion[] {
  const symbols = symbolsOf(v.analysis);
  return v.analysis.kernels.map((report: KernelReport, k) => ({
    report,
    ir: symbols[k]?.ir ?? null,
    line: v.index.position(report.range.start).line + 1,
    error: firstError(v, report.range),
  }));
}

const stoppedCodes = new Set<string>([catalogue['analysis-stopped'].code, catalogue['analysis-out-of-memory'].code]);

/** A note saying that the net stopped this version of the kernel, or null when it did not. */
function stoppedNote(side: 'old' | 'new', r: ReadVersion | null, v: KernelVersion): string | null {
  const d = r?.analysis.diagnostics.find((x) => stoppedCodes.has(x.code) && x.range.start === v.report.nameRange.start);
  return d ? `the ${side} version was not analysed to the end (${d.code}): ${d.message.replace(/\s*[\r\n]+\s*/g, ' ')}` : null;
}

/**
 * A comparison of two versions of which at least one was stopped: its figures are not known, so none is compared
 * (the change of K on the grid still is); the same definition on both sides stays unchanged or renamed.
 */
function withStops(k: KernelComparison, stops: readonly string[]): KernelComparison {
  if (stops.length === 0 || k.status === 'renamed' || (k.status === 'unchanged' && !k.rewritten)) return k;
  const notes = [...stops, ...(k.status === 'not-comparable' ? k.notes : [])];
  return { ...k, status: 'not-comparable', rewritten: false, flips: [], figures: [], rank: [], notes };
}

const identity = (v: KernelVersion) => ({ name: v.report.name, hash: v.report.hash });

function read(text: string, options: Partial<AnalysisOptions>, analyze: CompareAnalyzer): ReadVersion {
  return { text, analysis: analyze(text, options), index: new LineIndex(text) };
}

function fileStatus(oldV: VersionText | null, newV: VersionText | null, kernels: readonly KernelComparison[]): FileStatus {
  if (!oldV) return 'added';
  if (!newV) return 'removed';
  return kernels.every((k) => k.status === 'unchanged') ? 'unchanged' : 'modified';
}

/** Compares two versions of one file; null stands for a version that does not exist (file added or removed). */
export function compareFileVersions(
  oldV: VersionText | null,
  newV: VersionText | null,
  options: Partial<CompareOptions> = {},
  analyze: CompareAnalyzer = analyzeText,
): FileCompareResult {
  const opts: CompareOptions = { ...defaultCompareOptions, ...options };
  const path = newV?.path ?? oldV?.path ?? '';
  const quick = { ...opts.analysis, numerics: false };
  let oldR = oldV ? read(oldV.text, quick, analyze) : null;
  let newR = newV ? read(newV.text, quick, analyze) : null;
  const oldBroken = oldR?.analysis.diagnostics.find(isSyntaxError);
  const newBroken = newR?.analysis.diagnostics.find(isSyntaxError);
  if (oldR && newR && oldBroken && newBroken) {
    return {
      ok: false,
      message: `cannot compare '${path}': neither version parses cleanly (old ${describe(oldBroken, oldR.index)}; new ${describe(newBroken, newR.index)})`,
    };
  }
  // The file-level errors are those of the text itself (syntax, names), not failed claims of the numerics.
  const oldErrors = oldR ? firstError(oldR) : null;
  const newErrors = newR ? firstError(newR) : null;
  let pairs = matchKernels(oldR ? versionsOf(oldR) : [], newR ? versionsOf(newR) : [], identity);
  const needsNumerics = pairs.some(
    (p) => p.kind === 'same-name' && p.old.report.hash !== p.new.report.hash && p.old.ir !== null && p.new.ir !== null,
  );
  if (needsNumerics && oldR && newR) {
    const full = { ...opts.analysis, numerics: true };
    oldR = read(oldR.text, full, analyze);
    newR = read(newR.text, full, analyze);
    pairs = matchKernels(versionsOf(oldR), versionsOf(newR), identity);
  }
  const stops = (oldK: KernelVersion | null, newK: KernelVersion | null): string[] =>
    [oldK && stoppedNote('old', oldR, oldK), newK && stoppedNote('new', newR, newK)].filter((n): n is string => !!n);
  const kernels = pairs.map((p): KernelComparison => {
    switch (p.kind) {
      case 'added': {
        const k = kernelOnlyIn('added', p.new);
        return { ...k, notes: [...k.notes, ...stops(null, p.new)] };
      }
      case 'removed': {
        const k = kernelOnlyIn('removed', p.old);
        return { ...k, notes: [...k.notes, ...stops(p.old, null)] };
      }
      default:
        return withStops(diffKernel(p.old, p.new, { gridPoints: opts.gridPoints }), stops(p.old, p.new));
    }
  });
  return {
    ok: true,
    file: {
      path,
      oldPath: oldV?.path ?? null,
      newPath: newV?.path ?? null,
      status: fileStatus(oldV, newV, kernels),
      kernels,
      oldErrors,
      newErrors,
    },
  };
}

const statuses: readonly KernelStatus[] = ['added', 'removed', 'renamed', 'changed', 'unchanged', 'not-comparable'];

export function summarizeComparison(files: readonly FileComparison[]): ComparisonSummary {
  const kernels = Object.fromEntries(statuses.map((s) => [s, 0])) as Record<KernelStatus, number>;
  let flips = 0;
  for (const f of files) {
    for (const k of f.kernels) {
      kernels[k.status]++;
      flips += k.flips.length;
    }
  }
  return { files: files.length, kernels, flips };
}

export function comparison(files: readonly FileComparison[]): Comparison {
  return { files, summary: summarizeComparison(files) };
}
