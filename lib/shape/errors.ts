/**
 * What went wrong, as a stable machine-readable code. The app layer maps these codes onto its own error
 * vocabulary; nothing here depends on a framework.
 */
export type ShapeErrorCode =
  | 'harmonic-out-of-range'
  | 'harmonic-duplicated'
  | 'radius-not-positive'
  | 'self-intersecting'
  | 'degenerate-shape'
  | 'not-finite'
  | 'too-few-samples'
  | 'samples-out-of-range'
  | 'not-star-shaped'
  | 'outline-not-closed'
  | 'too-few-points'
  | 'svg-parse'
  | 'csv-parse'
  | 'invalid-argument';

/** Facts about the failure: which harmonic, which value, where on the contour. All fields optional. */
export interface ShapeErrorDetails {
  readonly family?: 'radial' | 'elliptic' | 'complex';
  /** Harmonic index (k for radial and complex descriptors, n for elliptic ones). */
  readonly harmonic?: number;
  /** Position of the offending term in the descriptor's `terms` array. */
  readonly termIndex?: number;
  /** Name of the offending field (`amplitude`, `phase`, `k`, `a`, …). */
  readonly field?: string;
  /** The offending value, as given or as computed. */
  readonly value?: number;
  /** Polar angle or contour parameter in radians, where relevant. */
  readonly angle?: number;
  /** Sample count asked for or needed. */
  readonly samples?: number;
  readonly minimum?: number;
  readonly maximum?: number;
  /** Indices of the two edges that cross, for self-intersections. */
  readonly edges?: readonly [number, number];
  /** Vertex index, for outline problems. */
  readonly vertex?: number;
  /** Line number (1-based), for CSV and SVG input. */
  readonly line?: number;
}

/**
 * The one error type raised by `lib/shape`. `code` is stable; `message` is for people and names the harmonic
 * and value involved; `details` carries the same facts as data.
 */
export class ShapeError extends Error {
  override readonly name = 'ShapeError';
  readonly code: ShapeErrorCode;
  readonly details: ShapeErrorDetails;

  constructor(code: ShapeErrorCode, message: string, details: ShapeErrorDetails = {}, options?: { cause?: unknown }) {
    super(message, options);
    this.code = code;
    this.details = details;
  }
}
