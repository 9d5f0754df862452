import { describe, expect, it } from 'vitest';
import { EDITION_DIFF_TOLERANCE, EditionError, diffEditions, diffParameters, numericDifference, type EditionStimulus } from '@/lib/edition';
import { generateSpace, type SpaceDefinition } from '@/lib/space';

const DEFINITION: SpaceDefinition = {
  seed: { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.1, phase: 0 }] },
  axes: [
    { label: 'k = 3', changes: [{ harmonic: 3, field: 'amplitude', delta: 0.02 }] },
    { label: 'k = 5', changes: [{ harmonic: 5, field: 'amplitude', delta: 0.02 }] },
  ],
  extent: 1,
  layout: { kind: 'rings', rings: 2, spokes: 4 },
  normalization: { scale: 'equal-area-radius', centroid: true },
};

const stimulus = (id: string, a: number, b: number, amplitude = 0.1): EditionStimulus => ({
  id,
  position: { a, b },
  descriptor: { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude, phase: 0 }] },
});

describe('numericDifference', () => {
  it('is the largest gap between corresponding numbers, Infinity when the shapes differ', () => {
    expect(numericDifference({ a: 1, b: [2, 3] }, { a: 1.5, b: [2, 2] })).toBe(1);
    expect(numericDifference({ a: 1 }, { a: 1 })).toBe(0);
    expect(numericDifference({ a: 1 }, { a: 1, b: 2 })).toBe(Number.POSITIVE_INFINITY);
    expect(numericDifference({ a: 1, c: 2 }, { a: 1, b: 2 })).toBe(Number.POSITIVE_INFINITY);
    expect(numericDifference([1], { 0: 1 })).toBe(Number.POSITIVE_INFINITY);
    expect(numericDifference({ family: 'radial' }, { family: 'complex' })).toBe(Number.POSITIVE_INFINITY);
    expect(numericDifference(null, 0)).toBe(Number.POSITIVE_INFINITY);
  });
});

describe('diffEditions', () => {
  it('the same generated space twice: everything unchanged', () => {
    const { stimuli } = generateSpace(DEFINITION);
    const diff = diffEditions(stimuli, generateSpace(DEFINITION).stimuli);
    expect(diff.unchanged.map((entry) => entry.id)).toEqual(stimuli.map((entry) => entry.id));
    expect([diff.added, diff.removed, diff.changed]).toEqual([[], [], []]);
  });

  it('a third ring added: the new ring is added, the moved ones changed, the centre unchanged', () => {
    const before = generateSpace(DEFINITION).stimuli;
    const after = generateSpace({ ...DEFINITION, layout: { kind: 'rings', rings: 3, spokes: 4 } }).stimuli;
    const diff = diffEditions(before, after);
    expect(diff.added.map((entry) => entry.id).sort()).toEqual(['r03-s00', 'r03-s01', 'r03-s02', 'r03-s03']);
    expect(diff.removed).toEqual([]);
    expect(diff.unchanged.map((entry) => entry.id)).toEqual(['c']);
    // Ring i moves from ρ = i/2 to i/3: position and descriptor both change.
    expect(diff.changed).toHaveLength(8);
    for (const entry of diff.changed) expect(entry.fields).toEqual(['position', 'descriptor']);
  });

  it('matches by id, not by order, and reports removals in the old order', () => {
    const before = [stimulus('c', 0, 0), stimulus('r01-s00', 1, 0), stimulus('r01-s01', 0, 1), stimulus('r01-s02', -1, 0)];
    const after = [stimulus('r01-s01', 0, 1), stimulus('c', 0, 0, 0.2), stimulus('p-main-a', 0, 0.75)];
    const diff = diffEditions(before, after);
    expect(diff.added.map((entry) => entry.id)).toEqual(['p-main-a']);
    expect(diff.removed.map((entry) => entry.id)).toEqual(['r01-s00', 'r01-s02']);
    expect(diff.unchanged.map((entry) => entry.id)).toEqual(['r01-s01']);
    expect(diff.changed).toEqual([{ id: 'c', before: before[0], after: after[1], fields: ['descriptor'] }]);
  });

  it('ignores differences within the tolerance and reports those beyond it', () => {
    const base = [stimulus('c', 0, 0)];
    expect(diffEditions(base, [stimulus('c', EDITION_DIFF_TOLERANCE / 2, 0)]).unchanged).toHaveLength(1);
    expect(diffEditions(base, [stimulus('c', EDITION_DIFF_TOLERANCE * 2, 0)]).changed[0]?.fields).toEqual(['position']);
    expect(diffEditions(base, [stimulus('c', 0.01, 0)], 0.1).unchanged).toHaveLength(1);
  });

  it('counts a descriptor of another structure as changed', () => {
    const before = [stimulus('c', 0, 0)];
    const after: EditionStimulus[] = [{ id: 'c', position: { a: 0, b: 0 }, descriptor: { family: 'complex', terms: [] } }];
    expect(diffEditions(before, after).changed[0]?.fields).toEqual(['descriptor']);
  });

  it('refuses a repeated id or a bad tolerance, and does not mutate', () => {
    const before = [stimulus('c', 0, 0), stimulus('r01-s00', 1, 0)];
    const copy = structuredClone(before);
    diffEditions(before, [stimulus('c', 0, 1)]);
    expect(before).toEqual(copy);
    expect(() => diffEditions([stimulus('c', 0, 0), stimulus('c', 1, 0)], [])).toThrow(EditionError);
    expect(() => diffEditions([], [stimulus('x', 0, 0), stimulus('x', 0, 0)])).toThrow(EditionError);
    expect(() => diffEditions([], [], -1)).toThrow(EditionError);
    expect(() => diffEditions([], [], Number.NaN)).toThrow(EditionError);
  });
});

describe('diffParameters', () => {
  it('no rows for equal trees, whatever the key order', () => {
    expect(diffParameters(DEFINITION, structuredClone(DEFINITION))).toEqual([]);
    expect(diffParameters({ a: 1, b: { c: 2, d: 3 } }, { b: { d: 3, c: 2 }, a: 1 })).toEqual([]);
  });

  it('one row per changed leaf, with JSON Pointer paths in sorted key order', () => {
    const after: SpaceDefinition = {
      ...DEFINITION,
      extent: 1.5,
      axes: [DEFINITION.axes[0], { label: 'k = 5 (wider)', changes: [{ harmonic: 5, field: 'amplitude', delta: 0.03 }] }],
      normalization: { scale: 'area', centroid: true },
    };
    expect(diffParameters(DEFINITION, after)).toEqual([
      { path: '/axes/1/changes/0/delta', before: 0.02, after: 0.03 },
      { path: '/axes/1/label', before: 'k = 5', after: 'k = 5 (wider)' },
      { path: '/extent', before: 1, after: 1.5 },
      { path: '/normalization/scale', before: 'equal-area-radius', after: 'area' },
    ]);
  });

  it('reports entries added to or removed from arrays and objects', () => {
    expect(diffParameters({ terms: [1, 2] }, { terms: [1, 2, 3] })).toEqual([{ path: '/terms/2', before: undefined, after: 3 }]);
    expect(diffParameters({ boundaries: [{ key: 'a' }], note: 'x' }, { boundaries: [] })).toEqual([
      { path: '/boundaries/0', before: { key: 'a' }, after: undefined },
      { path: '/note', before: 'x', after: undefined },
    ]);
  });

  it('a layout of another kind: the kind and each key gained or lost', () => {
    const after: SpaceDefinition = { ...DEFINITION, layout: { kind: 'lattice', size: 5 } };
    expect(diffParameters(DEFINITION, after)).toEqual([
      { path: '/layout/kind', before: 'rings', after: 'lattice' },
      { path: '/layout/rings', before: 2, after: undefined },
      { path: '/layout/size', before: undefined, after: 5 },
      { path: '/layout/spokes', before: 4, after: undefined },
    ]);
  });

  it('a value replaced by another kind is one row; the root is the empty path; pointers escape ~ and /', () => {
    expect(diffParameters({ equalization: null }, { equalization: { directions: [] } })).toEqual([
      { path: '/equalization', before: null, after: { directions: [] } },
    ]);
    expect(diffParameters(1, 2)).toEqual([{ path: '', before: 1, after: 2 }]);
    expect(diffParameters({ 'a/b~': 1 }, { 'a/b~': 2 })).toEqual([{ path: '/a~1b~0', before: 1, after: 2 }]);
    expect(diffParameters([1], { 0: 1 })).toEqual([{ path: '', before: [1], after: { 0: 1 } }]);
  });
});
