import { boundaryPrototypes } from '../boundary/boundary-prototypes';
import { checkBoundaries } from '../boundary/check-boundaries';
import { BOUNDARY_LIMITS } from '../boundary/boundary-limits';
import type { Boundary } from '../boundary/types';
import { generateSpace } from '../space/generate-space';
import { cartesianToPolar } from '../space/cartesian-to-polar';
import { stimulusAt } from '../space/stimulus-at';
import type { SpaceDefinition } from '../space/types';
import type { EditionSnapshot, SnapshotBoundary, SnapshotStimulus } from './types';

export interface SnapshotInput {
  readonly engineVersion: string;
  readonly space: { readonly id: string; readonly name: string };
  readonly seed: { readonly id: string; readonly name: string };
  readonly definition: SpaceDefinition;
  readonly boundaries: readonly Boundary[];
}

/** A plain copy through JSON, so no typed array, undefined member or class instance reaches the hash. */
function plain<T>(value: T): T {
  return JSON.parse(JSON.stringify(value)) as T;
}

/**
 * The snapshot an edition freezes: the seed, the definition, the boundaries (prototype distances resolved)
 * and every stimulus — the layout's, in layout order, then each boundary's two prototypes — with its designed
 * position, polar coordinates, normalised descriptor and contour offset. Deterministic: the same input gives
 * the same snapshot, so the same content hash. Throws the cores' errors for an invalid definition or boundary.
 */
export function buildSnapshot(input: SnapshotInput): EditionSnapshot {
  const { definition } = input;
  const boundaries: SnapshotBoundary[] = checkBoundaries(input.boundaries).map((b) => ({
    key: b.key,
    label: b.label ?? '',
    angleDeg: b.angleDeg,
    prototypeDistance: b.prototypeDistance ?? BOUNDARY_LIMITS.defaultPrototypeFraction * definition.extent,
  }));
  const stimuli: SnapshotStimulus[] = generateSpace(definition).stimuli.map((s) => ({
    id: s.id,
    kind: 'layout',
    position: { a: s.position.a, b: s.position.b },
    polar: { rho: s.polar.rho, angle: s.polar.angle },
    descriptor: plain(s.descriptor),
    contourOffset: [s.contourOffset[0], s.contourOffset[1]],
  }));
  for (const b of boundaries) {
    for (const p of boundaryPrototypes(b, definition.extent)) {
      const shape = stimulusAt(definition, p.position);
      stimuli.push({
        id: p.id,
        kind: 'prototype',
        position: p.position,
        polar: cartesianToPolar(p.position),
        descriptor: plain(shape.descriptor),
        contourOffset: [shape.contourOffset[0], shape.contourOffset[1]],
        prototypeOf: { boundaryKey: p.boundaryKey, side: p.side },
      });
    }
  }
  return {
    format: 1,
    engineVersion: input.engineVersion,
    space: { id: input.space.id, name: input.space.name },
    seed: { id: input.seed.id, name: input.seed.name, descriptor: plain(definition.seed) },
    definition: plain({
      axes: definition.axes,
      extent: definition.extent,
      layout: definition.layout,
      normalization: definition.normalization,
      equalization: definition.equalization ?? null,
    }),
    boundaries,
    stimuli,
  };
}
