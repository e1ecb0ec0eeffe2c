import type { TextRange } from '../syntax/textRange';
import { catalogue, formatMessage, type DiagnosticName } from './catalogue';
import type { Diagnostic, Fix, RelatedInformation, Severity } from './types';

export interface DiagnosticExtras {
  readonly severity?: Severity;
  readonly related?: readonly RelatedInformation[];
  readonly tags?: readonly 'unnecessary'[];
  readonly figures?: Readonly<Record<string, number | string | boolean | null>>;
  readonly fixes?: readonly Fix[];
}

/** Builds a diagnostic from its catalogue entry; `args` fill the message template. */
export function makeDiagnostic(
  name: DiagnosticName,
  range: TextRange,
  args: Readonly<Record<string, string | number>> = {},
  extras: DiagnosticExtras = {},
): Diagnostic {
  const e = catalogue[name];
  return {
    code: e.code,
    severity: extras.severity ?? e.severity,
    range,
    message: formatMessage(e.template, args),
    ...(extras.related ? { related: extras.related } : {}),
    ...(extras.tags ? { tags: extras.tags } : {}),
    ...(extras.figures ? { figures: extras.figures } : {}),
    ...(extras.fixes ? { fixes: extras.fixes } : {}),
  };
}
