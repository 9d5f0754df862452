import type { SpaceLayout } from './types';

/**
 * Number of stimuli a layout asks for: Rings R·S + 1, Lattice n², Diameters D·(m − 1) + 1. Computed without
 * generating anything, so an absurd layout can be refused cheaply. Assumes whole, non-negative counts
 * (`checkSpace` reports others); a Rings or Diameters layout with no rings, spokes, directions or steps beyond
 * the centre counts 0, as it has no space to speak of.
 */
export function countStimuli(layout: SpaceLayout): number {
  switch (layout.kind) {
    case 'rings':
      return layout.rings > 0 && layout.spokes > 0 ? layout.rings * layout.spokes + 1 : 0;
    case 'lattice':
      return layout.size * layout.size;
    case 'diameters':
      return layout.directions > 0 && layout.steps > 1 ? layout.directions * (layout.steps - 1) + 1 : 0;
  }
}
