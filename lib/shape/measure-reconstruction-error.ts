import { checkOutline } from './check-outline';
import { checkDescriptorTerms } from './check-descriptor-terms';
import { contourArea } from './contour-area';
import { contourCentroid } from './contour-centroid';
import { SHAPE_LIMITS } from './shape-limits';
import { synthesizeContour } from './synthesize-contour';
import type { Contour, ReconstructionError, ShapeDescriptor } from './types';

/** The reconstruction is sampled at this many points unless the descriptor needs more (4 per cycle). */
const DEFAULT_RECONSTRUCTION_SAMPLES = 1024;

/** Squared distance from (px, py) to the closed polyline `to`. */
function distanceToPolyline(px: number, py: number, to: Contour): number {
  const { x, y } = to;
  const n = x.length;
  let best = Infinity;
  for (let i = 0; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    const ax = x[i] as number;
    const ay = y[i] as number;
    const ex = (x[j] as number) - ax;
    const ey = (y[j] as number) - ay;
    const length2 = ex * ex + ey * ey;
    const s = length2 === 0 ? 0 : Math.max(0, Math.min(1, ((px - ax) * ex + (py - ay) * ey) / length2));
    const dx = ax + s * ex - px;
    const dy = ay + s * ey - py;
    best = Math.min(best, dx * dx + dy * dy);
  }
  return best;
}

/**
 * How far a fitted descriptor's curve lies from the outline it was fitted to: the distance from every outline
 * vertex to the reconstructed polygon and from every reconstructed sample to the outline, pooled; `mean` and
 * `max` (a discrete symmetric Hausdorff distance) are in units of the outline's equal-area radius √(|A|/π).
 * A radial descriptor is placed at the outline's area centroid, as `fitRadialHarmonics` fits about it.
 * O(N·M); `samples` defaults to 1,024.
 */
export function measureReconstructionError(
  outline: Contour,
  descriptor: ShapeDescriptor,
  options: { readonly samples?: number } = {},
): ReconstructionError {
  checkOutline(outline);
  const { highestHarmonic } = checkDescriptorTerms(descriptor);
  const samples = Math.max(options.samples ?? DEFAULT_RECONSTRUCTION_SAMPLES, SHAPE_LIMITS.aliasFactor * highestHarmonic);
  const synthesized = synthesizeContour(descriptor, samples, { checkSimple: false });
  let reconstruction = synthesized;
  if (descriptor.family === 'radial') {
    const [cx, cy] = contourCentroid(outline);
    reconstruction = { x: synthesized.x.map((v) => v + cx), y: synthesized.y.map((v) => v + cy) };
  }
  const unit = Math.sqrt(Math.abs(contourArea(outline)) / Math.PI);
  let sum = 0;
  let max = 0;
  let count = 0;
  for (const [from, to] of [
    [outline, reconstruction],
    [reconstruction, outline],
  ] as const) {
    for (let i = 0; i < from.x.length; i++) {
      const distance = Math.sqrt(distanceToPolyline(from.x[i] as number, from.y[i] as number, to));
      sum += distance;
      max = Math.max(max, distance);
      count++;
    }
  }
  return { mean: sum / count / unit, max: max / unit };
}
