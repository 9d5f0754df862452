import { expect } from 'vitest';
import * as api from '@/lib/server/api';
import { callRoute, type TestLab } from './actors';

/** The tests' seed shape: one radial harmonic. */
export const TEST_SEED = { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.1, phase: 0.2 }] };

/** The settings of a test space on `TEST_SEED` (two lobe axes, ρmax 1, normalised), laid out as `layout`. */
export function testSpaceSettings(layout: unknown) {
  return {
    axes: [
      { label: 'A', changes: [{ harmonic: 2, field: 'amplitude', delta: 0.08 }] },
      { label: 'B', changes: [{ harmonic: 4, field: 'amplitude', delta: 0.08 }] },
    ],
    extent: 1,
    layout,
    normalization: { scale: 'equal-area-radius', centroid: true },
    equalize: false,
  };
}

/**
 * A seed shape, a Rings 2 × 6 space and its edition 1, made through the API by the lab's Designer; Approved by its
 * Reviewer when `approve`. Returns the edition's id and stimulus count.
 */
export async function makeEdition(lab: TestLab, name: string, approve: boolean): Promise<{ editionId: string; spaceId: string; stimulusCount: number }> {
  const as = (role: keyof TestLab['members']) => lab.members[role].cookie;
  const seed = await callRoute(api.createSeedShapeRoute, { params: { lab: lab.slug }, body: { name: `${name} seed`, descriptor: TEST_SEED }, cookie: as('designer') });
  const space = await callRoute(api.createShapeSpaceRoute, {
    params: { lab: lab.slug },
    body: { name, seedShapeId: (seed.body as { id: string }).id, ...testSpaceSettings({ kind: 'rings', rings: 2, spokes: 6 }) },
    cookie: as('designer'),
  });
  const spaceId = (space.body as { id: string }).id;
  const frozen = await callRoute(api.freezeEditionRoute, { params: { lab: lab.slug, spaceId }, body: { changeNote: '' }, cookie: as('designer') });
  expect(frozen.status).toBe(201);
  if (approve) {
    expect((await callRoute(api.submitEditionRoute, { params: { lab: lab.slug, spaceId, number: '1' }, cookie: as('designer') })).status).toBe(200);
    expect((await callRoute(api.decideEditionRoute, { params: { lab: lab.slug, spaceId, number: '1' }, body: { decision: 'approve' }, cookie: as('reviewer') })).status).toBe(200);
  }
  const e = frozen.body as { id: string; stimulusCount: number };
  return { editionId: e.id, spaceId, stimulusCount: e.stimulusCount };
}
