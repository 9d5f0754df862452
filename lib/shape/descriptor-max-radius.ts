import { checkDescriptorTerms } from './check-descriptor-terms';
import { evaluateDescriptor } from './evaluate-descriptor';
import { sampleCurve } from './sample-curve';
import type { Point, ShapeDescriptor } from './types';

/** Grid density for the search, per cycle of the highest harmonic, with a floor. */
const SAMPLES_PER_HARMONIC = 16;
const MIN_SAMPLES = 512;
/** Golden-section steps: 80 shrink a bracket of two grid steps below 1e-16 rad. */
const GOLDEN_SECTION_STEPS = 80;
const INVERSE_GOLDEN_RATIO = (Math.sqrt(5) - 1) / 2;

/**
 * The largest distance from `origin` to the descriptor's curve, in shape units: a dense grid, then
 * golden-section refinement of every grid-local maximum on the exact curve.
 */
export function descriptorMaxRadius(descriptor: ShapeDescriptor, origin: Point): number {
  checkDescriptorTerms(descriptor);
  const probe = sampleCurve(descriptor, 8);
  const samples = Math.max(MIN_SAMPLES, SAMPLES_PER_HARMONIC * probe.highestComplexHarmonic);
  const { x, y } = sampleCurve(descriptor, samples);
  const distance2 = (t: number): number => {
    const [px, py] = evaluateDescriptor(descriptor, t);
    return (px - origin[0]) ** 2 + (py - origin[1]) ** 2;
  };
  const grid = Float64Array.from(x, (px, j) => (px - origin[0]) ** 2 + ((y[j] as number) - origin[1]) ** 2);
  const h = (2 * Math.PI) / samples;
  let best = 0;
  for (let j = 0; j < samples; j++) {
    const here = grid[j] as number;
    best = Math.max(best, here);
    if (here < (grid[(j + samples - 1) % samples] as number) || here < (grid[(j + 1) % samples] as number)) continue;
    let a = (j - 1) * h;
    let b = (j + 1) * h;
    for (let step = 0; step < GOLDEN_SECTION_STEPS; step++) {
      const c = b - INVERSE_GOLDEN_RATIO * (b - a);
      const d = a + INVERSE_GOLDEN_RATIO * (b - a);
      if (distance2(c) > distance2(d)) b = d;
      else a = c;
    }
    best = Math.max(best, distance2((a + b) / 2));
  }
  return Math.sqrt(best);
}
