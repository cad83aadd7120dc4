/**
 * Edit distance between two words counting insertions, deletions, substitutions and swaps of
 * two neighbouring letters, each as 1: the optimal string alignment variant of the
 * Damerau-Levenshtein distance.
 *
 * Method: Wagner-Fischer dynamic programming (R. A. Wagner, M. J. Fischer, "The string-to-string
 * correction problem", J. ACM 21(1), 1974) with Damerau's transposition step (F. J. Damerau,
 * "A technique for computer detection and correction of spelling errors", CACM 7(3), 1964).
 * O(|a| |b|) time; fine for key names.
 *
 * Syntax: editDistance(a, b)
 * Example: editDistance('resitance', 'resistance')   // 1
 *          editDistance('fequnecy', 'frequency')     // 2
 */
export function editDistance(a: string, b: string): number {
  const rows = a.length + 1;
  const cols = b.length + 1;
  const d: number[][] = Array.from({ length: rows }, (_, i) => Array.from({ length: cols }, (_, j) => (i === 0 ? j : j === 0 ? i : 0)));
  for (let i = 1; i < rows; i++) {
    for (let j = 1; j < cols; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      d[i][j] = Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) {
        d[i][j] = Math.min(d[i][j], d[i - 2][j - 2] + 1);
      }
    }
  }
  return d[rows - 1][cols - 1];
}
