import type { Contour } from '../shape/types';
import type { RenderFrame, ResolvedRender } from './types';

/** Digits after the decimal point of pixel coordinates: 1/1000 px, far below what any display resolves. */
const DECIMALS = 3;
/** Digits of the physical size in mm (1 µm). */
const MM_DECIMALS = 3;

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
  return /^-0\.?0*$/.test(text) ? text.slice(1) : text;
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
  const { canvasPx, canvasMm, pxPerUnit, centrePx } = frame;
  const { fill, background, style, antiAlias, transparent } = render.options;
  const size = options.units === 'pixels' ? String(canvasPx) : `${format(canvasMm, MM_DECIMALS)}mm`;
  const { x, y } = contour;
  const parts: string[] = [];
  for (let i = 0; i < x.length; i++) {
    const px = format(centrePx + pxPerUnit * (x[i] as number), DECIMALS);
    const py = format(centrePx - pxPerUnit * (y[i] as number), DECIMALS);
    parts.push(`${i === 0 ? 'M' : 'L'}${px} ${py}`);
  }
  parts.push('Z');
  const paint =
    style === 'outline'
      ? `fill="none" stroke="${fill}" stroke-width="${format(render.sizes.strokePx, DECIMALS)}" stroke-linejoin="round"`
      : `fill="${fill}"`;
  const rendering = antiAlias ? '' : ' shape-rendering="crispEdges"';
  const backdrop = transparent ? '' : `<rect width="${canvasPx}" height="${canvasPx}" fill="${background}"/>`;
  return (
    `<?xml version="1.0" encoding="UTF-8"?>\n` +
    `<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="${size}" height="${size}" viewBox="0 0 ${canvasPx} ${canvasPx}"${rendering}>` +
    `${backdrop}<path d="${parts.join('')}" ${paint}/></svg>\n`
  );
}
