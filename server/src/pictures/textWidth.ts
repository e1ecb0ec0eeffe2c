/**
 * Text widths for vega's layout when no canvas is available (as in Node): vega's own fallback counts every
 * character as 0.8 em, which makes legends and axis titles far wider than they are drawn and truncates long labels
 * early. Here each character gets an approximate advance of DejaVu Sans (the usual sans-serif on Linux and one of
 * the wider common fonts), so that layouts fit in it and in narrower fonts alike.
 */

const narrow = new Set([...`ijl.,:;!|'\`·`]);
const semiNarrow = new Set([...`()[]{}frtI ₀₁₂₃₄₅₆₇₈₉⁰¹²³⁴⁵⁶⁷⁸⁹‖/\\-`]);
const wide = new Set([...'mwMW%…@']);
const symbols = new Set([...'±−≤≥→∞×≈∫Σ∑√∂∇⊂∈']);

/** Advance of one character, in em. */
export function charWidthEm(c: string): number {
  if (narrow.has(c)) return 0.3;
  if (semiNarrow.has(c)) return 0.4;
  if (wide.has(c)) return 0.95;
  if (symbols.has(c)) return 0.84;
  if (c >= '0' && c <= '9') return 0.64;
  if (c >= 'a' && c <= 'z') return 0.6;
  if (c >= 'A' && c <= 'Z') return 0.72;
  const code = c.codePointAt(0) ?? 0;
  if (code >= 0x370 && code < 0x400) return 0.62; // Greek
  if (code >= 0x2e80) return 1; // wide scripts
  return 0.62;
}

/** Width in pixels of `text` at `fontSize` pixels. */
export function textWidth(text: string, fontSize: number): number {
  let em = 0;
  for (const c of text) em += charWidthEm(c);
  return em * fontSize;
}

/** The function vega calls as `textMetrics.width(item, text)`: the given line (or the widest line of the item's text), untruncated. */
export function vegaTextWidth(item: { text?: unknown; fontSize?: unknown }, text?: unknown): number {
  const size = item.fontSize != null ? Number(item.fontSize) || 0 : 11;
  const raw = text ?? item.text;
  if (raw == null) return 0;
  if (Array.isArray(raw)) return Math.max(0, ...raw.map((line) => textWidth(String(line).trim(), size)));
  return textWidth(String(raw).trim(), size);
}
