/** What went wrong, as a stable code. */
export type StatsErrorCode = 'length-mismatch' | 'invalid-count' | 'not-finite' | 'too-few-levels' | 'invalid-option';

/**
 * The error `lib/stats` raises: `length-mismatch` when x, n and k differ in length; `invalid-count` for an n that
 * is not a positive integer or a k outside 0…n; `not-finite` for NaN or infinite input; `too-few-levels` for fewer
 * than two distinct stimulus levels; `invalid-option` for a lapse or spread bound out of range.
 */
export class StatsError extends Error {
  override readonly name = 'StatsError';
  readonly code: StatsErrorCode;

  constructor(code: StatsErrorCode, message: string) {
    super(message);
    this.code = code;
  }
}
