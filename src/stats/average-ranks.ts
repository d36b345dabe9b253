/**
 * Ranks 1..n of the values, ties sharing the mean of the ranks they occupy ("mid-ranks"; the
 * convention of Spearman's rank correlation with ties, e.g. Kendall, M. G. (1970) Rank Correlation
 * Methods, 4th ed., Griffin, ch. 3). Non-finite values are an error.
 */
export function averageRanks(values: ArrayLike<number>): Float64Array {
  const n = values.length;
  const order = Array.from({ length: n }, (_, i) => i);
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(values[i])) {
      throw new RangeError(`averageRanks: value at index ${i} is not finite (${values[i]})`);
    }
  }
  order.sort((a, b) => values[a] - values[b]);
  const ranks = new Float64Array(n);
  let start = 0;
  while (start < n) {
    let end = start;
    while (end + 1 < n && values[order[end + 1]] === values[order[start]]) end++;
    const shared = (start + end) / 2 + 1;
    for (let k = start; k <= end; k++) ranks[order[k]] = shared;
    start = end + 1;
  }
  return ranks;
}
