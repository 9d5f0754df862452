/** cos and sin of 2πm/N for m = 0…N−1, computed with Math.cos/Math.sin (each entry correct to ~1 ulp). */
export interface TrigTable {
  readonly size: number;
  readonly cos: Float64Array;
  readonly sin: Float64Array;
}

/** Tables are reused across calls; a few sizes are in play at any time, so a small cache is enough. */
const MAX_CACHED_TABLES = 16;
const cache = new Map<number, TrigTable>();

/**
 * The table of cos/sin(2πm/N), built once per N and shared (never mutate it). Entries use the symmetry of
 * the circle so that cos(2πm/N) and cos(2π(N−m)/N) are bit-identical.
 */
export function getTrigTable(size: number): TrigTable {
  const cached = cache.get(size);
  if (cached) return cached;
  const cos = new Float64Array(size);
  const sin = new Float64Array(size);
  const step = (2 * Math.PI) / size;
  for (let m = 0; m <= size >> 1; m++) {
    const c = Math.cos(step * m);
    const s = Math.sin(step * m);
    cos[m] = c;
    sin[m] = s;
    if (m > 0 && m < size - m) {
      cos[size - m] = c;
      sin[size - m] = -s;
    }
  }
  if (cache.size >= MAX_CACHED_TABLES) cache.clear();
  const table: TrigTable = { size, cos, sin };
  cache.set(size, table);
  return table;
}
