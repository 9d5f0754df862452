import type { ContrastFigures, DerivedSizes } from '../render/types';
import { STIMULI_COLUMNS } from './stimuli-csv';
import { TRIAL_LIST_COLUMNS } from './trial-list-csv';
import type { PackEdition, PackManifest } from './types';

/** What README.txt is written from. */
export interface PackReadmeContext {
  readonly notice: string | null;
  readonly edition: PackEdition;
  readonly productVersion: string;
  readonly engineVersion: string;
  readonly profileName: string;
  readonly viewingDistanceCm: number;
  readonly render: PackManifest['render']['options'];
  readonly sizes: DerivedSizes;
  readonly contrast: ContrastFigures;
  readonly boundaries: readonly { readonly key: string; readonly label: string | null; readonly angleDeg: number }[];
  readonly layoutStimuli: number;
  readonly prototypes: number;
  readonly hasSequences: boolean;
}

/** Meaning and unit of every fixed column of stimuli.csv. */
const STIMULI_COLUMN_NOTES: Record<(typeof STIMULI_COLUMNS)[number], string> = {
  id: 'stimulus id: c (centre), rII-sJJ (ring, spoke), lRR-CC (lattice row, column), dII-mJJ / dII-pJJ (diameter, step), p-<boundary>-a / -b (prototype)',
  kind: 'layout (a position of the layout) or prototype (a category prototype of a boundary)',
  prototype_boundary: 'for prototypes, the boundary key; empty otherwise',
  prototype_side: 'for prototypes, the side A or B; empty otherwise',
  a: 'designed coordinate on Axis A, axis units',
  b: 'designed coordinate on Axis B, axis units',
  rho: 'distance from the centre of the space, axis units',
  angle_deg: 'polar angle, degrees in [0, 360), counter-clockwise from +a towards +b',
  area: 'enclosed area, shape units squared (exact, from the descriptor)',
  perimeter: 'outline length, shape units',
  compactness: '4·pi·area / perimeter^2, 1 for a circle',
  equal_area_diameter_deg: 'diameter of the circle of equal area as drawn, degrees of visual angle',
  max_extent_deg: 'largest distance between two outline points as drawn, degrees of visual angle',
  svg_file: 'path of the SVG file inside the pack',
  svg_sha256: 'SHA-256 of the SVG file, lowercase hex',
  png_file: 'path of the PNG file inside the pack',
  png_sha256: 'SHA-256 of the PNG file, lowercase hex',
};

const TRIAL_COLUMN_NOTES: Record<(typeof TRIAL_LIST_COLUMNS)[number], string> = {
  stimulus_id: 'stimulus id, as in stimuli.csv',
  kind: 'layout or prototype',
  png_file: 'path of the PNG, relative to the folder holding this file',
  svg_file: 'path of the SVG, relative to the folder holding this file',
};

const fixed = (value: number, digits: number): string => value.toFixed(digits);

/**
 * README.txt of a pack, plain ASCII-safe UTF-8 text with LF line ends: what the pack is, how it was drawn,
 * every file and every column with its unit, how to verify it (`sha256sum -c SHA256SUMS`), and the caution that
 * luminance and contrast figures are nominal sRGB values, not measurements.
 */
export function packReadme(context: PackReadmeContext): string {
  const { edition, render, sizes, contrast } = context;
  const lines: string[] = [];
  const push = (...more: string[]): void => {
    lines.push(...more);
  };
  if (context.notice) push(`NOTICE: ${context.notice}`, '');
  push(
    `Stimulus pack: ${edition.spaceName}, edition ${edition.number} (${edition.state.replace('_', ' ')})`,
    `Edition content hash (SHA-256): ${edition.contentHash}`,
    `Edition frozen: ${edition.createdAt}`,
    `Made with Epicycle ${context.productVersion}, shape engine ${context.engineVersion}`,
    '',
    'HOW THE STIMULI WERE DRAWN',
    `Display profile "${context.profileName}": ${fixed(sizes.pixelsPerCm, 4)} px/cm, viewing distance ${context.viewingDistanceCm} cm, ${fixed(sizes.pixelsPerDegree, 4)} px per degree at the centre of the screen.`,
    `Visual angle: theta = 2 * atan(S / 2D), S the size on the screen and D the viewing distance.`,
    `Size: the largest stimulus's ${render.sizeMeasure === 'equal-area-diameter' ? 'equal-area diameter' : 'maximum extent'} is ${render.sizeDeg} deg (${fixed(sizes.stimulusPx, 3)} px); every other stimulus keeps its size relative to it.`,
    `Canvas: ${render.canvasDeg} deg square = ${sizes.canvasPx} x ${sizes.canvasPx} px = ${fixed(sizes.canvasMm, 3)} mm; the centre of the shape space's coordinates is at the canvas centre.`,
    render.style === 'outline'
      ? `Style: outline, stroke ${render.strokeArcmin} arc-minutes (${fixed(sizes.strokePx, 3)} px), centred on the contour.`
      : 'Style: filled silhouette.',
    `Fill ${render.fill} on background ${render.background}${render.transparent ? ' (PNG background transparent)' : ''}; anti-aliasing ${render.antiAlias ? 'on' : 'off'}; ${render.samples} contour samples per outline.`,
    '',
    'CONTRAST (NOMINAL sRGB VALUES, NOT MEASURED LUMINANCE)',
    `Relative luminance: fill ${fixed(contrast.fillLuminance, 6)}, background ${fixed(contrast.backgroundLuminance, 6)} (IEC 61966-2-1 decoding, L = 0.2126 R + 0.7152 G + 0.0722 B).`,
    `Luminance ratio (L1 + 0.05) / (L2 + 0.05): ${fixed(contrast.luminanceRatio, 4)}; Weber (Lf - Lb) / Lb: ${contrast.weber === null ? 'undefined (black background)' : fixed(contrast.weber, 4)}; Michelson (Lmax - Lmin) / (Lmax + Lmin): ${contrast.michelson === null ? 'undefined' : fixed(contrast.michelson, 4)}.`,
    'These figures assume an ideal sRGB display. Real screens differ: measure with a photometer and calibrate the display for any luminance-critical work.',
    '',
    'FILES',
    `stimuli/svg/<id>.svg  one SVG per stimulus, its width and height in mm (true physical size on the profile's display), viewBox in pixels`,
    `stimuli/png/<id>.png  one PNG per stimulus, ${sizes.canvasPx} x ${sizes.canvasPx} px`,
    `manifest.json         everything above as data, per-stimulus coordinates, descriptors, metrics, categories and file hashes`,
    `manifest.schema.json  JSON Schema (draft 2020-12) that manifest.json validates against`,
    `stimuli.csv           one row per stimulus (RFC 4180, CRLF); columns below`,
    `trial-list.csv        file paths and category labels per stimulus, ready as a condition file`,
    `rdm/design.tsv        designed dissimilarity: Euclidean distance of (a, b), axis units`,
    `rdm/contour.tsv       contour dissimilarity: RMS distance of corresponding outline points after the best translation, rotation and start point, shape units`,
    `rdm/silhouette.tsv    silhouette dissimilarity: 1 - intersection / union of the filled shapes on a common 256 x 256 raster, 0 to 1`,
    ...(context.hasSequences ? ['sequences/            run orders attached to this pack'] : []),
    'SHA256SUMS            SHA-256 of every other file; check with: sha256sum -c SHA256SUMS',
    '',
    `The pack holds ${context.layoutStimuli} layout stimuli and ${context.prototypes} category prototypes. The RDMs cover the layout stimuli only, in layout order: a header row of ids, then one row per stimulus (tab-separated).`,
    '',
    'COLUMNS OF stimuli.csv',
    ...STIMULI_COLUMNS.map((c) => `${c}: ${STIMULI_COLUMN_NOTES[c]}`),
    'category_<key>: category for boundary <key>: A (the side its normal points to), B (the other side) or on (on the boundary, neither)',
    'distance_<key>: signed distance to boundary <key>, axis units, positive on side A',
    'fraction_<key>: distance_<key> divided by the extent of the space (rho max)',
    'descriptor_json: the normalised Fourier descriptor of the stimulus, as JSON (shape units, phases in radians)',
    '',
    'COLUMNS OF trial-list.csv',
    ...TRIAL_LIST_COLUMNS.map((c) => `${c}: ${TRIAL_COLUMN_NOTES[c]}`),
    'category_<key>: A, B or on, as in stimuli.csv',
    '',
    'BOUNDARIES',
    ...(context.boundaries.length === 0
      ? ['none']
      : context.boundaries.map((b) => `${b.key}${b.label ? ` (${b.label})` : ''}: diameter at ${b.angleDeg} deg counter-clockwise from +a`)),
    '',
  );
  return lines.join('\n');
}
