/**
 * The largest absolute difference between corresponding numbers of two plain-data values of the same shape
 * (same keys, same array lengths, equal strings, booleans and nulls): 0 for identical values. Infinity when the
 * shapes differ in any way (a key or term added, a family changed), or a number is not finite. Units are those
 * of the values.
 */
export function numericDifference(before: unknown, after: unknown): number {
  if (typeof before === 'number' && typeof after === 'number') {
    const gap = Math.abs(before - after);
    return Number.isFinite(gap) ? gap : before === after ? 0 : Number.POSITIVE_INFINITY;
  }
  if (before === null || after === null || typeof before !== 'object' || typeof after !== 'object') {
    return before === after ? 0 : Number.POSITIVE_INFINITY;
  }
  if (Array.isArray(before) !== Array.isArray(after)) return Number.POSITIVE_INFINITY;
  const beforeRecord = before as Record<string, unknown>;
  const afterRecord = after as Record<string, unknown>;
  const keys = Object.keys(beforeRecord);
  if (keys.length !== Object.keys(afterRecord).length) return Number.POSITIVE_INFINITY;
  let largest = 0;
  for (const key of keys) {
    if (!Object.hasOwn(afterRecord, key)) return Number.POSITIVE_INFINITY;
    largest = Math.max(largest, numericDifference(beforeRecord[key], afterRecord[key]));
    if (largest === Number.POSITIVE_INFINITY) break;
  }
  return largest;
}
