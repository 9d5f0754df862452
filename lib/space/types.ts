import type { Point, ShapeDescriptor } from '../shape/types';

/**
 * The change one unit of axis coordinate makes to one descriptor entry. `field` names the entry: radial
 * `amplitude`, `phase` (radians) or `baseRadius` (`harmonic` ignored); elliptic `a`, `b`, `c`, `d`; complex
 * `re`, `im`. A harmonic the seed lacks is added (all zero) before the change. Several changes to the same
 * entry add up.
 */
export interface AxisChange {
  readonly harmonic: number;
  readonly field: 'amplitude' | 'phase' | 'baseRadius' | 'a' | 'b' | 'c' | 'd' | 're' | 'im';
  readonly delta: number;
}

/** One axis of a shape space: a direction in descriptor space, as a list of entry changes per unit. */
export interface SpaceAxis {
  readonly label: string;
  readonly changes: readonly AxisChange[];
}

/**
 * Where the stimuli sit in the (a, b) plane of the space, ρmax being the definition's `extent`.
 * - **Rings**: `rings` rings at ρ = ρmax·i/rings (i = 1…rings) × `spokes` spokes at angle 2πs/spokes, plus the
 *   centre: rings·spokes + 1 stimuli.
 * - **Lattice**: `size` × `size` points evenly over [−ρmax, ρmax]² (corners included): size² stimuli.
 * - **Diameters**: `directions` diameters at angle πd/directions; `steps` evenly spaced stimuli along each, from
 *   −ρmax to ρmax inclusive. `steps` is odd, so the centre lies on every diameter; it is shared, counted once:
 *   directions·(steps − 1) + 1 stimuli.
 */
export type SpaceLayout =
  | { readonly kind: 'rings'; readonly rings: number; readonly spokes: number }
  | { readonly kind: 'lattice'; readonly size: number }
  | { readonly kind: 'diameters'; readonly directions: number; readonly steps: number };

/** Normalisation of every stimulus, through `lib/shape` (scale and centroid only; never rotation). */
export interface SpaceNormalization {
  readonly scale: 'equal-area-radius' | 'area' | 'max-radius' | 'perimeter' | 'none';
  /** Move each stimulus's area centroid to the origin. */
  readonly centroid: boolean;
}

/** One knot of a radius re-mapping: designed ρ → ρ actually used for the descriptor. */
export type EqualizationKnot = readonly [rho: number, rhoMapped: number];

/**
 * A monotone re-mapping of the radius per direction (angle in radians, counter-clockwise from Axis A), as
 * knots of a piecewise-linear function through (0, 0); interpolated linearly between directions by angle and
 * extrapolated beyond the last knot along the last segment. Built by `equalizeSpace`.
 */
export interface Equalization {
  readonly directions: readonly { readonly angle: number; readonly knots: readonly EqualizationKnot[] }[];
}

/**
 * A 2D shape space: stimulus = normalise(seed + a·axisA + b·axisB), with (a, b) from the layout, ρ re-mapped
 * by the equalisation (if any) first.
 */
export interface SpaceDefinition {
  readonly seed: ShapeDescriptor;
  readonly axes: readonly [SpaceAxis, SpaceAxis];
  /** ρmax > 0, in axis units. */
  readonly extent: number;
  readonly layout: SpaceLayout;
  readonly normalization: SpaceNormalization;
  readonly equalization?: Equalization | null;
}

/** Coordinates in the space's (a, b) plane, in axis units. */
export interface SpacePosition {
  readonly a: number;
  readonly b: number;
}

/** Polar coordinates: ρ ≥ 0 in axis units, angle in radians in [0, 2π), counter-clockwise from +a towards +b. */
export interface PolarPosition {
  readonly rho: number;
  readonly angle: number;
}

/** A stimulus's place in its layout; `stimulusId` turns it into the id. */
export type LayoutPosition =
  | { readonly kind: 'centre' }
  | { readonly kind: 'ring'; readonly ring: number; readonly spoke: number }
  | { readonly kind: 'lattice'; readonly row: number; readonly column: number }
  | { readonly kind: 'diameter'; readonly direction: number; readonly step: number };

/** One point of a layout, before any shape is attached. */
export interface LayoutPoint {
  readonly layoutPosition: LayoutPosition;
  readonly position: SpacePosition;
  readonly polar: PolarPosition;
}

/** A normalised stimulus descriptor and the offset its contour is drawn with (see `Stimulus.contourOffset`). */
export interface NormalizedStimulus {
  readonly descriptor: ShapeDescriptor;
  readonly contourOffset: Point;
}

/** A ray from the centre of a layout, as indices into the stimuli (see `layoutRays`). */
export interface LayoutRay {
  readonly label: string;
  /** Radians in [0, 2π). */
  readonly angle: number;
  /** Index of the centre stimulus, or null when the centre is not a stimulus (an even lattice). */
  readonly centre: number | null;
  /** Indices of the stimuli on the ray, from the centre outward. */
  readonly members: readonly number[];
}

/** A line of evenly spaced stimuli through a layout, as indices into the stimuli, in order along it. */
export interface LayoutLine {
  readonly label: string;
  readonly members: readonly number[];
}

/** The descriptor at (a, b): seed + a·axisA + b·axisB (see `compileAxes`). */
export type AxisMap = (a: number, b: number) => ShapeDescriptor;

/** The designed ρ ↦ ρ′ of an equalisation, at one polar angle (see `equalizationMap`). */
export type RadiusMap = (rho: number, angle: number) => number;

/** Mean, population standard deviation and their ratio (see `coefficientOfVariation`). */
export interface Spread {
  readonly mean: number;
  readonly sd: number;
  /** SD / |mean|; null when the mean is 0 or there are no values. */
  readonly cv: number | null;
}

/** One stimulus of a generated space. */
export interface Stimulus {
  /** The layout position as text (see `stimulusId`); stable across re-generation and definition changes. */
  readonly id: string;
  /** Designed coordinates (before equalisation). */
  readonly position: SpacePosition;
  readonly polar: PolarPosition;
  readonly layoutPosition: LayoutPosition;
  /** seed + a′·axisA + b′·axisB (a′, b′ after equalisation), normalised. */
  readonly descriptor: ShapeDescriptor;
  /**
   * Added to every synthesised point by `stimulusContour`: radial descriptors cannot carry a translation, so
   * centroid normalisation of a radial stimulus is kept here (minus its area centroid). [0, 0] otherwise.
   */
  readonly contourOffset: Point;
}

/** One thing wrong with a definition or one of its stimuli. */
export interface SpaceFailure {
  /** A stimulus id, or the part of the definition at fault: `seed`, `axes`, `extent`, `layout`, `normalization`, `equalization`. */
  readonly id: string;
  /** Stable machine-readable code: a `ShapeError` code for stimuli, a `SpaceFailureCode` otherwise. */
  readonly code: string;
  /** Plain-language reason, the engine's own message for stimuli. */
  readonly reason: string;
}

/** Codes of definition-level failures. */
export type SpaceFailureCode =
  | 'no-stimuli'
  | 'too-many-stimuli'
  | 'layout-invalid'
  | 'extent-invalid'
  | 'axis-zero'
  | 'axes-identical'
  | 'axes-parallel'
  | 'axis-invalid'
  | 'normalization-invalid'
  | 'equalization-invalid'
  | 'seed-invalid';

/** Result of `checkSpace`. */
export interface SpaceCheck {
  readonly ok: boolean;
  readonly failures: readonly SpaceFailure[];
  /** Number of stimuli the layout asks for (0 when the layout is malformed). */
  readonly count: number;
}

/** Area, perimeter and compactness of a stimulus. */
export interface StimulusMetrics {
  /** Enclosed area, squared shape units (exact, from the coefficients). */
  readonly area: number;
  /** Arc length, shape units. */
  readonly perimeter: number;
  /** 4πA/P², in (0, 1]; 1 for a circle. */
  readonly compactness: number;
}

/**
 * A representational dissimilarity matrix: `size` × `size` values, row-major, symmetric, zero diagonal.
 * Plain data (no methods), so it survives `postMessage` from a web worker.
 */
export interface Rdm {
  readonly size: number;
  readonly values: Float64Array;
}

/**
 * Rows `from` … `to − 1` of an RDM's upper triangle: the entries (i, j), j > i, row by row (row i holds
 * size − 1 − i values), so blocks can be computed apart — in web or worker threads — and joined by
 * `rdmFromRows`. Plain data, like `Rdm`.
 */
export interface RdmRows {
  readonly size: number;
  readonly from: number;
  readonly to: number;
  readonly values: Float64Array;
}

/**
 * The harmonics of a closed curve z(t) = Σ c_k e^{ikt} without c_0 (translation), kept where |c_k| is above
 * rounding noise, sorted by k. `energy` = Σ|c_k|², the mean squared distance of the curve from its mean point.
 */
export interface ContourSpectrum {
  readonly k: Int32Array;
  readonly re: Float64Array;
  readonly im: Float64Array;
  readonly energy: number;
}

/** The thresholds of the confound audit; see `DEFAULT_AUDIT_THRESHOLDS` for the defaults and reasons. */
export interface AuditThresholds {
  /** Largest acceptable coefficient of variation of area across stimuli. */
  readonly areaCv: number;
  readonly perimeterCv: number;
  readonly compactnessCv: number;
  /** Smallest acceptable Spearman ρ between the designed and contour RDMs. */
  readonly designContour: number;
  readonly designSilhouette: number;
  readonly contourSilhouette: number;
  /** Largest acceptable CV of neighbour-to-neighbour contour distance along a spoke, diameter or lattice line. */
  readonly spacingCv: number;
  /** Largest acceptable anisotropy index (fastest / slowest growth rate of contour distance). */
  readonly anisotropy: number;
}

/** One audit measure with its threshold and a plain-language verdict. */
export interface AuditMeasure {
  /** The measured value; null when it cannot be computed (too few stimuli, constant data). */
  readonly value: number | null;
  readonly threshold: number;
  readonly flagged: boolean;
  readonly message: string;
}

/** Spread of one metric across the stimuli (population SD, CV = SD / mean). */
export interface SpreadMeasure extends AuditMeasure {
  readonly mean: number;
  readonly sd: number;
}

/** Spacing along one line of the layout: contour distances between neighbours. */
export interface LineSpacing {
  readonly label: string;
  /** Stimulus ids in order along the line. */
  readonly ids: readonly string[];
  readonly gaps: readonly number[];
  /** CV of `gaps`; null with fewer than two gaps. */
  readonly cv: number | null;
}

/** Growth of contour distance from the centre along one ray. */
export interface RayGrowth {
  readonly label: string;
  /** Direction, radians in [0, 2π). */
  readonly angle: number;
  readonly ids: readonly string[];
  /** Designed ρ of each stimulus on the ray. */
  readonly rho: readonly number[];
  /** Contour distance of each from the centre shape. */
  readonly distance: readonly number[];
  /** Least-squares slope through the origin of distance on ρ: Σρd / Σρ². */
  readonly rate: number;
}

/** Result of `auditSpace`. */
export interface ConfoundAudit {
  readonly count: number;
  readonly ids: readonly string[];
  readonly samples: number;
  readonly resolution: number;
  readonly thresholds: AuditThresholds;
  readonly area: SpreadMeasure;
  readonly perimeter: SpreadMeasure;
  readonly compactness: SpreadMeasure;
  readonly rdms: { readonly design: Rdm; readonly contour: Rdm; readonly silhouette: Rdm };
  readonly correlations: {
    readonly designContour: AuditMeasure;
    readonly designSilhouette: AuditMeasure;
    readonly contourSilhouette: AuditMeasure;
  };
  readonly spacing: AuditMeasure & { readonly lines: readonly LineSpacing[] };
  readonly anisotropy: AuditMeasure & { readonly rays: readonly RayGrowth[] };
  /** The messages of the measures that were flagged, in panel order. */
  readonly flags: readonly { readonly measure: string; readonly message: string }[];
}
