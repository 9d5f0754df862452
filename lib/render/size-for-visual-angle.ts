/**
 * The size, in the units of `distance` (> 0), that subtends `degrees` (0 < θ < 180) centred on the line of sight:
 * S = 2D·tan(θ / 2), the inverse of θ = 2·atan(S / 2D).
 */
export function sizeForVisualAngle(degrees: number, distance: number): number {
  return 2 * distance * Math.tan((degrees * Math.PI) / 360);
}
