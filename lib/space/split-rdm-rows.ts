/**
 * Splits the rows of an n × n RDM's upper triangle into at most `parts` consecutive blocks [from, to) of about
 * equal pair counts (row i has n − 1 − i pairs), for computing them apart. Covers 0 … n exactly, no empty block.
 */
export function splitRdmRows(n: number, parts: number): { readonly from: number; readonly to: number }[] {
  const blocks: { from: number; to: number }[] = [];
  const total = (n * (n - 1)) / 2;
  const count = Math.max(1, Math.min(parts, n));
  let from = 0;
  let done = 0;
  for (let b = 1; b <= count && from < n; b++) {
    let to = from;
    const target = (total * b) / count;
    while (to < n && (done < target || to === from)) done += n - 1 - to++;
    if (b === count) to = n;
    blocks.push({ from, to });
    from = to;
  }
  return blocks;
}
