/**
 * A display profile: the screen a pack is drawn for. Exactly one of `widthCm` and `pixelsPerCm` gives the pixel
 * pitch (square pixels assumed); the other is null. Plain data, as stored per lab.
 */
export interface DisplayProfile {
  readonly name: string;
  /** Screen resolution, whole pixels ≥ 1. */
  readonly resolutionPx: { readonly width: number; readonly height: number };
  /** Physical width of the active screen area, cm, > 0; or null when `pixelsPerCm` is given. */
  readonly widthCm: number | null;
  /** Pixel density, px per cm, > 0; or null when `widthCm` is given. */
  readonly pixelsPerCm: number | null;
  /** Eye-to-screen distance, cm, > 0. */
  readonly viewingDistanceCm: number;
}

/** What the size in degrees measures on every stimulus. */
export type SizeMeasure = 'equal-area-diameter' | 'max-extent';

/** How a stimulus is drawn. */
export type RenderStyle = 'silhouette' | 'outline';

/** An sRGB colour as `#rrggbb` (case-insensitive) or an 8-bit grey level 0…255 (R = G = B). */
export type SrgbColour = string | number;

/**
 * How the stimuli of a pack are drawn. Sizes are degrees of visual angle at the profile's viewing distance,
 * centred on the line of sight (θ = 2·atan(S / 2D)).
 */
export interface RenderOptions {
  /** Size of the largest stimulus by `sizeMeasure`, degrees, > 0; the others keep their size relative to it. */
  readonly sizeDeg: number;
  readonly sizeMeasure: SizeMeasure;
  /** Side of the square image, degrees, ≥ the drawn stimuli. */
  readonly canvasDeg: number;
  readonly style: RenderStyle;
  /** Outline stroke width, arc-minutes, > 0; ignored (may be null) for silhouettes. */
  readonly strokeArcmin: number | null;
  readonly fill: SrgbColour;
  readonly background: SrgbColour;
  readonly antiAlias: boolean;
  /** PNG with an alpha channel and no background (the SVG then has no background rectangle either). */
  readonly transparent: boolean;
  /** Contour samples per stimulus, 64…8192 (the outline is a polygon through them). */
  readonly samples: number;
}

/** One thing wrong with a profile or options: `field` names the input (`viewingDistanceCm`, `sizeDeg`, …). */
export interface RenderIssue {
  readonly field: string;
  readonly code: RenderIssueCode;
  readonly message: string;
}

/** Stable codes of render issues; all are errors except `zero-contrast`, a warning. */
export type RenderIssueCode =
  | 'name-missing'
  | 'resolution-invalid'
  | 'pitch-missing'
  | 'pitch-ambiguous'
  | 'pitch-invalid'
  | 'distance-invalid'
  | 'size-invalid'
  | 'size-too-small'
  | 'size-too-large'
  | 'canvas-too-small'
  | 'measure-invalid'
  | 'style-invalid'
  | 'stroke-invalid'
  | 'colour-invalid'
  | 'flag-invalid'
  | 'samples-invalid'
  | 'zero-contrast';

/** Nominal sRGB contrast of fill against background (IEC 61966-2-1 decoding; WCAG 2.x relative luminance). */
export interface ContrastFigures {
  /** Relative luminance of the fill, 0…1 (white = 1), nominal. */
  readonly fillLuminance: number;
  readonly backgroundLuminance: number;
  /** (L_lighter + 0.05) / (L_darker + 0.05), 1…21 (WCAG 2.x contrast ratio). */
  readonly luminanceRatio: number;
  /** (L_fill − L_background) / L_background; null on a black background. */
  readonly weber: number | null;
  /** (L_max − L_min) / (L_max + L_min), 0…1; null when both are black. */
  readonly michelson: number | null;
}

/** Sizes that follow from a profile and options. */
export interface DerivedSizes {
  readonly pixelsPerCm: number;
  /** Pixels spanned by 1° centred on the line of sight: 2D·tan(0.5°)·px/cm. */
  readonly pixelsPerDegree: number;
  /** The largest stimulus's `sizeMeasure`, px (fractional). */
  readonly stimulusPx: number;
  /** Side of the square PNG, whole px (rounded from the canvas in degrees). */
  readonly canvasPx: number;
  /** Side of the canvas, mm (canvasPx / px per mm exactly, so SVG and PNG agree). */
  readonly canvasMm: number;
  /** Outline stroke width, px; 0 for silhouettes. */
  readonly strokePx: number;
}

/** Result of `checkRender`: errors stop a pack, warnings are shown beside it. */
export interface RenderCheck {
  readonly ok: boolean;
  readonly errors: readonly RenderIssue[];
  readonly warnings: readonly RenderIssue[];
  /** Null when the profile or options are too broken to derive sizes from. */
  readonly sizes: DerivedSizes | null;
  /** Null when a colour cannot be read. */
  readonly contrast: ContrastFigures | null;
}

/** Options after validation: colours as lowercase `#rrggbb`, the stroke null for silhouettes. */
export interface ResolvedRender {
  readonly profile: DisplayProfile;
  readonly options: RenderOptions & { readonly fill: string; readonly background: string };
  readonly sizes: DerivedSizes;
  readonly contrast: ContrastFigures;
  readonly warnings: readonly RenderIssue[];
  /** Colour layout of the PNG: grey when both colours are grey, an alpha channel when transparent. */
  readonly pngChannels: PngChannels;
}

/** Colour layout of a PNG. */
export type PngChannels = 'grey' | 'grey-alpha' | 'rgb' | 'rgba';

/**
 * Where the stimuli of one pack sit on their canvas: shape coordinates (y up) map to pixels (y down) by
 * x_px = centre + pxPerUnit·x, y_px = centre − pxPerUnit·y. One scale for every stimulus, so relative sizes and
 * positions in the space are kept.
 */
export interface RenderFrame {
  readonly canvasPx: number;
  readonly canvasMm: number;
  readonly pxPerUnit: number;
  /** Canvas centre, px (canvasPx / 2): where the shape origin is drawn. */
  readonly centrePx: number;
}

/** Size figures of one stimulus as drawn. */
export interface DrawnSize {
  /** Equal-area diameter, degrees (2√(A/π), A the polygon's area). */
  readonly equalAreaDiameterDeg: number;
  /** Largest distance between two outline points (maximum Feret diameter), degrees. */
  readonly maxExtentDeg: number;
}
