import { stimulusAt } from '../space/stimulus-at';
import { stimulusContour } from '../space/stimulus-contour';
import type { Contour, ShapeDescriptor } from '../shape/types';
import type { SpaceDefinition } from '../space/types';

/** Samples per outline on the participant's canvas (smooth at a few degrees of visual angle). */
const SAMPLES = 256;

export interface SessionEdition {
  seed: { descriptor: unknown };
  definition: Omit<SpaceDefinition, 'seed'>;
  stimuli: { id: string; descriptor: unknown; contourOffset: readonly [number, number] }[];
}

/**
 * Outlines for a participant session, synthesised in the browser from the edition snapshot (lib/space and
 * lib/shape modules, imported one by one so no SVG parser comes along): a stored stimulus by id, or the shape at
 * a polar position (ρ as a fraction of ρmax, angle in degrees) for categorisation probes and anchors.
 */
export function makeStimulusSource(edition: SessionEdition) {
  const definition = { ...edition.definition, seed: edition.seed.descriptor as ShapeDescriptor } as SpaceDefinition;
  const byId = new Map(edition.stimuli.map((s) => [s.id, s]));
  const cache = new Map<string, Contour>();
  const polar = (rho: number, angleDeg: number): Contour => {
    const key = `p${rho.toFixed(6)}:${angleDeg.toFixed(4)}`;
    let c = cache.get(key);
    if (!c) {
      const r = rho * definition.extent;
      const t = (angleDeg * Math.PI) / 180;
      c = stimulusContour(stimulusAt(definition, { a: r * Math.cos(t), b: r * Math.sin(t) }) as never, SAMPLES);
      cache.set(key, c);
    }
    return c;
  };
  const stored = (id: string): Contour => {
    let c = cache.get(id);
    if (!c) {
      const s = byId.get(id);
      if (!s) throw new Error(`no stimulus ${id} in this edition`);
      c = stimulusContour({ descriptor: s.descriptor, contourOffset: s.contourOffset } as never, SAMPLES);
      cache.set(id, c);
    }
    return c;
  };
  /** The largest distance from the origin over the edition's stimuli: the unit that `stimulusSizeDeg` spans twice. */
  const reach = () => {
    let max = 0;
    for (const s of edition.stimuli) {
      const c = stored(s.id);
      for (let i = 0; i < c.x.length; i++) max = Math.max(max, Math.hypot(c.x[i]!, c.y[i]!));
    }
    return max || 1;
  };
  return { polar, stored, reach };
}
