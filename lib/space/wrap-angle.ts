const TWO_PI = 2 * Math.PI;

/** An angle in radians wrapped into [0, 2π). */
export function wrapAngle(angle: number): number {
  const wrapped = angle - TWO_PI * Math.floor(angle / TWO_PI);
  // Rounding can land exactly on 2π for tiny negative inputs.
  return wrapped >= TWO_PI ? 0 : wrapped;
}
