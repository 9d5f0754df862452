import { checkDescriptorTerms } from './check-descriptor-terms';
import { getTrigTable } from './trig-table';
import type { RadialDescriptor } from './types';

/** The dense grid has at least this many points per cycle of the highest harmonic (the issue asks for ≥ 8). */
const GRID_POINTS_PER_CYCLE = 16;
/** A floor on the grid size, so low-frequency shapes are still sampled finely. */
const MIN_GRID_POINTS = 256;
/** Golden-section steps: each shrinks the bracket by 0.618, so 80 steps take 2h down to below 1e-16 rad. */
const GOLDEN_SECTION_STEPS = 80;
const INVERSE_GOLDEN_RATIO = (Math.sqrt(5) - 1) / 2;

/** The lowest radius of a radial descriptor and the polar angle where it occurs. */
export interface RadialMinimum {
  /** r_min in shape units (≤ 0 means the descriptor is invalid). */
  readonly radius: number;
  /** θ of the minimum, in radians, in [0, 2π). */
  readonly angle: number;
  /** A certified lower bound on r over the whole circle (grid minimum less the largest possible dip). */
  readonly lowerBound: number;
}

function radiusAt(descriptor: RadialDescriptor, theta: number): number {
  let sum = 1;
  for (const { k, amplitude, phase } of descriptor.terms) sum += amplitude * Math.cos(k * theta + phase);
  return descriptor.baseRadius * sum;
}

function goldenSectionMinimum(descriptor: RadialDescriptor, low: number, high: number): number {
  let a = low;
  let b = high;
  let c = b - INVERSE_GOLDEN_RATIO * (b - a);
  let d = a + INVERSE_GOLDEN_RATIO * (b - a);
  let fc = radiusAt(descriptor, c);
  let fd = radiusAt(descriptor, d);
  for (let step = 0; step < GOLDEN_SECTION_STEPS; step++) {
    if (fc < fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - INVERSE_GOLDEN_RATIO * (b - a);
      fc = radiusAt(descriptor, c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + INVERSE_GOLDEN_RATIO * (b - a);
      fd = radiusAt(descriptor, d);
    }
  }
  return (a + b) / 2;
}

/**
 * Minimum radius of a radial-frequency pattern r(θ) = r0(1 + Σ A_k cos(kθ + φ_k)).
 * Method: r on a uniform grid of max(256, 16·k_max) angles, then golden-section refinement of every grid-local
 * minimum. `lowerBound` subtracts the largest dip possible between grid points, h²/8 · max|r''| with
 * max|r''| ≤ r0 Σ k²|A_k| (Taylor bound), so `lowerBound > 0` proves r > 0 everywhere.
 */
export function radialMinimumRadius(descriptor: RadialDescriptor): RadialMinimum {
  const { highestHarmonic } = checkDescriptorTerms(descriptor);
  const size = Math.max(MIN_GRID_POINTS, GRID_POINTS_PER_CYCLE * highestHarmonic);
  const { cos, sin } = getTrigTable(size);
  // Phase 1: the grid.
  const grid = new Float64Array(size).fill(1);
  let curvatureBound = 0;
  for (const { k, amplitude, phase } of descriptor.terms) {
    if (amplitude === 0) continue;
    const p = amplitude * Math.cos(phase);
    const q = amplitude * Math.sin(phase);
    let index = 0;
    for (let j = 0; j < size; j++) {
      grid[j] = (grid[j] ?? 0) + p * (cos[index] ?? 0) - q * (sin[index] ?? 0);
      index += k;
      if (index >= size) index -= size;
    }
    curvatureBound += k * k * Math.abs(amplitude);
  }
  // Phase 2: refine each grid-local minimum.
  const h = (2 * Math.PI) / size;
  let gridMinimum = Infinity;
  let best = { radius: Infinity, angle: 0 };
  for (let j = 0; j < size; j++) {
    const here = grid[j] ?? 0;
    gridMinimum = Math.min(gridMinimum, here);
    const before = grid[(j + size - 1) % size] ?? 0;
    const after = grid[(j + 1) % size] ?? 0;
    if (here > before || here > after) continue;
    const theta = goldenSectionMinimum(descriptor, (j - 1) * h, (j + 1) * h);
    const radius = Math.min(radiusAt(descriptor, theta), descriptor.baseRadius * here);
    if (radius < best.radius) best = { radius, angle: theta };
  }
  const twoPi = 2 * Math.PI;
  const angle = ((best.angle % twoPi) + twoPi) % twoPi;
  const r0 = descriptor.baseRadius;
  return { radius: best.radius, angle, lowerBound: r0 * gridMinimum - ((h * h) / 8) * r0 * curvatureBound };
}
