import type { PackIssue } from './types';

/** What went wrong, as a stable code. */
export type PackErrorCode = 'invalid-input' | 'invalid-space' | 'render-failed';

/**
 * The error `lib/pack` raises. `invalid-input`: the edition metadata, boundaries, display profile or render
 * options are unusable (every problem in `issues`, each with its field); `invalid-space`: some stimuli are shapes
 * the engine refuses (each in `issues` by stimulus id) or do not fit the canvas; `render-failed`: the PNG back
 * end failed (the original error is the `cause`).
 */
export class PackError extends Error {
  override readonly name = 'PackError';
  readonly code: PackErrorCode;
  readonly issues: readonly PackIssue[];

  constructor(code: PackErrorCode, message: string, issues: readonly PackIssue[] = [], options?: { cause?: unknown }) {
    super(message, options);
    this.code = code;
    this.issues = issues;
  }
}
