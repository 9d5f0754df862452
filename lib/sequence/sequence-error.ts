/**
 * What went wrong, as a stable machine-readable code. The app layer maps these onto its own error vocabulary
 * (`validation:run-order`, …); nothing here depends on a framework.
 */
export type SequenceErrorCode =
  | 'invalid-argument'
  | 'invalid-seed'
  | 'too-few-conditions'
  | 'too-many-conditions'
  | 'duplicate-condition'
  | 'invalid-condition'
  | 'no-type1-index1'
  | 'search-timeout'
  | 'no-immediate-repeat-impossible'
  | 'duration-not-positive'
  | 'tr-not-positive'
  | 'invalid-iti'
  | 'run-too-short'
  | 'enumeration-too-large'
  | 'invalid-label';

/** Facts about the failure, as data. All fields optional. */
export interface SequenceErrorDetails {
  /** Name of the offending option (`trialDuration`, `iti.max`, `runs`, …). */
  readonly field?: string;
  /** The offending value, as given. */
  readonly value?: unknown;
  /** Number of conditions involved. */
  readonly conditions?: number;
  /** Trials a request would need (e.g. n² + 1 for a balanced order of n conditions). */
  readonly trials?: number;
  readonly minimum?: number;
  readonly maximum?: number;
  /** Milliseconds spent, for `search-timeout`. */
  readonly elapsedMs?: number;
  /** A sequence type that can be offered instead (e.g. `de-bruijn` for n = 3…5). */
  readonly alternative?: 'de-bruijn' | 'shuffled-blocks';
}

/**
 * The one error type raised by `lib/sequence`. `code` is stable and is what callers branch on; `message` is for
 * people and names the values involved; `details` carries the same facts as data.
 */
export class SequenceError extends Error {
  override readonly name = 'SequenceError';
  readonly code: SequenceErrorCode;
  readonly details: SequenceErrorDetails;

  constructor(code: SequenceErrorCode, message: string, details: SequenceErrorDetails = {}, options?: { cause?: unknown }) {
    super(message, options);
    this.code = code;
    this.details = details;
  }
}
