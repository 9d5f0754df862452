/**
 * Visual angle, degrees, of a size S centred on the line of sight at distance D (same units, D > 0):
 * θ = 2·atan(S / 2D).
 */
export function visualAngle(size: number, distance: number): number {
  return (2 * Math.atan(size / (2 * distance)) * 180) / Math.PI;
}
