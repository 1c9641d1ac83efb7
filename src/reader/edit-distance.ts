/**
 * "Did you mean" suggestions for misspelt field and variable names, using the
 * Levenshtein edit distance (insertions, deletions and substitutions, each of
 * cost 1), computed by the usual dynamic programme over two rows.
 */

export function editDistance(a: string, b: string): number {
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const row = [i];
    for (let j = 1; j <= b.length; j++) {
      const substitute = prev[j - 1]! + (a[i - 1] === b[j - 1] ? 0 : 1);
      row.push(Math.min(prev[j]! + 1, row[j - 1]! + 1, substitute));
    }
    prev = row;
  }
  return prev[b.length]!;
}

/**
 * The candidate closest to `word`, if it is close enough to be a likely typo:
 * one edit for words of 2 to 5 characters, two for longer ones, none for a
 * single character (so that `x` does not suggest `y`). Case differences count as edits but are tried first,
 * so `Degree` suggests `degree`. Ties go to the candidate closest in length
 * (`R1` suggests `R0` rather than `R`), then to the earlier one.
 */
export function closestName(word: string, candidates: readonly string[]): string | null {
  const folded = candidates.find((c) => c.toLowerCase() === word.toLowerCase() && c !== word);
  if (folded !== undefined) return folded;
  let best: string | null = null;
  let bestDistance = Infinity;
  let bestSkew = Infinity;
  for (const c of candidates) {
    if (c === word) continue;
    const d = editDistance(word, c);
    const skew = Math.abs(c.length - word.length);
    if (d < bestDistance || (d === bestDistance && skew < bestSkew)) {
      best = c;
      bestDistance = d;
      bestSkew = skew;
    }
  }
  const limit = word.length <= 1 ? 0 : word.length <= 5 ? 1 : 2;
  return bestDistance <= limit ? best : null;
}

/** "; did you mean `degree`?" or "" when nothing is close. */
export function didYouMean(word: string, candidates: readonly string[]): string {
  const c = closestName(word, candidates);
  return c === null ? '' : `; did you mean \`${c}\`?`;
}
