/**
 * About `count` evenly spaced "nice" tick values (steps of 1, 2 or 5 × 10ⁿ, after Heckbert 1990, Graphics Gems)
 * covering [min, max]. Returns [min] when the range is empty.
 */
export function niceTicks(min: number, max: number, count = 5): number[] {
  if (!(max > min) || !Number.isFinite(min) || !Number.isFinite(max)) return [min];
  const raw = (max - min) / Math.max(1, count);
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * magnitude).find((s) => s >= raw) ?? 10 * magnitude;
  const ticks: number[] = [];
  const first = Math.ceil(min / step - 1e-9);
  for (let i = first; i * step <= max + step * 1e-9; i++) ticks.push(i === 0 ? 0 : Number((i * step).toPrecision(12)));
  return ticks;
}
