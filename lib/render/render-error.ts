import type { RenderIssue } from './types';

/** What went wrong, as a stable code. */
export type RenderErrorCode = 'invalid-render' | 'does-not-fit' | 'invalid-argument';

/**
 * The error `lib/render` raises. `invalid-render`: the display profile or render options fail `checkRender`
 * (every error is in `issues`, each with its field); `does-not-fit`: a stimulus reaches past the canvas;
 * `invalid-argument`: a malformed call (an empty contour list, a bad colour string).
 */
export class RenderError extends Error {
  override readonly name = 'RenderError';
  readonly code: RenderErrorCode;
  readonly issues: readonly RenderIssue[];

  constructor(code: RenderErrorCode, message: string, issues: readonly RenderIssue[] = []) {
    super(message);
    this.code = code;
    this.issues = issues;
  }
}
