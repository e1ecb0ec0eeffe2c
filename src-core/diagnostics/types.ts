/**
 * One shape for every finding: syntax, names, evaluation faults, numerics and property checks.
 * Ranges are offsets into the file's text; front ends convert them (see `LineIndex`).
 */
import type { TextRange } from '../syntax/textRange';

export type Severity = 'error' | 'warning' | 'info' | 'hint';

export interface RelatedInformation {
  readonly range: TextRange;
  readonly message: string;
}

/** A text edit: replace `range` by `newText`. */
export interface TextEdit {
  readonly range: TextRange;
  readonly newText: string;
}

/** A fix the editor and the command line can apply; `kind` names the fix family (`--only` on the command line). */
export interface Fix {
  readonly kind: string;
  readonly title: string;
  readonly edits: readonly TextEdit[];
  /** True when this fix is the obvious one for its diagnostic. */
  readonly preferred?: boolean;
}

export interface Diagnostic {
  /** Stable code from the catalogue, e.g. `KW201`. */
  readonly code: string;
  readonly severity: Severity;
  readonly range: TextRange;
  readonly message: string;
  readonly related?: readonly RelatedInformation[];
  /** `unnecessary` renders faded in editors (unused declarations). */
  readonly tags?: readonly 'unnecessary'[];
  /** Figures behind the finding (plain JSON values), e.g. `{ defect: 0.12, t: 0.3, s: 0.7 }`. */
  readonly figures?: Readonly<Record<string, number | string | boolean | null>>;
  readonly fixes?: readonly Fix[];
}
