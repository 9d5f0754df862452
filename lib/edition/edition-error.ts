/** What went wrong, as a stable code. */
export type EditionErrorCode =
  | 'non-finite-number'
  | 'undefined-value'
  | 'unsupported-type'
  | 'lone-surrogate'
  | 'cycle'
  | 'invalid-argument';

/**
 * The error `lib/edition` raises. `path` is a JSON Pointer (RFC 6901) to the offending value, '' for the root,
 * so a caller can name the field; empty when the error is not about a value.
 */
export class EditionError extends Error {
  override readonly name = 'EditionError';
  readonly code: EditionErrorCode;
  readonly path: string;

  constructor(code: EditionErrorCode, message: string, path = '') {
    super(message);
    this.code = code;
    this.path = path;
  }
}
