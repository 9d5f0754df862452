/**
 * Least-squares slope of y on x for a line through the origin, Σxy / Σx² (the fit of y = βx minimising
 * Σ(y − βx)²). 0 when every x is 0. Equal-length inputs.
 */
export function slopeThroughOrigin(x: ArrayLike<number>, y: ArrayLike<number>): number {
  let xy = 0;
  let xx = 0;
  for (let i = 0; i < x.length; i++) {
    xy += (x[i] as number) * (y[i] as number);
    xx += (x[i] as number) ** 2;
  }
  return xx === 0 ? 0 : xy / xx;
}
