import { evaluatePsychometric } from '@/lib/stats';
import { niceTicks } from './nice-ticks';
import { PLOT_STYLE } from './plot-style';
import { svgDocument } from './svg-document';
import { escapeXml, formatCoordinate as f, formatTick } from './svg-text';
import type { CurvePanel, PlotText } from './types';

const PANEL_WIDTH = 200;
const PANEL_HEIGHT = 160;
const MARGIN = { left: 38, right: 10, top: 22, bottom: 30 };
const COLUMNS = 4;
/** Samples along each curve: smooth at this panel size. */
const CURVE_SAMPLES = 96;
/** Point radii in user units: area grows with the trial count n. */
const MIN_RADIUS = 2;
const MAX_RADIUS = 7;

function panelSvg(panel: CurvePanel, xRange: readonly [number, number], maxN: number, xLabel: string): string {
  const w = PANEL_WIDTH - MARGIN.left - MARGIN.right;
  const h = PANEL_HEIGHT - MARGIN.top - MARGIN.bottom;
  const [x0, x1] = xRange;
  const sx = (x: number) => MARGIN.left + ((x - x0) / (x1 - x0)) * w;
  const sy = (p: number) => MARGIN.top + (1 - p) * h;
  const parts: string[] = [];
  parts.push(`<text x="${MARGIN.left}" y="14" font-weight="600" fill="${PLOT_STYLE.ink}">${formatTick(panel.directionDeg)}°</text>`);
  parts.push(`<rect x="${MARGIN.left}" y="${MARGIN.top}" width="${w}" height="${h}" fill="none" stroke="${PLOT_STYLE.rule}" stroke-width="0.75"/>`);
  parts.push(`<line x1="${MARGIN.left}" x2="${MARGIN.left + w}" y1="${f(sy(0.5))}" y2="${f(sy(0.5))}" stroke="${PLOT_STYLE.ruleStrong}" stroke-dasharray="3 3" stroke-width="0.75"/>`);
  for (const p of [0, 0.5, 1]) {
    parts.push(`<text x="${MARGIN.left - 4}" y="${f(sy(p) + 3.5)}" text-anchor="end" font-family="${PLOT_STYLE.mono}" font-size="9" fill="${PLOT_STYLE.soft}">${formatTick(p)}</text>`);
  }
  for (const t of niceTicks(x0, x1, 4)) {
    parts.push(`<line x1="${f(sx(t))}" x2="${f(sx(t))}" y1="${MARGIN.top + h}" y2="${MARGIN.top + h + 3}" stroke="${PLOT_STYLE.ruleStrong}"/>`);
    parts.push(`<text x="${f(sx(t))}" y="${MARGIN.top + h + 13}" text-anchor="middle" font-family="${PLOT_STYLE.mono}" font-size="9" fill="${PLOT_STYLE.soft}">${formatTick(t)}</text>`);
  }
  parts.push(`<text x="${MARGIN.left + w / 2}" y="${PANEL_HEIGHT - 3}" text-anchor="middle" font-size="9" fill="${PLOT_STYLE.soft}">${xLabel}</text>`);
  if (panel.curve) {
    const c = panel.curve;
    const d = Array.from({ length: CURVE_SAMPLES + 1 }, (_, i) => {
      const x = x0 + ((x1 - x0) * i) / CURVE_SAMPLES;
      return `${i === 0 ? 'M' : 'L'}${f(sx(x))} ${f(sy(evaluatePsychometric(c.link, c, x)))}`;
    }).join(' ');
    parts.push(`<path class="curve" data-curve="${formatTick(panel.directionDeg)}" d="${d}" fill="none" stroke="${PLOT_STYLE.accent}" stroke-width="1.75"/>`);
    if (c.threshold >= x0 && c.threshold <= x1) {
      parts.push(`<line class="pse" x1="${f(sx(c.threshold))}" x2="${f(sx(c.threshold))}" y1="${f(sy(0.5))}" y2="${MARGIN.top + h}" stroke="${PLOT_STYLE.accent}" stroke-width="0.75"/>`);
    }
  } else {
    parts.push(`<text x="${MARGIN.left + w / 2}" y="${MARGIN.top + 14}" text-anchor="middle" font-size="9" fill="${PLOT_STYLE.soft}">no fit</text>`);
  }
  for (const p of panel.points) {
    if (p.n <= 0) continue;
    const r = MIN_RADIUS + (MAX_RADIUS - MIN_RADIUS) * Math.sqrt(p.n / maxN);
    parts.push(`<circle class="point" data-n="${p.n}" cx="${f(sx(p.x))}" cy="${f(sy(p.k / p.n))}" r="${f(r)}" fill="${PLOT_STYLE.points}" fill-opacity="0.55" stroke="${PLOT_STYLE.points}" stroke-width="0.75"/>`);
  }
  return parts.join('');
}

/**
 * The psychometric curves of a study as one SVG: a small panel per direction with the proportion of "anchor B"
 * answers at each level (point area proportional to the trial count n), the fitted curve (sampled densely over
 * `xRange`), the 0.5 line and the PSE. Panels run left to right, four to a row, in the order given. Curves carry
 * `class="curve"` and `data-curve` (the direction), points `class="point"` and `data-n`.
 */
export function psychometricCurvesSvg(panels: readonly CurvePanel[], xRange: readonly [number, number], text: PlotText & { readonly xLabel: string }): string {
  const columns = Math.max(1, Math.min(COLUMNS, panels.length));
  const rows = Math.max(1, Math.ceil(panels.length / COLUMNS));
  const maxN = Math.max(1, ...panels.flatMap((p) => p.points.map((q) => q.n)));
  const range: readonly [number, number] = xRange[1] > xRange[0] ? xRange : [xRange[0] - 1, xRange[0] + 1];
  const xLabel = escapeXml(text.xLabel);
  const body = panels
    .map((panel, i) => `<g class="panel" data-direction="${formatTick(panel.directionDeg)}" transform="translate(${(i % COLUMNS) * PANEL_WIDTH} ${Math.floor(i / COLUMNS) * PANEL_HEIGHT})">${panelSvg(panel, range, maxN, xLabel)}</g>`)
    .join('');
  return svgDocument(columns * PANEL_WIDTH, rows * PANEL_HEIGHT, text, 'curves', body);
}
