/**
 * The `kernwright.*` settings as the server reads them, validated (wrong types and out-of-range values fall back to
 * the defaults, within limits), and the analysis options they give.
 */
import { defaultAnalysisOptions, type AnalysisOptions, type Severity } from '@kernwright/core';

export type SeveritySetting = Severity | 'off' | 'default';

/**
 * The findings whose severity is a setting, by setting path under `kernwright.checks.` and catalogue name. Failed
 * declared claims are not here: a claim the numbers contradict is always an error.
 */
export const severitySettings: Readonly<Record<string, { readonly name: string; readonly code: string }>> = {
  'hermitian.severity': { name: 'not-hermitian', code: 'KW501' },
  'boundedness.unboundedSeverity': { name: 'unbounded', code: 'KW510' },
  'boundedness.notHilbertSchmidtSeverity': { name: 'not-hilbert-schmidt', code: 'KW511' },
  'boundedness.weaklySingularSeverity': { name: 'weakly-singular', code: 'KW512' },
  'continuity.jumpSeverity': { name: 'jump', code: 'KW520' },
  'continuity.kinkSeverity': { name: 'kink', code: 'KW521' },
  'positivity.covarianceSeverity': { name: 'covariance-not-positive', code: 'KW530' },
  'positivity.severity': { name: 'not-positive', code: 'KW531' },
  'positivity.mercerSeverity': { name: 'mercer-mismatch', code: 'KW532' },
  'resolvent.severity': { name: 'resolvent-figures', code: 'KW540' },
  'claims.undecidedSeverity': { name: 'claim-undecided', code: 'KW609' },
  'claims.undeclaredSeverity': { name: 'undeclared-property', code: 'KW610' },
};

const severityValues: readonly SeveritySetting[] = ['default', 'error', 'warning', 'info', 'hint', 'off'];

export interface ServerSettings {
  readonly numerics: {
    readonly enabled: boolean;
    readonly eigenvalueCount: number;
    readonly timeBudgetMs: number;
    readonly maxResolution: number;
    readonly targetAccuracy: number;
    readonly debounceMs: number;
  };
  readonly codeLens: { readonly enabled: boolean };
  readonly checks: {
    readonly hermitianTolerance: number;
    readonly positivityTolerance: number;
    /** Catalogue name → severity, for the findings whose setting is not `default`. */
    readonly severities: Readonly<Record<string, Severity | 'off'>>;
  };
}

export const defaultSettings: ServerSettings = {
  numerics: {
    enabled: true,
    eigenvalueCount: defaultAnalysisOptions.eigenCount,
    timeBudgetMs: defaultAnalysisOptions.timeBudgetMs,
    maxResolution: defaultAnalysisOptions.maxResolution,
    targetAccuracy: defaultAnalysisOptions.targetAccuracy,
    debounceMs: 150,
  },
  codeLens: { enabled: true },
  checks: {
    hermitianTolerance: defaultAnalysisOptions.hermitianTolerance,
    positivityTolerance: defaultAnalysisOptions.positivityTolerance,
    severities: {},
  },
};

type Loose = Readonly<Record<string, unknown>>;

function record(x: unknown): Loose {
  return typeof x === 'object' && x !== null && !Array.isArray(x) ? (x as Loose) : {};
}

function num(x: unknown, fallback: number, min: number, max: number, integer = false): number {
  if (typeof x !== 'number' || !Number.isFinite(x)) return fallback;
  const v = integer ? Math.round(x) : x;
  return Math.min(max, Math.max(min, v));
}

function bool(x: unknown, fallback: boolean): boolean {
  return typeof x === 'boolean' ? x : fallback;
}

/** Reads the `kernwright` section of the client's settings; anything missing or malformed takes its default. */
export function readSettings(section: unknown): ServerSettings {
  const s = record(section);
  const n = record(s.numerics);
  const d = defaultSettings.numerics;
  return {
    numerics: {
      enabled: bool(n.enabled, d.enabled),
      eigenvalueCount: num(n.eigenvalueCount, d.eigenvalueCount, 1, 64, true),
      timeBudgetMs: num(n.timeBudgetMs, d.timeBudgetMs, 10, 60_000, true),
      maxResolution: num(n.maxResolution, d.maxResolution, 16, 4096, true),
      targetAccuracy: num(n.targetAccuracy, d.targetAccuracy, 1e-15, 1e-2),
      debounceMs: num(n.debounceMs, d.debounceMs, 0, 5000, true),
    },
    codeLens: { enabled: bool(record(s.codeLens).enabled, defaultSettings.codeLens.enabled) },
    checks: readChecks(record(s.checks)),
  };
}

function readChecks(c: Loose): ServerSettings['checks'] {
  const d = defaultSettings.checks;
  const severities: Record<string, Severity | 'off'> = {};
  for (const [path, { name }] of Object.entries(severitySettings)) {
    const [group, key] = path.split('.');
    const value = record(c[group])[key];
    if (typeof value === 'string' && value !== 'default' && severityValues.includes(value as SeveritySetting)) {
      severities[name] = value as Severity | 'off';
    }
  }
  return {
    hermitianTolerance: num(record(c.hermitian).tolerance, d.hermitianTolerance, 0, 1),
    positivityTolerance: num(record(c.positivity).tolerance, d.positivityTolerance, 0, 1),
    severities,
  };
}

/** The core's analysis options for the numerical stage. */
export function analysisOptions(settings: ServerSettings): Partial<AnalysisOptions> {
  const n = settings.numerics;
  return {
    numerics: true,
    eigenCount: n.eigenvalueCount,
    timeBudgetMs: n.timeBudgetMs,
    maxResolution: n.maxResolution,
    targetAccuracy: n.targetAccuracy,
    hermitianTolerance: settings.checks.hermitianTolerance,
    positivityTolerance: settings.checks.positivityTolerance,
    severities: settings.checks.severities,
  };
}
