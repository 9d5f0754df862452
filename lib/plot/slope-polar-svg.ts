import { niceTicks } from './nice-ticks';
import { PLOT_STYLE } from './plot-style';
import { svgDocument } from './svg-document';
import { formatCoordinate as f, formatTick } from './svg-text';
import type { DirectionEstimate, PlotText } from './types';

const SIZE = 320;
const RADIUS = 120;
const CENTRE = SIZE / 2;
/** The radius covers intervals up to this multiple of the largest estimate. */
const MAX_EXTENT = 2;

/**
 * A polar plot of the slope at the PSE by direction: each diameter θ is drawn at θ and θ + 180° (both ends of it),
 * the estimate as a point at radius ∝ slope and its 95 % interval as a radial bar; the estimates are joined into a
 * closed outline, which is a circle for a perfectly isotropic space. Rings mark nice slope values; interval bars
 * beyond twice the largest estimate are clipped at the edge. Points carry
 * `class="estimate"` and `data-direction`, interval bars `class="interval"`.
 */
export function slopePolarSvg(estimates: readonly DirectionEstimate[], text: PlotText): string {
  const largest = Math.max(1e-12, ...estimates.map((e) => e.value).filter(Number.isFinite));
  // Intervals of near-separable data run far out; the scale follows the estimates and longer bars are clipped.
  const top = Math.min(largest * MAX_EXTENT, Math.max(largest, ...estimates.map((e) => e.interval?.[1] ?? 0).filter(Number.isFinite)));
  const ticks = niceTicks(0, top, 3).filter((t) => t > 0);
  const outer = Math.max(top, ticks[ticks.length - 1] ?? top);
  const r = (v: number) => (Math.min(outer, Math.max(0, v)) / outer) * RADIUS;
  // Screen y grows downwards: angle θ counter-clockwise from the positive x axis, as in the space's own plots.
  const at = (value: number, deg: number) => [CENTRE + r(value) * Math.cos((deg * Math.PI) / 180), CENTRE - r(value) * Math.sin((deg * Math.PI) / 180)] as const;
  const parts: string[] = [];
  for (const t of ticks) {
    parts.push(`<circle cx="${CENTRE}" cy="${CENTRE}" r="${f(r(t))}" fill="none" stroke="${PLOT_STYLE.rule}" stroke-width="0.75"/>`);
    parts.push(`<text x="${f(CENTRE + 3)}" y="${f(CENTRE - r(t) - 3)}" font-family="${PLOT_STYLE.mono}" font-size="9" fill="${PLOT_STYLE.soft}">${formatTick(t)}</text>`);
  }
  for (const deg of [0, 45, 90, 135]) {
    const [ax, ay] = at(outer, deg);
    const [bx, by] = at(outer, deg + 180);
    parts.push(`<line x1="${f(ax)}" y1="${f(ay)}" x2="${f(bx)}" y2="${f(by)}" stroke="${PLOT_STYLE.rule}" stroke-width="0.5"/>`);
  }
  const sorted = [...estimates].filter((e) => Number.isFinite(e.value)).sort((a, b) => a.directionDeg - b.directionDeg);
  const ring = [...sorted.map((e) => at(e.value, e.directionDeg)), ...sorted.map((e) => at(e.value, e.directionDeg + 180))];
  if (ring.length >= 3) parts.push(`<polygon class="outline" points="${ring.map(([x, y]) => `${f(x)},${f(y)}`).join(' ')}" fill="${PLOT_STYLE.accent}" fill-opacity="0.08" stroke="${PLOT_STYLE.accent}" stroke-width="1.25"/>`);
  for (const e of sorted) {
    for (const deg of [e.directionDeg, e.directionDeg + 180]) {
      if (e.interval) {
        const [ax, ay] = at(e.interval[0], deg);
        const [bx, by] = at(e.interval[1], deg);
        parts.push(`<line class="interval" x1="${f(ax)}" y1="${f(ay)}" x2="${f(bx)}" y2="${f(by)}" stroke="${PLOT_STYLE.points}" stroke-width="2" stroke-opacity="0.6"/>`);
      }
      const [x, y] = at(e.value, deg);
      parts.push(`<circle class="estimate" data-direction="${formatTick(e.directionDeg)}" cx="${f(x)}" cy="${f(y)}" r="3" fill="${PLOT_STYLE.points}"/>`);
    }
    const [lx, ly] = at(outer * 1.1, e.directionDeg);
    parts.push(`<text x="${f(lx)}" y="${f(ly + 3)}" text-anchor="middle" font-family="${PLOT_STYLE.mono}" font-size="9" fill="${PLOT_STYLE.ink}">${formatTick(e.directionDeg)}°</text>`);
  }
  return svgDocument(SIZE, SIZE, text, 'slopes', parts.join(''));
}
