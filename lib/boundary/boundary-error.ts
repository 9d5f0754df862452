/** What went wrong, as a stable code. */
export type BoundaryErrorCode = 'angle-out-of-range' | 'invalid-key' | 'duplicate-key' | 'invalid-argument';

/**
 * The error `lib/boundary` raises: `angle-out-of-range` for an angle that is NaN, infinite or outside
 * [0°, 180°); `invalid-key` / `duplicate-key` for boundary keys; `invalid-argument` for a bad extent, distance,
 * spoke count or tolerance.
 */
export class BoundaryError extends Error {
  override readonly name = 'BoundaryError';
  readonly code: BoundaryErrorCode;

  constructor(code: BoundaryErrorCode, message: string) {
    super(message);
    this.code = code;
  }
}
