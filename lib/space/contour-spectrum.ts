import { getTrigTable } from '../shape/trig-table';
import type { Contour } from '../shape/types';
import { SpaceError } from './space-error';
import { SPECTRUM_NOISE } from './spectrum-noise';
import type { ContourSpectrum } from './types';

/**
 * The discrete Fourier series of a closed contour's samples z_j = x_j + i·y_j, read as points at t_j = 2πj/N:
 * c_k = (1/N) Σ_j z_j e^{−ikt_j} for k = −⌈N/2⌉ + 1 … ⌊N/2⌋, without c_0 (translation) and without harmonics
 * below rounding noise (`SPECTRUM_NOISE`). By Parseval, `energy` = Σ|c_k|² = (1/N) Σ|z_j − z̄|². Direct DFT
 * with a shared cos/sin table, O(N²) (N = 256 takes ~0.1 ms). For a contour synthesised from a descriptor at
 * N > 2·(highest complex harmonic), the result equals `descriptorSpectrum` to rounding.
 */
export function contourSpectrum(contour: Contour): ContourSpectrum {
  const n = contour.x.length;
  if (n < 3 || contour.y.length !== n) throw new SpaceError('invalid-argument', `a contour needs at least 3 vertices and equal x and y lengths (got ${n} and ${contour.y.length})`);
  const { cos, sin } = getTrigTable(n);
  const { x, y } = contour;
  const lowest = -Math.ceil(n / 2) + 1;
  const highest = Math.floor(n / 2);
  const ks: number[] = [];
  const res: number[] = [];
  const ims: number[] = [];
  let energy = 0;
  for (let k = lowest; k <= highest; k++) {
    if (k === 0) continue;
    const step = ((k % n) + n) % n;
    let re = 0;
    let im = 0;
    let index = 0;
    for (let j = 0; j < n; j++) {
      // (x + iy)(cos − i sin)
      const c = cos[index] as number;
      const s = sin[index] as number;
      const xj = x[j] as number;
      const yj = y[j] as number;
      re += xj * c + yj * s;
      im += yj * c - xj * s;
      index += step;
      if (index >= n) index -= n;
    }
    re /= n;
    im /= n;
    ks.push(k);
    res.push(re);
    ims.push(im);
    energy += re * re + im * im;
  }
  const floor = SPECTRUM_NOISE * SPECTRUM_NOISE * energy;
  const keep = ks.map((_, i) => (res[i] as number) ** 2 + (ims[i] as number) ** 2 > floor);
  const kept = keep.filter(Boolean).length;
  const spectrum = { k: new Int32Array(kept), re: new Float64Array(kept), im: new Float64Array(kept), energy: 0 };
  let e = 0;
  for (let i = 0, o = 0; i < ks.length; i++) {
    if (!keep[i]) continue;
    spectrum.k[o] = ks[i] as number;
    spectrum.re[o] = res[i] as number;
    spectrum.im[o] = ims[i] as number;
    e += (res[i] as number) ** 2 + (ims[i] as number) ** 2;
    o++;
  }
  return { ...spectrum, energy: e };
}
