import type { Contour } from '../shape/types';
import type { RenderFrame, ResolvedRender } from './types';

/** Digits after the decimal point of pixel coordinates: 1/1000 px, far below what any display resolves. */
const DECIMALS = 3;
/** Digits of the physical size in mm (1 µm). */
const MM_DECIMALS = 3;
const MINUS = 0x2d;

/** Options of `stimulusSvg`. */
export interface StimulusSvgOptions {
  /**
   * `physical` (default): width and height in mm, so the file prints and places at its true size; `pixels`: in
   * px, for rasterising at the frame's canvas size. The viewBox (in pixels) and the drawing are the same.
   */
  readonly units?: 'physical' | 'pixels';
}

function format(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  // A negative value that rounds to zero prints as 0, not -0.000.
  return text.charCodeAt(0) === MINUS && /^-0\.?0*$/.test(text) ? text.slice(1) : text;
}

/** The path data of an outline mapped by the frame (y flipped), `M x y L x y … Z`, in pixels. */
function pathData(contour: Contour, frame: RenderFrame): string {
  const { pxPerUnit, centrePx } = frame;
  const { x, y } = contour;
  const parts: string[] = [];
  for (let i = 0; i < x.length; i++) {
    const px = format(centrePx + pxPerUnit * (x[i] as number), DECIMALS);
    const py = format(centrePx - pxPerUnit * (y[i] as number), DECIMALS);
    parts.push(`${i === 0 ? 'M' : 'L'}${px} ${py}`);
  }
  parts.push('Z');
  return parts.join('');
}

/** The document around a path's data, in the given units. */
function svgDocument(path: string, frame: RenderFrame, render: ResolvedRender, units: 'physical' | 'pixels'): string {
  const { canvasPx, canvasMm } = frame;
  const { fill, background, style, antiAlias, transparent } = render.options;
  const size = units === 'pixels' ? String(canvasPx) : `${format(canvasMm, MM_DECIMALS)}mm`;
  const paint =
    style === 'outline'
      ? `fill="none" stroke="${fill}" stroke-width="${format(render.sizes.strokePx, DECIMALS)}" stroke-linejoin="round"`
      : `fill="${fill}"`;
  const rendering = antiAlias ? '' : ' shape-rendering="crispEdges"';
  const backdrop = transparent ? '' : `<rect width="${canvasPx}" height="${canvasPx}" fill="${background}"/>`;
  return (
    `<?xml version="1.0" encoding="UTF-8"?>\n` +
    `<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="${size}" height="${size}" viewBox="0 0 ${canvasPx} ${canvasPx}"${rendering}>` +
    `${backdrop}<path d="${path}" ${paint}/></svg>\n`
  );
}

/**
 * A standalone SVG 1.1 document of one stimulus: a square canvas `frame.canvasPx` across (viewBox in pixels;
 * width and height in mm or px), the background as a full rectangle unless transparent, and the outline as a
 * polygon path through the contour's vertices mapped by the frame (y flipped: shape y up, SVG y down). A
 * silhouette is filled (non-zero rule); an outline is stroked `sizes.strokePx` wide with round joins, centred
 * on the contour. `shape-rendering="crispEdges"` when anti-aliasing is off. Fixed decimals, so the same input
 * gives the same bytes.
 */
export function stimulusSvg(contour: Contour, frame: RenderFrame, render: ResolvedRender, options: StimulusSvgOptions = {}): string {
  return svgDocument(pathData(contour, frame), frame, render, options.units ?? 'physical');
}

/**
 * Both documents of a stimulus — `physical` (mm) and `pixels` (for rasterising) — from one pass over the
 * outline: byte for byte `stimulusSvg(…)` and `stimulusSvg(…, { units: 'pixels' })`.
 */
export function stimulusSvgPair(contour: Contour, frame: RenderFrame, render: ResolvedRender): { readonly physical: string; readonly pixels: string } {
  const path = pathData(contour, frame);
  return { physical: svgDocument(path, frame, render, 'physical'), pixels: svgDocument(path, frame, render, 'pixels') };
}
