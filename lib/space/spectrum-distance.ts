import type { TrigTable } from '../shape/trig-table';
import { shiftGrid } from './shift-grid';
import type { ContourSpectrum } from './types';

/** Newton steps on |S(τ)|² from the best grid point; it converges quadratically, so a few reach rounding level. */
const MAX_NEWTON_STEPS = 8;
/** |S(τ)|² values within this fraction of each other are equal to rounding (a sum of O(1) terms carries ~1e-16). */
const PEAK_ROUNDING = 1e-13;
/** A Newton step below this (radians) has converged. */
const SHIFT_TOLERANCE = 1e-14;
/**
 * Distances below this fraction of the two curves' RMS size are rounding (a DFT of O(1) samples leaves ~1e-15)
 * and are returned as exactly 0, so a pure rotation reads as no change at all.
 */
const DISTANCE_NOISE = 1e-12;

/** Scratch arrays for one pair (w = conj(p)·q per shared harmonic) and the grid sums, grown as needed. */
let scratch = newScratch(64, 64);

function newScratch(terms: number, grid: number) {
  const f = () => new Float64Array(terms);
  return { k: new Int32Array(terms), pr: f(), pi: f(), qr: f(), qi: f(), wr: f(), wi: f(), sumRe: new Float64Array(grid), sumIm: new Float64Array(grid) };
}

function ensureScratch(terms: number, grid: number): void {
  if (scratch.k.length >= terms && scratch.sumRe.length >= grid) return;
  scratch = newScratch(Math.max(terms, scratch.k.length), Math.max(grid, scratch.sumRe.length));
}

/** Stage: merge-join the harmonics into `scratch`; returns the shared count and the energy only one side has. */
function shareHarmonics(p: ContourSpectrum, q: ContourSpectrum): { shared: number; unshared: number } {
  ensureScratch(Math.min(p.k.length, q.k.length), 0);
  let i = 0, j = 0, shared = 0, unshared = 0;
  while (i < p.k.length || j < q.k.length) {
    const kp = i < p.k.length ? (p.k[i] as number) : Infinity;
    const kq = j < q.k.length ? (q.k[j] as number) : Infinity;
    if (kp === kq) {
      scratch.k[shared] = kp;
      scratch.pr[shared] = p.re[i] as number;
      scratch.pi[shared] = p.im[i] as number;
      scratch.qr[shared] = q.re[j] as number;
      scratch.qi[shared] = q.im[j] as number;
      const pr = p.re[i] as number, pi = p.im[i] as number, qr = q.re[j] as number, qi = q.im[j] as number;
      scratch.wr[shared] = pr * qr + pi * qi;
      scratch.wi[shared] = pr * qi - pi * qr;
      shared++;
      i++;
      j++;
    } else if (kp < kq) {
      unshared += (p.re[i] as number) ** 2 + (p.im[i] as number) ** 2;
      i++;
    } else {
      unshared += (q.re[j] as number) ** 2 + (q.im[j] as number) ** 2;
      j++;
    }
  }
  return { shared, unshared };
}

/** Stage: the grid point τ_g = 2πg/G with the largest |S(τ_g)|², S(τ) = Σ conj(p_k) q_k e^{ikτ}; O(shared · G). */
function bestGridShift(shared: number, grid: TrigTable): number {
  const { size, cos, sin } = grid;
  ensureScratch(0, size);
  const { sumRe, sumIm } = scratch;
  sumRe.fill(0, 0, size);
  sumIm.fill(0, 0, size);
  for (let m = 0; m < shared; m++) {
    const wr = scratch.wr[m] as number;
    const wi = scratch.wi[m] as number;
    const step = (((scratch.k[m] as number) % size) + size) % size;
    let index = 0;
    for (let g = 0; g < size; g++) {
      const c = cos[index] as number;
      const s = sin[index] as number;
      sumRe[g] = (sumRe[g] as number) + wr * c - wi * s;
      sumIm[g] = (sumIm[g] as number) + wr * s + wi * c;
      index += step;
      if (index >= size) index -= size;
    }
  }
  let best = -1;
  let bestG = 0;
  for (let g = 0; g < size; g++) {
    const value = (sumRe[g] as number) ** 2 + (sumIm[g] as number) ** 2;
    if (value > best) {
      best = value;
      bestG = g;
    }
  }
  return (2 * Math.PI * bestG) / size;
}

/** S(τ), S′(τ), S″(τ) as [re, im] pairs. */
function shiftSums(shared: number, tau: number): [number, number, number, number, number, number] {
  let s0r = 0, s0i = 0, s1r = 0, s1i = 0, s2r = 0, s2i = 0;
  for (let m = 0; m < shared; m++) {
    const k = scratch.k[m] as number;
    const wr = scratch.wr[m] as number;
    const wi = scratch.wi[m] as number;
    const c = Math.cos(k * tau);
    const s = Math.sin(k * tau);
    const tr = wr * c - wi * s;
    const ti = wr * s + wi * c;
    s0r += tr;
    s0i += ti;
    // d/dτ e^{ikτ} = ik e^{ikτ}
    s1r -= k * ti;
    s1i += k * tr;
    s2r -= k * k * tr;
    s2i -= k * k * ti;
  }
  return [s0r, s0i, s1r, s1i, s2r, s2i];
}

/** Stage: Newton's method on f(τ) = |S(τ)|² from the grid's best point, never leaving its grid cell. */
function refineShift(shared: number, start: number, cell: number): number {
  let tau = start;
  let bestTau = start;
  let bestValue = -1;
  for (let step = 0; step <= MAX_NEWTON_STEPS; step++) {
    const [s0r, s0i, s1r, s1i, s2r, s2i] = shiftSums(shared, tau);
    const value = s0r * s0r + s0i * s0i;
    // Near the peak f is flat to rounding: a later Newton iterate that ties is the more accurate one.
    if (value >= bestValue * (1 - PEAK_ROUNDING)) {
      bestValue = Math.max(bestValue, value);
      bestTau = tau;
    }
    // f′ = 2 Re(conj S · S′), f″ = 2(|S′|² + Re(conj S · S″))
    const f1 = 2 * (s0r * s1r + s0i * s1i);
    const f2 = 2 * (s1r * s1r + s1i * s1i + s0r * s2r + s0i * s2i);
    if (!(f2 < 0) || step === MAX_NEWTON_STEPS) break;
    const delta = Math.max(-cell, Math.min(cell, -f1 / f2));
    tau += delta;
    if (Math.abs(tau - start) > cell) break;
    if (Math.abs(delta) < SHIFT_TOLERANCE) {
      const [r0, i0] = shiftSums(shared, tau);
      if (r0 * r0 + i0 * i0 >= bestValue * (1 - PEAK_ROUNDING)) bestTau = tau;
      break;
    }
  }
  return bestTau;
}

/** Stage: Σ over shared harmonics of |p_k − e^{i(α + kτ)} q_k|², α = −arg S(τ), summed term by term (no cancellation). */
function sharedResidual(shared: number, tau: number): number {
  const [s0r, s0i] = shiftSums(shared, tau);
  const alpha = -Math.atan2(s0i, s0r);
  let sum = 0;
  for (let m = 0; m < shared; m++) {
    const angle = alpha + (scratch.k[m] as number) * tau;
    const c = Math.cos(angle);
    const s = Math.sin(angle);
    const qr = scratch.qr[m] as number, qi = scratch.qi[m] as number;
    const dr = (scratch.pr[m] as number) - (qr * c - qi * s);
    const di = (scratch.pi[m] as number) - (qr * s + qi * c);
    sum += dr * dr + di * di;
  }
  return sum;
}

/**
 * Contour distance between two closed curves given as spectra: the root-mean-square distance between
 * corresponding points after the best rigid alignment — translation, rotation and start point (the cyclic
 * re-parametrisation t ↦ t + τ, continuous, not just whole samples). This is ordinary Procrustes analysis
 * without scaling (Dryden & Mardia, Statistical Shape Analysis) extended over the start point, computed in the
 * Fourier domain by Parseval: d² = min_{α,τ} Σ_k |p_k − e^{i(α + kτ)} q_k|². For each τ the best rotation is
 * α = −arg S(τ), S(τ) = Σ conj(p_k) q_k e^{ikτ}; τ maximises |S(τ)|² — a grid of `shiftGrid` points, then
 * Newton's method. In shape units (those of the contours), ≥ 0, symmetric, 0 for two outlines that differ by a
 * rotation, translation or start point only (such as a phase change of a single radial harmonic; distances
 * below 1e-12 of the curves' RMS size are rounding and read as 0). Exact for
 * band-limited curves (any descriptor sampled at N > 2·highest complex harmonic).
 * Pass `grid` to share one table across many pairs (an RDM); by default it is sized for this pair.
 */
export function spectrumDistance(p: ContourSpectrum, q: ContourSpectrum, grid: TrigTable = shiftGrid([p, q])): number {
  const { shared, unshared } = shareHarmonics(p, q);
  if (shared === 0) return Math.sqrt(p.energy + q.energy);
  const start = bestGridShift(shared, grid);
  const tau = refineShift(shared, start, (2 * Math.PI) / grid.size);
  const distance = Math.sqrt(unshared + sharedResidual(shared, tau));
  return distance < DISTANCE_NOISE * Math.sqrt(p.energy + q.energy) ? 0 : distance;
}
