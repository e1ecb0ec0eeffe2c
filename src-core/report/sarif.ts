/**
 * The report for code-scanning services: a SARIF 2.1.0 log (OASIS Static Analysis Results Interchange Format,
 * version 2.1.0) with one run. Plain data, ready for `JSON.stringify`; no file system, no terminal.
 *
 * - `tool.driver.rules` holds one rule per catalogue entry that occurs in the results (sorted by code): the code is
 *   the rule id, the slug its name, the title its short description and the help text its full description and help.
 *   A rule's default level comes from the catalogue severity (error → error, warning → warning, info and hint →
 *   note); a result's level from the diagnostic's own severity (settings may have changed it).
 * - Every result points at its file by a relative URI with forward slashes and at a region with 1-based lines and
 *   columns. Columns count UTF-16 code units (`run.columnKind = "utf16CodeUnits"`), as JavaScript strings do, and
 *   `endColumn` is the column just after the region, as SARIF defines it.
 * - Related ranges become `relatedLocations`; the diagnostic's figures become the result's property bag; the fixes
 *   the editor offers become SARIF `fixes` (replacements of regions).
 */
import type { Diagnostic, Fix, Severity } from '../diagnostics/types';
import { entryByCode, nameByCode } from '../diagnostics/catalogue';
import { LineIndex, type TextRange } from '../syntax/textRange';
import { jsonNumber, type AnalysedFile } from './json';

export const sarifVersion = '2.1.0';
export const sarifSchemaUri = 'https://json.schemastore.org/sarif-2.1.0.json';

export type SarifLevel = 'error' | 'warning' | 'note' | 'none';

export interface SarifTool {
  readonly name: string;
  readonly version: string;
  readonly informationUri?: string;
}

export interface SarifMessage {
  readonly text: string;
}

export interface SarifRegion {
  readonly startLine: number;
  readonly startColumn: number;
  readonly endLine: number;
  readonly endColumn: number;
}

export interface SarifArtifactLocation {
  readonly uri: string;
  readonly index?: number;
}

export interface SarifPhysicalLocation {
  readonly artifactLocation: SarifArtifactLocation;
  readonly region: SarifRegion;
}

export interface SarifLocation {
  readonly id?: number;
  readonly physicalLocation: SarifPhysicalLocation;
  readonly message?: SarifMessage;
}

export interface SarifReplacement {
  readonly deletedRegion: SarifRegion;
  readonly insertedContent: { readonly text: string };
}

export interface SarifFix {
  readonly description: SarifMessage;
  readonly artifactChanges: readonly { readonly artifactLocation: SarifArtifactLocation; readonly replacements: readonly SarifReplacement[] }[];
}

export type SarifPropertyValue = number | string | boolean | null | readonly string[];

export interface SarifResult {
  readonly ruleId: string;
  readonly ruleIndex: number;
  readonly level: SarifLevel;
  readonly message: SarifMessage;
  readonly locations: readonly SarifLocation[];
  readonly relatedLocations?: readonly SarifLocation[];
  readonly fixes?: readonly SarifFix[];
  readonly properties?: Readonly<Record<string, SarifPropertyValue>>;
}

export interface SarifRule {
  readonly id: string;
  readonly name: string;
  readonly shortDescription: SarifMessage;
  readonly fullDescription: SarifMessage;
  readonly help: SarifMessage;
  readonly defaultConfiguration: { readonly level: SarifLevel };
}

export interface SarifRun {
  readonly tool: { readonly driver: SarifTool & { readonly rules: readonly SarifRule[] } };
  readonly columnKind: 'utf16CodeUnits';
  readonly artifacts: readonly { readonly location: SarifArtifactLocation }[];
  readonly results: readonly SarifResult[];
}

export interface SarifLog {
  readonly $schema: string;
  readonly version: typeof sarifVersion;
  readonly runs: readonly SarifRun[];
}

/** SARIF has three result levels that matter: error, warning and note (info and hint both become note). */
export function sarifLevel(severity: Severity): SarifLevel {
  switch (severity) {
    case 'error':
      return 'error';
    case 'warning':
      return 'warning';
    case 'info':
    case 'hint':
      return 'note';
  }
}

/**
 * A path as a URI reference: backslashes become slashes, each segment is percent-encoded (so spaces and `#` are
 * safe), `./` prefixes are dropped; an absolute path becomes a `file://` URI.
 */
export function sarifUri(path: string): string {
  let p = path.replace(/\\/g, '/');
  while (p.startsWith('./')) p = p.slice(2);
  const drive = /^([A-Za-z]):\//.exec(p);
  const encode = (rest: string): string => rest.split('/').map((seg) => encodeURIComponent(seg)).join('/');
  if (drive) return `file:///${drive[1]}:/${encode(p.slice(3))}`;
  if (p.startsWith('/')) return `file://${encode(p)}`;
  return encode(p);
}

/** A range as a SARIF region: 1-based lines and columns; `endColumn` is the column after the last character. */
export function sarifRegion(range: TextRange, index: LineIndex): SarifRegion {
  const lc = index.toLineColumn(range);
  return {
    startLine: lc.start.line + 1,
    startColumn: lc.start.character + 1,
    endLine: lc.end.line + 1,
    endColumn: lc.end.character + 1,
  };
}

/** One rule per catalogue code, from the catalogue's title, help text and default severity. */
export function sarifRule(code: string): SarifRule {
  const entry = entryByCode(code);
  const name = nameByCode(code) ?? code;
  const title = entry?.title ?? code;
  const help = entry?.help ?? title;
  return {
    id: code,
    name,
    shortDescription: { text: title },
    fullDescription: { text: help },
    help: { text: help },
    defaultConfiguration: { level: sarifLevel(entry?.severity ?? 'warning') },
  };
}

/** The diagnostic's figures as a property bag (numbers that are not finite become null). */
function properties(d: Diagnostic): Record<string, SarifPropertyValue> | undefined {
  const bag: Record<string, SarifPropertyValue> = {};
  for (const [key, value] of Object.entries(d.figures ?? {})) {
    // `tags` is reserved in SARIF property bags (an array of strings).
    bag[key === 'tags' ? 'figure.tags' : key] = typeof value === 'number' ? jsonNumber(value) : value;
  }
  if (d.tags && d.tags.length > 0) bag.tags = [...d.tags];
  return Object.keys(bag).length > 0 ? bag : undefined;
}

function sarifFix(fix: Fix, artifact: SarifArtifactLocation, index: LineIndex): SarifFix {
  return {
    description: { text: fix.title },
    artifactChanges: [{
      artifactLocation: artifact,
      replacements: fix.edits.map((e) => ({ deletedRegion: sarifRegion(e.range, index), insertedContent: { text: e.newText } })),
    }],
  };
}

function sarifResult(d: Diagnostic, ruleIndex: number, artifact: SarifArtifactLocation, index: LineIndex): SarifResult {
  const location = (range: TextRange): SarifPhysicalLocation => ({ artifactLocation: artifact, region: sarifRegion(range, index) });
  const related = (d.related ?? []).map((r, k) => ({ id: k + 1, physicalLocation: location(r.range), message: { text: r.message } }));
  const bag = properties(d);
  return {
    ruleId: d.code,
    ruleIndex,
    level: sarifLevel(d.severity),
    message: { text: d.message },
    locations: [{ physicalLocation: location(d.range) }],
    ...(related.length > 0 ? { relatedLocations: related } : {}),
    ...(d.fixes && d.fixes.length > 0 ? { fixes: d.fixes.map((f) => sarifFix(f, artifact, index)) } : {}),
    ...(bag ? { properties: bag } : {}),
  };
}

/** The SARIF log of a check: one run, every file as an artifact, one result per diagnostic in report order. */
export function sarifLog(files: readonly AnalysedFile[], tool: SarifTool): SarifLog {
  const codes = [...new Set(files.flatMap((f) => f.diagnostics.map((d) => d.code)))].sort();
  const ruleIndex = new Map(codes.map((c, k) => [c, k]));
  const artifacts = files.map((f) => ({ location: { uri: sarifUri(f.path) } }));
  const results: SarifResult[] = [];
  files.forEach((file, k) => {
    const index = new LineIndex(file.text);
    const artifact: SarifArtifactLocation = { uri: artifacts[k].location.uri, index: k };
    for (const d of file.diagnostics) results.push(sarifResult(d, ruleIndex.get(d.code)!, artifact, index));
  });
  const driver = {
    name: tool.name,
    version: tool.version,
    ...(tool.informationUri ? { informationUri: tool.informationUri } : {}),
    rules: codes.map(sarifRule),
  };
  return {
    $schema: sarifSchemaUri,
    version: sarifVersion,
    runs: [{ tool: { driver }, columnKind: 'utf16CodeUnits', artifacts, results }],
  };
}
