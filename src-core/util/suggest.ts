/**
 * "Did you mean …?": the closest candidate to a misspelt word.
 *
 * Method: the unrestricted Damerau–Levenshtein distance (insertions, deletions, substitutions and transpositions
 * of adjacent characters, where a transposed pair may be edited further), computed with the dynamic programme of
 * R. Lowrance and R. A. Wagner, "An Extension of the String-to-String Correction Problem", J. ACM 22(2), 1975,
 * extending F. J. Damerau, "A technique for computer detection and correction of spelling errors",
 * Comm. ACM 7(3), 1964. Distances count Unicode code points, so `σ` and `ℓ` are one character each.
 *
 * A candidate is accepted when its distance is at most max(1, floor(length of the word / 3)); among accepted
 * candidates the smallest distance wins and ties go to the candidate listed first.
 */

/** The unrestricted Damerau–Levenshtein distance between `a` and `b`, in code points. */
export function damerauLevenshtein(a: string, b: string): number {
  const s = Array.from(a);
  const t = Array.from(b);
  const m = s.length;
  const n = t.length;
  if (m === 0) return n;
  if (n === 0) return m;
  const infinity = m + n;
  const width = n + 2;
  // d[(i + 1) * width + (j + 1)] is the distance between the first i characters of s and the first j of t;
  // row and column 0 hold the sentinel `infinity`.
  const d = new Int32Array((m + 2) * width);
  d[0] = infinity;
  for (let i = 0; i <= m; i++) {
    d[(i + 1) * width] = infinity;
    d[(i + 1) * width + 1] = i;
  }
  for (let j = 0; j <= n; j++) {
    d[j + 1] = infinity;
    d[width + j + 1] = j;
  }
  /** Last row (1-based) where each character of s was seen. */
  const lastRow = new Map<string, number>();
  for (let i = 1; i <= m; i++) {
    let lastMatchColumn = 0;
    for (let j = 1; j <= n; j++) {
      const i1 = lastRow.get(t[j - 1]) ?? 0;
      const j1 = lastMatchColumn;
      const cost = s[i - 1] === t[j - 1] ? 0 : 1;
      if (cost === 0) lastMatchColumn = j;
      const substitution = d[i * width + j] + cost;
      const insertion = d[(i + 1) * width + j] + 1;
      const deletion = d[i * width + j + 1] + 1;
      const transposition = d[i1 * width + j1] + (i - i1 - 1) + 1 + (j - j1 - 1);
      d[(i + 1) * width + j + 1] = Math.min(substitution, insertion, deletion, transposition);
    }
    lastRow.set(s[i - 1], i);
  }
  return d[(m + 1) * width + n + 1];
}

/** The candidate closest to `word` within max(1, floor(len/3)) edits, or undefined. Ties go to the earlier one. */
export function suggest(word: string, candidates: Iterable<string>): string | undefined {
  const length = Array.from(word).length;
  const limit = Math.max(1, Math.floor(length / 3));
  let best: string | undefined;
  let bestDistance = limit + 1;
  for (const candidate of candidates) {
    // The distance is at least the difference in length: skip hopeless candidates without the quadratic work.
    if (Math.abs(Array.from(candidate).length - length) >= bestDistance) continue;
    const distance = damerauLevenshtein(word, candidate);
    if (distance < bestDistance) {
      best = candidate;
      bestDistance = distance;
    }
  }
  return best;
}
