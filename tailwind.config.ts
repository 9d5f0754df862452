import type { Config } from 'tailwindcss';

/**
 * Epicycle's theme tokens (DESIGN.md §6): warm paper surfaces, graphite text, one deep teal accent,
 * hairline rules, and the Okabe & Ito colour-blind-safe palette for categories.
 * Loaded by app/globals.css through `@config`.
 */
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: '#FAF7F0', deep: '#F2EDE3', raised: '#FFFDF8' },
        graphite: { DEFAULT: '#23262B', soft: '#4A4D52', muted: '#5E5C57' },
        rule: { DEFAULT: '#DDD6C8', strong: '#B9B1A2' },
        accent: { DEFAULT: '#0E5D63', strong: '#0A474C', soft: '#E1EEEC', ring: '#2D8C92' },
        danger: { DEFAULT: '#A63F00', soft: '#FBEADF' },
        caution: { DEFAULT: '#7A5300', soft: '#FBF1D9' },
        category: {
          vermilion: '#D55E00',
          blue: '#0072B2',
          green: '#009E73',
          orange: '#E69F00',
          sky: '#56B4E9',
        },
      },
      fontFamily: {
        sans: ['var(--font-plex-sans)', 'ui-sans-serif', 'system-ui', 'sans-serif'],
        mono: ['var(--font-plex-mono)', 'ui-monospace', 'monospace'],
      },
      borderWidth: { hairline: '0.5px' },
      maxWidth: { page: '72rem' },
    },
  },
};

export default config;
