/**
 * Harmonics with |c_k| below this fraction of the curve's RMS radius are rounding noise (a DFT of O(1) values
 * carries ~1e-15) and are dropped from a `ContourSpectrum`, so a pair of shapes costs only their real harmonics.
 * The energy they could carry is below 1e-22 of the total for any N ≤ 65,536.
 */
export const SPECTRUM_NOISE = 1e-11;
