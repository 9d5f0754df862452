import { getTrigTable, type TrigTable } from '../shape/trig-table';
import type { ContourSpectrum } from './types';

/**
 * Grid points per unit of harmonic span. |S(τ)|² (see `spectrumDistance`) is a trigonometric polynomial whose
 * highest frequency is the span k_max − k_min of the shared harmonics, so its peaks are ~2π/span wide; four grid
 * points per period put a grid point within a quarter period of the global maximum, where Newton's method
 * converges.
 */
const GRID_PER_SPAN = 4;
/** A floor on the grid, for spectra with one or two harmonics. */
const MIN_GRID = 16;

/**
 * The start-shift grid for comparing any two of `spectra`: cos/sin of 2πg/G, G = max(16, 4·span), span the
 * widest k_max − k_min among them. Shared by every pair of an RDM (the table is cached by `lib/shape`).
 */
export function shiftGrid(spectra: readonly ContourSpectrum[]): TrigTable {
  let span = 0;
  for (const s of spectra) if (s.k.length > 0) span = Math.max(span, (s.k[s.k.length - 1] as number) - (s.k[0] as number));
  return getTrigTable(Math.max(MIN_GRID, GRID_PER_SPAN * span));
}
