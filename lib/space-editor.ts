// Client-safe helpers for the space editor: the live stimuli for a definition, and defaults.
// Shape modules are imported one by one to keep paper.js out of the browser bundle.
import { generateSpace } from './space/generate-space';
import { stimulusContour } from './space/stimulus-contour';
import type { SpaceDefinition, Stimulus } from './space/types';
import type { Contour, ShapeDescriptor } from './shape/types';
import type { SpaceSettings } from './schemas/space';

/** Samples per thumbnail in the live view (the budget: 441 × 256 within one animation frame). */
export const LIVE_SAMPLES = 256;

export interface LiveStimulus {
  stimulus: Stimulus;
  contour: Contour | null;
}

// One buffer for every live contour, reused frame after frame: allocating hundreds of small typed arrays per
// frame costs more than synthesising them in Chromium. Contours of a frame are views into it, so they are
// valid until the next call.
let pool = new Float64Array(0);

function poolViews(count: number): Contour[] {
  const per = 2 * LIVE_SAMPLES;
  if (pool.length < count * per) pool = new Float64Array(count * per);
  return Array.from({ length: count }, (_, i) => ({
    x: pool.subarray(i * per, i * per + LIVE_SAMPLES),
    y: pool.subarray(i * per + LIVE_SAMPLES, (i + 1) * per),
  }));
}

/**
 * Generates the space and synthesises every stimulus; a stimulus the engine refuses gets `contour: null`.
 * The contours share one reused buffer and stay valid only until the next call.
 */
export function liveStimuli(definition: SpaceDefinition): { items: LiveStimulus[]; error: string | null; ms: number } {
  const t0 = performance.now();
  try {
    const { stimuli } = generateSpace(definition);
    const views = poolViews(stimuli.length);
    const items = stimuli.map((stimulus, i) => {
      try {
        return { stimulus, contour: stimulusContour(stimulus, LIVE_SAMPLES, { output: views[i]! }) };
      } catch {
        return { stimulus, contour: null };
      }
    });
    return { items, error: null, ms: performance.now() - t0 };
  } catch (e) {
    return { items: [], error: e instanceof Error ? e.message : 'The space cannot be generated.', ms: performance.now() - t0 };
  }
}

/** Fields an axis may change, by seed family. */
export const AXIS_FIELDS: Record<ShapeDescriptor['family'], readonly { field: SpaceSettings['axes'][number]['changes'][number]['field']; label: string }[]> = {
  radial: [
    { field: 'amplitude', label: 'amplitude' },
    { field: 'phase', label: 'phase' },
    { field: 'baseRadius', label: 'base radius' },
  ],
  elliptic: [
    { field: 'a', label: 'a' },
    { field: 'b', label: 'b' },
    { field: 'c', label: 'c' },
    { field: 'd', label: 'd' },
  ],
  complex: [
    { field: 're', label: 'real part' },
    { field: 'im', label: 'imaginary part' },
  ],
};

/** Starting settings for a new space on a seed: two axes on the two lowest harmonics, Rings 5 × 16. */
export function defaultSettings(seed: ShapeDescriptor): SpaceSettings {
  const field = AXIS_FIELDS[seed.family][0]!.field;
  const [h1, h2] = seed.family === 'elliptic' ? [2, 3] : seed.family === 'complex' ? [2, -2] : [2, 4];
  return {
    axes: [
      { label: 'Axis A', changes: [{ harmonic: h1, field, delta: 0.1 }] },
      { label: 'Axis B', changes: [{ harmonic: h2, field, delta: 0.1 }] },
    ],
    extent: 1,
    layout: { kind: 'rings', rings: 5, spokes: 16 },
    normalization: { scale: 'equal-area-radius', centroid: true },
    equalize: false,
  };
}
