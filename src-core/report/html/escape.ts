/** Text made safe for HTML element content and double-quoted attribute values. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/** A string usable as an HTML id and in a CSS selector: letters, digits, `-` and `_` only. */
export function slug(text: string): string {
  const s = text.normalize('NFKD').replace(/[^A-Za-z0-9_-]+/g, '-').replace(/^-+|-+$/g, '');
  return s === '' ? 'x' : s;
}
