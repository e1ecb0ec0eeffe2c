/**
 * A unified diff of two texts, line by line, as `diff -u` and `git diff` print it: `---`/`+++` labels, hunks headed
 * `@@ -start,count +start,count @@` with three lines of context, and `\ No newline at end of file` where a text
 * ends without a line break. Lines are compared with their line endings, so a CRLF/LF change shows.
 *
 * Method: E. W. Myers, "An O(ND) Difference Algorithm and Its Variations", Algorithmica 1 (1986), the greedy
 * forward search for a shortest edit script, with the furthest-reaching diagonals of each step kept for the trace
 * back. Cost O((N + M)·D) time and O(D²) memory for D differences, small for the edits of fixes.
 */

type Op = { readonly kind: ' ' | '-' | '+'; readonly line: string };

/** The lines of a text, each with its line ending ('\n', '\r\n' or none for the last). */
export function splitLines(text: string): string[] {
  return text.match(/[^\n]*\n|[^\n]+$/g) ?? [];
}

function shortestEdit(a: readonly string[], b: readonly string[]): Op[] {
  const n = a.length;
  const m = b.length;
  const max = n + m;
  const offset = max + 1;
  const v = new Int32Array(2 * max + 3);
  const trace: Int32Array[] = [];
  let found = false;
  for (let d = 0; d <= max && !found; d++) {
    trace.push(v.slice());
    for (let k = -d; k <= d; k += 2) {
      let x = k === -d || (k !== d && v[offset + k - 1] < v[offset + k + 1]) ? v[offset + k + 1] : v[offset + k - 1] + 1;
      let y = x - k;
      while (x < n && y < m && a[x] === b[y]) {
        x++;
        y++;
      }
      v[offset + k] = x;
      if (x >= n && y >= m) {
        found = true;
        break;
      }
    }
  }
  // Trace back from (n, m) through the saved diagonals.
  const ops: Op[] = [];
  let x = n;
  let y = m;
  for (let d = trace.length - 1; d >= 0; d--) {
    const vd = trace[d];
    const k = x - y;
    const prevK = k === -d || (k !== d && vd[offset + k - 1] < vd[offset + k + 1]) ? k + 1 : k - 1;
    const prevX = d === 0 ? 0 : vd[offset + prevK];
    const prevY = prevX - prevK;
    while (x > prevX && y > prevY) {
      ops.push({ kind: ' ', line: a[--x] });
      y--;
    }
    if (d === 0) break;
    if (x === prevX) ops.push({ kind: '+', line: b[--y] });
    else ops.push({ kind: '-', line: a[--x] });
  }
  while (x > 0 && y > 0) {
    ops.push({ kind: ' ', line: a[--x] });
    y--;
  }
  return ops.reverse();
}

function printLine(op: Op): string[] {
  const body = op.line.endsWith('\n') ? op.line.slice(0, -1) : op.line;
  const out = [`${op.kind}${body}`];
  if (!op.line.endsWith('\n')) out.push('\\ No newline at end of file');
  return out;
}

function range(start: number, count: number): string {
  // An empty range is written as the line before it, as diff does.
  return count === 0 ? `${start - 1},0` : count === 1 ? `${start}` : `${start},${count}`;
}

/** The unified diff of `oldText` → `newText`; the empty string when they are equal. */
export function unifiedDiff(oldText: string, newText: string, oldLabel: string, newLabel: string, context = 3): string {
  if (oldText === newText) return '';
  const ops = shortestEdit(splitLines(oldText), splitLines(newText));
  const out = [`--- ${oldLabel}`, `+++ ${newLabel}`];
  const changed = ops.map((o, i) => (o.kind !== ' ' ? i : -1)).filter((i) => i >= 0);
  let h = 0;
  while (h < changed.length) {
    // Extend the hunk while the next change is within 2·context unchanged lines.
    let last = h;
    while (last + 1 < changed.length && changed[last + 1] - changed[last] <= 2 * context + 1) last++;
    const from = Math.max(0, changed[h] - context);
    const to = Math.min(ops.length, changed[last] + context + 1);
    let oldStart = 1;
    let newStart = 1;
    for (let i = 0; i < from; i++) {
      if (ops[i].kind !== '+') oldStart++;
      if (ops[i].kind !== '-') newStart++;
    }
    const slice = ops.slice(from, to);
    const oldCount = slice.filter((o) => o.kind !== '+').length;
    const newCount = slice.filter((o) => o.kind !== '-').length;
    out.push(`@@ -${range(oldStart, oldCount)} +${range(newStart, newCount)} @@`);
    for (const o of slice) out.push(...printLine(o));
    h = last + 1;
  }
  return out.join('\n') + '\n';
}
