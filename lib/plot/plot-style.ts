/** The product's palette (DESIGN.md §6): graphite ink on paper, hairline rules, deep teal, Okabe & Ito blue. */
export const PLOT_STYLE = {
  paper: '#FFFDF8',
  ink: '#23262B',
  soft: '#4A4D52',
  rule: '#DDD6C8',
  ruleStrong: '#B9B1A2',
  accent: '#0E5D63',
  points: '#0072B2',
  font: "'IBM Plex Sans', ui-sans-serif, system-ui, sans-serif",
  mono: "'IBM Plex Mono', ui-monospace, monospace",
} as const;
