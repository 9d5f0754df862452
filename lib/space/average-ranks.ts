/**
 * Ranks 1…n of the values, ties sharing the mean of the ranks they span (the "average" or fractional ranking
 * Spearman's coefficient uses): [10, 20, 20, 30] → [1, 2.5, 2.5, 4]. NaN values are not allowed (they have no
 * order); the input is not modified.
 */
export function averageRanks(values: ArrayLike<number>): Float64Array {
  const n = values.length;
  const order = new Uint32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  order.sort((p, q) => (values[p] as number) - (values[q] as number));
  const ranks = new Float64Array(n);
  for (let start = 0; start < n; ) {
    let end = start + 1;
    const value = values[order[start] as number] as number;
    while (end < n && values[order[end] as number] === value) end++;
    // Positions start…end−1 hold ranks start+1…end; their mean is (start + 1 + end) / 2.
    const rank = (start + 1 + end) / 2;
    for (let i = start; i < end; i++) ranks[order[i] as number] = rank;
    start = end;
  }
  return ranks;
}
