/** True when `value` is an integer symbol in 0…k−1. */
export function isSymbol(value: unknown, k: number): value is number {
  return typeof value === 'number' && Number.isInteger(value) && value >= 0 && value < k;
}
