import { describe, expect, it } from 'vitest';
import { buildSnapshot, contentHash, diffEditions, type SnapshotInput } from '@/lib/edition';
import { equalizeSpace, generateSpace, stimulusAt } from '@/lib/space';
import { radialSpace } from '../space/support';

const base = (overrides: Partial<SnapshotInput> = {}): SnapshotInput => ({
  engineVersion: '1.0.0',
  space: { id: '00000000-0000-4000-8000-000000000001', name: 'Rings' },
  seed: { id: '00000000-0000-4000-8000-000000000002', name: 'Trefoil' },
  definition: radialSpace({ kind: 'rings', rings: 2, spokes: 8 }),
  boundaries: [{ key: 'round-vs-lobed', angleDeg: 45 }],
  ...overrides,
});

/** The same object with its keys in reverse order, recursively. */
function reverseKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(reverseKeys);
  if (value && typeof value === 'object') return Object.fromEntries(Object.entries(value).reverse().map(([k, v]) => [k, reverseKeys(v)]));
  return value;
}

describe('buildSnapshot', () => {
  it('freezes every layout stimulus, then two prototypes per boundary at ±0.75·ρmax along its normal', () => {
    const snap = buildSnapshot(base());
    expect(snap.stimuli.filter((s) => s.kind === 'layout')).toHaveLength(2 * 8 + 1);
    const protos = snap.stimuli.filter((s) => s.kind === 'prototype');
    expect(protos.map((p) => p.id)).toEqual(['p-round-vs-lobed-a', 'p-round-vs-lobed-b']);
    // θ = 45°: the normal is (−sin 45°, cos 45°); d = 0.75 · ρmax = 0.75.
    expect(protos[0]!.position.a).toBeCloseTo(-0.75 * Math.SQRT1_2, 12);
    expect(protos[0]!.position.b).toBeCloseTo(0.75 * Math.SQRT1_2, 12);
    expect(protos[0]!.polar.rho).toBeCloseTo(0.75, 12);
    expect(snap.boundaries[0]).toEqual({ key: 'round-vs-lobed', label: '', angleDeg: 45, prototypeDistance: 0.75 });
  });

  it('gives the same hash for the same edition, whatever the key order of its input, and a new one for any change', () => {
    const h1 = contentHash(buildSnapshot(base()));
    const h2 = contentHash(buildSnapshot(reverseKeys(base()) as SnapshotInput));
    expect(h1).toMatch(/^[0-9a-f]{64}$/);
    expect(h2).toBe(h1);
    expect(contentHash(buildSnapshot(base({ boundaries: [{ key: 'round-vs-lobed', angleDeg: 46 }] })))).not.toBe(h1);
    expect(contentHash(buildSnapshot(base({ engineVersion: '1.0.1' })))).not.toBe(h1);
  });

  it('survives a JSON round trip (as jsonb stores it) with its hash unchanged', () => {
    const snap = buildSnapshot(base());
    expect(contentHash(JSON.parse(JSON.stringify(snap)))).toBe(contentHash(snap));
  });

  it('refuses duplicate boundary keys and angles out of range', () => {
    expect(() => buildSnapshot(base({ boundaries: [{ key: 'x', angleDeg: 10 }, { key: 'x', angleDeg: 20 }] }))).toThrow(/key/);
    expect(() => buildSnapshot(base({ boundaries: [{ key: 'x', angleDeg: 180 }] }))).toThrow();
  });

  it('matches stimuli of two editions by id: a new ring is added, a moved boundary changes only its prototypes', () => {
    const before = buildSnapshot(base());
    const after = buildSnapshot(base({ definition: radialSpace({ kind: 'rings', rings: 3, spokes: 8 }), boundaries: [{ key: 'round-vs-lobed', angleDeg: 90 }] }));
    const diff = diffEditions(before.stimuli, after.stimuli);
    expect(diff.added.map((s) => s.id).sort()).toEqual(after.stimuli.filter((s) => s.id.startsWith('r03-')).map((s) => s.id).sort());
    expect(diff.removed).toHaveLength(0);
    // Rings 1 and 2 move inward when ρmax stays and the ring count grows (ρ = ρmax·i/R).
    expect(diff.changed.map((c) => c.id)).toContain('p-round-vs-lobed-a');
  });
});

function numbersOf(value: unknown): number[] {
  return JSON.stringify(value).match(/-?\d+(\.\d+)?(e[-+]?\d+)?/g)!.map(Number);
}

describe('stimulusAt', () => {
  it('reproduces the generated stimulus at a layout position, with and without equalisation', () => {
    const plain = radialSpace({ kind: 'rings', rings: 3, spokes: 8 });
    const equalized = { ...plain, equalization: equalizeSpace(plain) };
    for (const def of [plain, equalized]) {
      for (const s of generateSpace(def).stimuli) {
        const at = stimulusAt(def, s.position);
        // Equal to the last bits: ρ comes from the position here and from the layout there.
        expect(numbersOf(at.descriptor)).toHaveLength(numbersOf(s.descriptor).length);
        numbersOf(at.descriptor).forEach((v, i) => expect(v).toBeCloseTo(numbersOf(s.descriptor)[i]!, 12));
        expect(at.contourOffset[0]).toBeCloseTo(s.contourOffset[0], 12);
      }
    }
  });
});
