/** A point in the plane, y pointing up (mathematical orientation). */
export type Point = readonly [x: number, y: number];

/**
 * A closed polygon as two coordinate arrays of equal length. The closing edge from the last vertex back to the
 * first is implied: the first vertex is not repeated at the end. Functions in `lib/shape` never write into a
 * contour they are given.
 */
export interface Contour {
  readonly x: Float64Array;
  readonly y: Float64Array;
}

/** The three harmonic families of Epicycle. */
export type DescriptorFamily = 'radial' | 'elliptic' | 'complex';

/** One radial-frequency component: A_k·cos(kθ + φ_k). `k` is an integer 1…128, `phase` in radians. */
export interface RadialTerm {
  readonly k: number;
  readonly amplitude: number;
  readonly phase: number;
}

/**
 * Radial harmonics (radial-frequency patterns, Wilkinson, Wilson & Habak 1998):
 * r(θ) = r0·(1 + Σ A_k cos(kθ + φ_k)), drawn about the origin with θ ∈ [0, 2π) as the contour parameter.
 */
export interface RadialDescriptor {
  readonly family: 'radial';
  /** r0, in shape units, > 0. */
  readonly baseRadius: number;
  readonly terms: readonly RadialTerm[];
}

/** One elliptic harmonic n ≥ 1: x += a cos nt + b sin nt, y += c cos nt + d sin nt. */
export interface EllipticTerm {
  readonly n: number;
  readonly a: number;
  readonly b: number;
  readonly c: number;
  readonly d: number;
}

/**
 * Elliptic harmonics (Kuhl & Giardina 1982): x(t) = A0 + Σ [a_n cos nt + b_n sin nt],
 * y(t) = C0 + Σ [c_n cos nt + d_n sin nt], t ∈ [0, 2π).
 */
export interface EllipticDescriptor {
  readonly family: 'elliptic';
  /** [A0, C0], in shape units. */
  readonly center: Point;
  readonly terms: readonly EllipticTerm[];
}

/** One complex harmonic: c_k = re + i·im, k an integer in −128…128 (k = 0 is the centre). */
export interface ComplexTerm {
  readonly k: number;
  readonly re: number;
  readonly im: number;
}

/** Complex harmonics: z(t) = x + iy = Σ_{k=−K..K} c_k e^{ikt}, t ∈ [0, 2π). */
export interface ComplexDescriptor {
  readonly family: 'complex';
  readonly terms: readonly ComplexTerm[];
}

export type ShapeDescriptor = RadialDescriptor | EllipticDescriptor | ComplexDescriptor;

/**
 * How samples are computed. `fft`: one inverse FFT (N a power of two, 64…8192). `direct`: a sum over the
 * non-zero harmonics with precomputed cos/sin tables (any N). `exact`: Math.cos/Math.sin for every term and
 * sample, for checks. `auto` picks the cheaper of `direct` and `fft`.
 */
export type SynthesisMethod = 'auto' | 'fft' | 'direct' | 'exact';

/** Area, centroid and central area moments of a region, ∫∫ x^p y^q dA about the centroid. */
export interface ShapeMoments {
  /** Signed area: positive for a counter-clockwise boundary. */
  readonly area: number;
  readonly centroid: Point;
  readonly xx: number;
  readonly xy: number;
  readonly yy: number;
  readonly xxx: number;
  readonly xxy: number;
  readonly xyy: number;
  readonly yyy: number;
}

/** Scale normalisations. */
export type ScaleNormalization = 'area' | 'equal-area-radius' | 'max-radius' | 'perimeter' | 'none';

/** Orientation rules; see `normalize-complex-harmonics.ts` for the conventions. */
export type OrientationRule = 'first-harmonic' | 'principal-axis' | 'dominant-harmonic' | 'none';

export interface NormalizeOptions {
  /** Default `equal-area-radius`. */
  readonly scale?: ScaleNormalization;
  /** Default `first-harmonic` for elliptic and complex descriptors, `principal-axis` for contours. */
  readonly orientation?: OrientationRule;
}

export interface RadialNormalizeOptions {
  /** Default `equal-area-radius`. */
  readonly scale?: ScaleNormalization;
  /** Default `dominant-harmonic`. `first-harmonic` does not apply to the radial family. */
  readonly orientation?: Exclude<OrientationRule, 'first-harmonic'>;
}

/** Reconstruction error of a fit, in units of the outline's equal-area radius √(|A|/π). */
export interface ReconstructionError {
  readonly mean: number;
  readonly max: number;
}

export interface Circle {
  readonly center: Point;
  readonly radius: number;
}

/**
 * A square binary raster, row-major, 32 pixels per word, bit j of word w in a row being pixel 32w + j.
 * Row 0 is the top row (largest y).
 */
export interface Bitmask {
  readonly resolution: number;
  readonly wordsPerRow: number;
  readonly bits: Uint32Array;
}

/** The square region of the plane a bitmask covers. */
export interface RasterExtent {
  readonly minX: number;
  readonly minY: number;
  /** Side length, > 0. */
  readonly size: number;
}

export type ShapeDistanceMetric = 'corresponding-points' | 'procrustes' | 'silhouette';

/** The element type of a readonly array type. */
export type ElementOf<T extends readonly unknown[]> = T[number];
