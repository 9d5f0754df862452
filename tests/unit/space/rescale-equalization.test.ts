import { describe, expect, it } from 'vitest';
import { checkSpace, equalizationMap, generateSpace, rescaleEqualization, type SpaceDefinition } from '@/lib/space';

const DEFINITION: SpaceDefinition = {
  seed: { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.1, phase: 0 }] },
  axes: [
    { label: 'A', changes: [{ harmonic: 2, field: 'amplitude', delta: 0.08 }] },
    { label: 'B', changes: [{ harmonic: 4, field: 'amplitude', delta: 0.08 }] },
  ],
  extent: 1,
  layout: { kind: 'rings', rings: 2, spokes: 4 },
  normalization: { scale: 'equal-area-radius', centroid: true },
  equalization: null,
};

describe('rescaleEqualization', () => {
  it('multiplies the radius per direction (knots exactly (ρ, scale·ρ) without an earlier map) and the space generates with it', () => {
    const eq = rescaleEqualization(null, [{ angle: 0, scale: 1 }, { angle: Math.PI / 2, scale: 0.5 }, { angle: Math.PI, scale: 1 }, { angle: (3 * Math.PI) / 2, scale: 0.5 }], 1, 4);
    expect(eq.directions[1]!.knots).toEqual([[0.25, 0.125], [0.5, 0.25], [0.75, 0.375], [1, 0.5]]);
    const map = equalizationMap(eq);
    expect(map(0.8, Math.PI / 2)).toBeCloseTo(0.4, 14);
    expect(map(0.8, 0)).toBeCloseTo(0.8, 14);
    // Half-way between 0 (×1) and π/2 (×0.5) the blend is ×0.75.
    expect(map(0.8, Math.PI / 4)).toBeCloseTo(0.6, 14);
    const def = { ...DEFINITION, equalization: eq };
    expect(checkSpace(def).ok).toBe(true);
    const plain = generateSpace(DEFINITION).stimuli;
    const scaled = generateSpace(def).stimuli;
    // Designed positions are unchanged; the shapes along +b are the designed shapes at half the radius.
    expect(scaled.map((s) => s.position)).toEqual(plain.map((s) => s.position));
    const outerB = scaled.find((s) => Math.abs(s.position.a) < 1e-12 && s.position.b > 0.9)!;
    const innerB = plain.find((s) => Math.abs(s.position.a) < 1e-12 && Math.abs(s.position.b - 0.5) < 1e-12)!;
    expect(outerB.descriptor).toEqual(innerB.descriptor);
  });

  it('composes with an earlier re-mapping: ρ′ = E₀(scale·ρ)', () => {
    const previous = { directions: [{ angle: 0, knots: [[1, 2]] as [number, number][] }] };
    const eq = rescaleEqualization(previous, [{ angle: 0, scale: 0.5 }], 1, 2);
    expect(eq.directions[0]!.knots).toEqual([[0.5, 0.5], [1, 1]]);
    expect(() => rescaleEqualization(null, [{ angle: 0, scale: 0 }], 1)).toThrow(/positive/);
  });
});
