/**
 * Constants of category boundaries.
 * - `onTolerance`: 1e-9 axis units. A stimulus closer than this to a boundary is 'on' it (ambiguous). Layout
 *   positions come from cos/sin, so a stimulus meant to lie on a boundary misses it by about 1e-16·ρ; 1e-9 is far
 *   above that rounding and far below any designed spacing (a 2,000-stimulus space of ρmax 1 has gaps ~0.02).
 * - `defaultPrototypeFraction`: 0.75 — the default prototype distance, d = 0.75·ρmax, inside the space
 *   and clear of both the boundary and the rim.
 * - `maxAngleDeg`: 180 (exclusive): diameters at θ and θ + 180° coincide.
 */
export const BOUNDARY_LIMITS = {
  onTolerance: 1e-9,
  defaultPrototypeFraction: 0.75,
  maxAngleDeg: 180,
} as const;

/** Boundary keys: lowercase letters, digits and single hyphens, 1–40 characters, so `p-<key>-a` is a clean id. */
export const BOUNDARY_KEY_PATTERN = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;

/** Longest boundary key, characters. */
export const MAX_BOUNDARY_KEY_LENGTH = 40;
