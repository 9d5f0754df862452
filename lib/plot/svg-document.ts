import { PLOT_STYLE } from './plot-style';
import { escapeXml } from './svg-text';
import type { PlotText } from './types';

/**
 * A standalone SVG document (SVG 1.1, with its namespace, so it opens on its own or inline in HTML) of `width` ×
 * `height` user units on a paper background, with a <title> and <desc> for assistive technology (role="img").
 * `body` is SVG markup built by the plot functions, with every text already escaped.
 */
export function svgDocument(width: number, height: number, text: PlotText, kind: string, body: string): string {
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img" aria-labelledby="${kind}-title ${kind}-desc" data-plot="${kind}" font-family="${escapeXml(PLOT_STYLE.font)}" font-size="11">` +
    `<title id="${kind}-title">${escapeXml(text.title)}</title><desc id="${kind}-desc">${escapeXml(text.description)}</desc>` +
    `<rect width="${width}" height="${height}" fill="${PLOT_STYLE.paper}"/>` +
    body +
    '</svg>'
  );
}
