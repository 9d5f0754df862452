import { escapeXml } from './escape-xml';

/** One stimulus of the map: its id, its designed (a, b) and where the perceptual map put it (aligned to the design). */
export interface MdsMapPoint {
  readonly id: string;
  readonly design: readonly [number, number];
  readonly recovered: readonly [number, number];
}

const SIZE = 360;
const MARGIN = 28;
/** Okabe & Ito blue for the design, vermilion for the recovered positions (colour-blind safe). */
const DESIGN = '#0072B2';
const RECOVERED = '#D55E00';

/**
 * The MDS map as an SVG document: each design position (blue ring) joined by a line to its recovered position
 * (vermilion dot), in the design's (a, b) coordinates with equal aspect (so shapes of the layout are not
 * distorted), +a to the right and +b up, with axis lines through the origin and a legend. Each point carries its
 * stimulus id as a `<title>`.
 */
export function mdsMapSvg(points: readonly MdsMapPoint[], title: string): string {
  let extent = 0;
  for (const p of points) for (const v of [...p.design, ...p.recovered]) extent = Math.max(extent, Math.abs(v));
  if (!(extent > 0)) extent = 1;
  const half = SIZE / 2 - MARGIN;
  const x = (v: number) => fmt(SIZE / 2 + (v / extent) * half);
  const y = (v: number) => fmt(SIZE / 2 - (v / extent) * half);
  const parts: string[] = [
    `<line x1="${MARGIN / 2}" y1="${SIZE / 2}" x2="${SIZE - MARGIN / 2}" y2="${SIZE / 2}" stroke="#D9D4C7" stroke-width="1"/>`,
    `<line x1="${SIZE / 2}" y1="${MARGIN / 2}" x2="${SIZE / 2}" y2="${SIZE - MARGIN / 2}" stroke="#D9D4C7" stroke-width="1"/>`,
    `<text x="${SIZE - MARGIN / 2}" y="${SIZE / 2 - 4}" text-anchor="end" font-size="10" fill="#5B5850">Axis A</text>`,
    `<text x="${SIZE / 2 + 4}" y="${MARGIN / 2 + 8}" font-size="10" fill="#5B5850">Axis B</text>`,
  ];
  for (const p of points) {
    parts.push(`<line x1="${x(p.design[0])}" y1="${y(p.design[1])}" x2="${x(p.recovered[0])}" y2="${y(p.recovered[1])}" stroke="#8C877C" stroke-width="1"/>`);
  }
  for (const p of points) {
    const id = escapeXml(p.id);
    parts.push(`<circle cx="${x(p.design[0])}" cy="${y(p.design[1])}" r="4" fill="none" stroke="${DESIGN}" stroke-width="1.5"><title>${id}: designed</title></circle>`);
    parts.push(`<circle cx="${x(p.recovered[0])}" cy="${y(p.recovered[1])}" r="3" fill="${RECOVERED}"><title>${id}: recovered</title></circle>`);
  }
  const ly = SIZE + 14;
  parts.push(
    `<g data-part="legend" font-size="10" fill="#2B2A28"><circle cx="8" cy="${ly}" r="4" fill="none" stroke="${DESIGN}" stroke-width="1.5"/><text x="18" y="${ly + 3}">designed position</text>` +
      `<circle cx="128" cy="${ly}" r="3" fill="${RECOVERED}"/><text x="138" y="${ly + 3}">recovered (MDS after Procrustes)</text></g>`,
  );
  const height = SIZE + 26;
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${SIZE} ${height}" width="${SIZE}" height="${height}" role="img" aria-label="${escapeXml(title)}" font-family="sans-serif"><title>${escapeXml(title)}</title>${parts.join('')}</svg>`;
}

function fmt(v: number): string {
  return String(Math.round(v * 100) / 100);
}
