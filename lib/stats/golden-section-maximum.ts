/** (√5 − 1)/2, the golden-section ratio. */
const GOLDEN = 0.6180339887498949;

/**
 * The maximiser on [lo, hi] of a function assumed unimodal there, by golden-section search (Kiefer 1953) to an
 * interval narrower than `tolerance`, then compared with both ends so a maximum on a bound is returned exactly.
 */
export function goldenSectionMaximum(f: (x: number) => number, lo: number, hi: number, tolerance: number): { x: number; value: number } {
  let a = lo;
  let b = hi;
  let x1 = b - GOLDEN * (b - a);
  let x2 = a + GOLDEN * (b - a);
  let f1 = f(x1);
  let f2 = f(x2);
  while (b - a > tolerance) {
    if (f1 >= f2) {
      b = x2;
      x2 = x1;
      f2 = f1;
      x1 = b - GOLDEN * (b - a);
      f1 = f(x1);
    } else {
      a = x1;
      x1 = x2;
      f1 = f2;
      x2 = a + GOLDEN * (b - a);
      f2 = f(x2);
    }
  }
  let best = f1 >= f2 ? { x: x1, value: f1 } : { x: x2, value: f2 };
  for (const end of [lo, hi]) {
    const value = f(end);
    if (value >= best.value) best = { x: end, value };
  }
  return best;
}
