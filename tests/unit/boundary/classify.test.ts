import { describe, expect, it } from 'vitest';
import {
  BoundaryError,
  boundaryPrototypes,
  boundarySummary,
  checkBoundaries,
  classifyStimuli,
  signedDistance,
  type Boundary,
  type BoundaryErrorCode,
} from '@/lib/boundary';
import { generateSpace, type SpaceDefinition } from '@/lib/space';

function expectBoundaryError(run: () => unknown, code: BoundaryErrorCode): void {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(BoundaryError);
    expect((error as BoundaryError).code).toBe(code);
    return;
  }
  throw new Error(`expected a BoundaryError '${code}'`);
}

/** 3 rings × 8 spokes + centre, ρmax 2: spokes at 0°, 45°, …, 315°. */
const RINGS: SpaceDefinition = {
  seed: { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.1, phase: 0 }] },
  axes: [
    { label: 'k = 3', changes: [{ harmonic: 3, field: 'amplitude', delta: 0.02 }] },
    { label: 'k = 5', changes: [{ harmonic: 5, field: 'amplitude', delta: 0.02 }] },
  ],
  extent: 2,
  layout: { kind: 'rings', rings: 3, spokes: 8 },
  normalization: { scale: 'equal-area-radius', centroid: true },
};
const STIMULI = generateSpace(RINGS).stimuli;

const HORIZONTAL: Boundary = { key: 'horizontal', angleDeg: 0 };
const DIAGONAL: Boundary = { key: 'diagonal', label: 'Diagonal', angleDeg: 22.5 };

describe('classifyStimuli', () => {
  const classified = classifyStimuli(STIMULI, [HORIZONTAL, DIAGONAL], RINGS.extent);
  const find = (id: string) => classified.find((entry) => entry.id === id);

  it('keeps the stimulus and boundary order', () => {
    expect(classified.map((entry) => entry.id)).toEqual(STIMULI.map((stimulus) => stimulus.id));
    for (const entry of classified) expect(entry.placements.map((placement) => placement.boundaryKey)).toEqual(['horizontal', 'diagonal']);
  });

  it('places known stimuli: spoke 2 (90°) of ring 3 is ρmax above the a axis', () => {
    const top = find('r03-s02')?.placements[0];
    expect(top?.side).toBe('A');
    expect(top?.distance).toBeCloseTo(2, 12);
    expect(top?.fraction).toBeCloseTo(1, 12);
    const bottom = find('r01-s06')?.placements[0];
    expect(bottom?.side).toBe('B');
    expect(bottom?.fraction).toBeCloseTo(-1 / 3, 12);
  });

  it('flags the centre and the stimuli along the boundary as ambiguous, despite cos/sin rounding', () => {
    for (const id of ['c', 'r01-s00', 'r03-s00', 'r02-s04', 'r03-s04']) {
      const placement = find(id)?.placements[0];
      expect(placement?.side).toBe('on');
      expect(placement?.isAmbiguous).toBe(true);
    }
    // Nothing lies on a boundary between two spokes, except the centre.
    const onDiagonal = classified.filter((entry) => entry.placements[1]?.side === 'on').map((entry) => entry.id);
    expect(onDiagonal).toEqual(['c']);
  });

  it('agrees with signedDistance and keeps |fraction| ≤ 1 inside the space', () => {
    STIMULI.forEach((stimulus, i) => {
      const placement = classified[i]?.placements[1];
      expect(placement?.distance).toBe(signedDistance(stimulus.position, DIAGONAL));
      expect(Math.abs(placement?.fraction ?? 2)).toBeLessThanOrEqual(1 + 1e-12);
    });
  });

  it('does not mutate its inputs', () => {
    const boundaries = [HORIZONTAL, DIAGONAL];
    const stimuli = STIMULI.slice(0, 5).map((stimulus) => ({ id: stimulus.id, position: { ...stimulus.position } }));
    const copies = structuredClone({ boundaries, stimuli });
    classifyStimuli(stimuli, boundaries, 2);
    expect({ boundaries, stimuli }).toEqual(copies);
  });

  it('refuses a bad boundary, a repeated key or a bad extent', () => {
    expectBoundaryError(() => classifyStimuli(STIMULI, [{ key: 'x', angleDeg: 180 }], 2), 'angle-out-of-range');
    expectBoundaryError(() => classifyStimuli(STIMULI, [{ key: 'x', angleDeg: Number.NaN }], 2), 'angle-out-of-range');
    expectBoundaryError(() => classifyStimuli(STIMULI, [HORIZONTAL, { key: 'horizontal', angleDeg: 10 }], 2), 'duplicate-key');
    expectBoundaryError(() => classifyStimuli(STIMULI, [HORIZONTAL], 0), 'invalid-argument');
    expectBoundaryError(() => classifyStimuli(STIMULI, [HORIZONTAL], Number.NaN), 'invalid-argument');
  });
});

describe('checkBoundaries', () => {
  it.each(['', 'Main', 'a b', '-a', 'a-', 'a--b', 'p/x', 'x'.repeat(41)])('refuses the key "%s"', (key) => {
    expectBoundaryError(() => checkBoundaries([{ key, angleDeg: 0 }]), 'invalid-key');
  });

  it('accepts slug keys and refuses a non-positive prototype distance', () => {
    expect(checkBoundaries([{ key: 'size-vs-shape-2', angleDeg: 179.5 }])).toHaveLength(1);
    expectBoundaryError(() => checkBoundaries([{ key: 'a', angleDeg: 0, prototypeDistance: 0 }]), 'invalid-argument');
    expectBoundaryError(() => checkBoundaries([{ key: 'a', angleDeg: 0, prototypeDistance: Number.POSITIVE_INFINITY }]), 'invalid-argument');
  });
});

describe('boundaryPrototypes', () => {
  it('θ = 0, ρmax 2: at (0, ±1.5) by default, with ids of their own', () => {
    const [a, b] = boundaryPrototypes(HORIZONTAL, 2);
    expect(a).toEqual({ id: 'p-horizontal-a', boundaryKey: 'horizontal', side: 'A', position: { a: 0, b: 1.5 }, distance: 1.5 });
    expect(b).toEqual({ id: 'p-horizontal-b', boundaryKey: 'horizontal', side: 'B', position: { a: 0, b: -1.5 }, distance: 1.5 });
  });

  it('uses the boundary’s own distance and lies at ±d on the right sides', () => {
    const boundary: Boundary = { key: 'tilted', angleDeg: 60, prototypeDistance: 0.4 };
    const [a, b] = boundaryPrototypes(boundary, 1);
    expect(signedDistance(a.position, boundary)).toBeCloseTo(0.4, 12);
    expect(signedDistance(b.position, boundary)).toBeCloseTo(-0.4, 12);
    expect(Math.hypot(a.position.a, a.position.b)).toBeCloseTo(0.4, 12);
    expect(a.position.a).toBeCloseTo(-0.4 * Math.sin(Math.PI / 3), 12);
  });

  it('never collides with a layout stimulus id', () => {
    const ids = new Set(STIMULI.map((stimulus) => stimulus.id));
    for (const prototype of boundaryPrototypes(DIAGONAL, 2)) expect(ids.has(prototype.id)).toBe(false);
  });

  it('refuses a bad boundary or extent', () => {
    expectBoundaryError(() => boundaryPrototypes({ key: 'x', angleDeg: -5 }, 1), 'angle-out-of-range');
    expectBoundaryError(() => boundaryPrototypes({ key: 'x', angleDeg: 5 }, -1), 'invalid-argument');
  });
});

describe('boundarySummary', () => {
  it('8 spokes, boundary along spokes 0 and 4: 9 on each side, 7 on it, balanced', () => {
    expect(boundarySummary(STIMULI, HORIZONTAL, 2)).toEqual({ boundaryKey: 'horizontal', countA: 9, countB: 9, countOn: 7, balance: 0 });
  });

  it('between spokes: 12 on each side, only the centre on it', () => {
    expect(boundarySummary(STIMULI, DIAGONAL, 2)).toEqual({ boundaryKey: 'diagonal', countA: 12, countB: 12, countOn: 1, balance: 0 });
  });

  it('reports an unbalanced set and null when nothing is off the boundary', () => {
    const stimuli = [
      { id: 'x', position: { a: 0, b: 1 } },
      { id: 'y', position: { a: 0, b: 0.5 } },
      { id: 'z', position: { a: 1, b: -1 } },
      { id: 'w', position: { a: 1, b: 0 } },
    ];
    expect(boundarySummary(stimuli, HORIZONTAL, 1)).toEqual({ boundaryKey: 'horizontal', countA: 2, countB: 1, countOn: 1, balance: 1 / 3 });
    expect(boundarySummary([{ id: 'c', position: { a: 0, b: 0 } }], HORIZONTAL, 1).balance).toBeNull();
    expect(boundarySummary([], HORIZONTAL, 1).balance).toBeNull();
  });
});
