import { escapeXml } from './escape-xml';

/** One matrix to draw: its title and its rows (null for a cell without data). */
export interface HeatmapPanel {
  readonly title: string;
  readonly values: readonly (readonly (number | null)[])[];
}

/** Colour steps of the one shared scale: fine enough to read, coarse enough that runs of cells merge. */
export const HEATMAP_STEPS = 24;
/** Side of each panel in SVG units; cells share it whatever the matrix size. */
const PANEL = 220;
const GAP = 28;
const TITLE = 20;
const LEGEND = 54;
/** Paper (#FAF7F0) to the accent's deep teal (#0E5D63): the product's sequential ramp, light = similar. */
const FROM = [250, 247, 240] as const;
const TO = [14, 93, 99] as const;
const MISSING = '#B8B3A8';

/** The colour of step s of `HEATMAP_STEPS`, from paper (0) to deep teal (1). */
export function heatmapColour(step: number): string {
  const u = Math.max(0, Math.min(1, step / (HEATMAP_STEPS - 1)));
  const c = FROM.map((f, i) => Math.round(f + ((TO[i] as number) - f) * u));
  return `#${c.map((v) => v.toString(16).padStart(2, '0')).join('')}`;
}

/** Stage: each panel's values as steps of the shared scale, the fraction of the panel's largest value. */
function toSteps(values: HeatmapPanel['values']): (number | null)[][] {
  let max = 0;
  for (const row of values) for (const v of row) if (v !== null && Number.isFinite(v)) max = Math.max(max, v);
  return values.map((row) => row.map((v) => (v === null || !Number.isFinite(v) ? null : Math.round((max > 0 ? v / max : 0) * (HEATMAP_STEPS - 1)))));
}

/**
 * RDM heatmaps side by side as one SVG document, all on one colour scale: each matrix as the fraction of its own
 * largest dissimilarity (matrices in different units become comparable, as rank correlations compare them), in
 * `HEATMAP_STEPS` steps from paper (identical) to deep teal (the matrix's largest), cells without data in grey,
 * with a legend. Runs of equal cells along a row are merged into one rectangle. Rows and columns in the same
 * stimulus order in every panel. Deterministic text; `title` is the document's accessible name.
 */
export function rdmHeatmapsSvg(panels: readonly HeatmapPanel[], title: string): string {
  const width = panels.length * PANEL + Math.max(0, panels.length - 1) * GAP;
  const height = TITLE + PANEL + LEGEND;
  const parts: string[] = [];
  let hasMissing = false;
  panels.forEach((panel, p) => {
    const n = panel.values.length;
    const x0 = p * (PANEL + GAP);
    const cell = n > 0 ? PANEL / n : PANEL;
    parts.push(`<text x="${x0}" y="14" font-size="12" fill="#2B2A28">${escapeXml(panel.title)}</text>`);
    parts.push(`<g transform="translate(${x0} ${TITLE})" shape-rendering="crispEdges">`);
    const steps = toSteps(panel.values);
    steps.forEach((row, i) => {
      for (let j = 0; j < n; ) {
        const s = row[j] ?? null;
        let end = j + 1;
        while (end < n && (row[end] ?? null) === s) end++;
        if (s === null) hasMissing = true;
        const fill = s === null ? MISSING : heatmapColour(s);
        parts.push(`<rect x="${fmt(j * cell)}" y="${fmt(i * cell)}" width="${fmt((end - j) * cell)}" height="${fmt(cell)}" fill="${fill}"/>`);
        j = end;
      }
    });
    parts.push(`<rect x="0" y="0" width="${PANEL}" height="${PANEL}" fill="none" stroke="#D9D4C7" stroke-width="0.5"/></g>`);
  });
  // The legend: the steps of the shared scale, and the grey of cells without data.
  const ly = TITLE + PANEL + 14;
  const legendWidth = Math.min(width, 240);
  const stepWidth = legendWidth / HEATMAP_STEPS;
  parts.push(`<g data-part="legend" transform="translate(0 ${ly})" font-size="10" fill="#2B2A28">`);
  for (let s = 0; s < HEATMAP_STEPS; s++) parts.push(`<rect x="${fmt(s * stepWidth)}" y="0" width="${fmt(stepWidth + 0.2)}" height="10" fill="${heatmapColour(s)}"/>`);
  parts.push(`<text x="0" y="24">0 · identical</text><text x="${legendWidth}" y="24" text-anchor="end">1 · the matrix's largest</text>`);
  if (hasMissing) parts.push(`<rect x="${legendWidth + 16}" y="0" width="10" height="10" fill="${MISSING}"/><text x="${legendWidth + 30}" y="9">no rating</text>`);
  parts.push(`<text x="0" y="38">Dissimilarity as a fraction of each matrix's largest value</text></g>`);
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img" aria-label="${escapeXml(title)}" font-family="sans-serif"><title>${escapeXml(title)}</title>${parts.join('')}</svg>`;
}

function fmt(v: number): string {
  return String(Math.round(v * 1000) / 1000);
}
