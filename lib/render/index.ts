// lib/render — display profiles, visual angle, nominal sRGB contrast and SVG documents of stimuli. Pure and
// deterministic; the browser uses it for live previews. PNG rasterisation (sharp, Node only) is in
// `render-png.ts`, imported by path on the server, never through this index.

export type {
  ContrastFigures,
  DerivedSizes,
  DisplayProfile,
  DrawnSize,
  PngChannels,
  RenderCheck,
  RenderFrame,
  RenderIssue,
  RenderIssueCode,
  RenderOptions,
  RenderStyle,
  ResolvedRender,
  SizeMeasure,
  SrgbColour,
} from './types';
export { RenderError, type RenderErrorCode } from './render-error';
export { RENDER_LIMITS } from './render-limits';

// Visual angle and displays
export { visualAngle } from './visual-angle';
export { sizeForVisualAngle } from './size-for-visual-angle';
export { pixelsPerCm } from './pixels-per-cm';
export { pixelsPerDegree } from './pixels-per-degree';
export { degreesToPixels } from './degrees-to-pixels';
export { pixelsToDegrees } from './pixels-to-degrees';

// Colour
export { parseSrgbColour, parseSrgbColourOrThrow, type ParsedColour } from './parse-srgb-colour';
export { srgbToLinear } from './srgb-to-linear';
export { relativeLuminance } from './relative-luminance';
export { contrastFigures } from './contrast-figures';

// Validation
export { checkDisplayProfile } from './check-display-profile';
export { checkRender } from './check-render';
export { resolveRender } from './resolve-render';

// Drawing
export { contourMaxExtent } from './contour-max-extent';
export { stimulusMeasure } from './stimulus-measure';
export { frameStimuli } from './frame-stimuli';
export { drawnSize } from './drawn-size';
export { stimulusSvg, stimulusSvgPair, type StimulusSvgOptions } from './stimulus-svg';
export { escapeXml } from './escape-xml';
export { rdmHeatmapsSvg, heatmapColour, HEATMAP_STEPS, type HeatmapPanel } from './rdm-heatmaps-svg';
export { mdsMapSvg, type MdsMapPoint } from './mds-map-svg';
