import type { SpaceFailure } from './types';

/** What went wrong, as a stable code. */
export type SpaceErrorCode = 'invalid-definition' | 'invalid-space' | 'invalid-argument';

/**
 * The error `lib/space` raises. `invalid-definition`: the definition cannot be generated at all (malformed
 * layout, extent, axis or equalisation); `invalid-space`: it generates, but some stimuli are invalid shapes
 * (raised by the audit and equalisation, which need every stimulus); `invalid-argument`: bad options.
 * `failures` lists every problem found, as `checkSpace` reports them.
 */
export class SpaceError extends Error {
  override readonly name = 'SpaceError';
  readonly code: SpaceErrorCode;
  readonly failures: readonly SpaceFailure[];

  constructor(code: SpaceErrorCode, message: string, failures: readonly SpaceFailure[] = []) {
    super(message);
    this.code = code;
    this.failures = failures;
  }
}
