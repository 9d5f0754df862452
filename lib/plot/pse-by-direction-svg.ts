import { niceTicks } from './nice-ticks';
import { PLOT_STYLE } from './plot-style';
import { svgDocument } from './svg-document';
import { escapeXml, formatCoordinate as f, formatTick } from './svg-text';
import type { DirectionEstimate, PlotText } from './types';

const WIDTH = 420;
const HEIGHT = 240;
const MARGIN = { left: 48, right: 14, top: 14, bottom: 40 };

/**
 * The PSE of each direction with its 95 % interval, against the direction (0–180°), with the zero line (no bias)
 * drawn across. The y range covers every estimate and interval and zero. Points carry `class="estimate"` and
 * `data-direction`, interval bars `class="interval"`.
 */
export function pseByDirectionSvg(estimates: readonly DirectionEstimate[], text: PlotText & { readonly yLabel: string }): string {
  const values = estimates.flatMap((e) => [e.value, ...(e.interval ?? [])]).filter(Number.isFinite);
  let lo = Math.min(0, ...values);
  let hi = Math.max(0, ...values);
  if (!(hi > lo)) {
    lo = -1;
    hi = 1;
  }
  const pad = 0.08 * (hi - lo);
  lo -= pad;
  hi += pad;
  const w = WIDTH - MARGIN.left - MARGIN.right;
  const h = HEIGHT - MARGIN.top - MARGIN.bottom;
  const sx = (deg: number) => MARGIN.left + (deg / 180) * w;
  const sy = (v: number) => MARGIN.top + ((hi - v) / (hi - lo)) * h;
  const parts: string[] = [`<rect x="${MARGIN.left}" y="${MARGIN.top}" width="${w}" height="${h}" fill="none" stroke="${PLOT_STYLE.rule}" stroke-width="0.75"/>`];
  for (const t of niceTicks(lo, hi, 5)) {
    parts.push(`<line x1="${MARGIN.left - 3}" x2="${MARGIN.left}" y1="${f(sy(t))}" y2="${f(sy(t))}" stroke="${PLOT_STYLE.ruleStrong}"/>`);
    parts.push(`<text x="${MARGIN.left - 5}" y="${f(sy(t) + 3)}" text-anchor="end" font-family="${PLOT_STYLE.mono}" font-size="9" fill="${PLOT_STYLE.soft}">${formatTick(t)}</text>`);
  }
  for (const deg of [0, 45, 90, 135, 180]) {
    parts.push(`<text x="${f(sx(deg))}" y="${MARGIN.top + h + 13}" text-anchor="middle" font-family="${PLOT_STYLE.mono}" font-size="9" fill="${PLOT_STYLE.soft}">${deg}°</text>`);
  }
  parts.push(`<line class="zero" x1="${MARGIN.left}" x2="${MARGIN.left + w}" y1="${f(sy(0))}" y2="${f(sy(0))}" stroke="${PLOT_STYLE.ruleStrong}" stroke-dasharray="3 3"/>`);
  parts.push(`<text x="${MARGIN.left + w / 2}" y="${HEIGHT - 6}" text-anchor="middle" font-size="10" fill="${PLOT_STYLE.soft}">direction</text>`);
  parts.push(`<text transform="translate(12 ${MARGIN.top + h / 2}) rotate(-90)" text-anchor="middle" font-size="10" fill="${PLOT_STYLE.soft}">${escapeXml(text.yLabel)}</text>`);
  for (const e of estimates) {
    if (!Number.isFinite(e.value)) continue;
    const x = sx(e.directionDeg);
    if (e.interval) {
      parts.push(`<line class="interval" x1="${f(x)}" x2="${f(x)}" y1="${f(sy(e.interval[0]))}" y2="${f(sy(e.interval[1]))}" stroke="${PLOT_STYLE.points}" stroke-width="2" stroke-opacity="0.6"/>`);
    }
    parts.push(`<circle class="estimate" data-direction="${formatTick(e.directionDeg)}" cx="${f(x)}" cy="${f(sy(e.value))}" r="3.5" fill="${PLOT_STYLE.points}"/>`);
  }
  return svgDocument(WIDTH, HEIGHT, text, 'pse', parts.join(''));
}
