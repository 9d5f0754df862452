import { describe, expect, it } from 'vitest';
import { anisotropyIndex, auditSpace, checkDefinition, checkSpace, equalizeSpace, type SpaceDefinition } from '@/lib/space';
import { amplitudeAxis, deepFreeze, ellipticSpace, radialSpace } from './support';

/** Deliberately anisotropic: per unit, Axis A adds 0.1 to A2 and Axis B only 0.03 to A4. */
const ANISOTROPIC = radialSpace({ kind: 'rings', rings: 5, spokes: 16 });

describe('equalise', () => {
  it('brings the anisotropy index of a deliberately anisotropic space to ≤ 1.05', () => {
    const before = anisotropyIndex(ANISOTROPIC);
    expect(before).toBeGreaterThan(2);
    const equalization = equalizeSpace(ANISOTROPIC);
    const after = anisotropyIndex({ ...ANISOTROPIC, equalization });
    expect(after).toBeLessThanOrEqual(1.05);
    expect(after).toBeGreaterThanOrEqual(1);
    // The audit agrees, and no longer flags anisotropy; contour distance now grows linearly along each spoke.
    const audit = auditSpace({ ...ANISOTROPIC, equalization });
    expect(audit.anisotropy.flagged).toBe(false);
    expect(audit.spacing.value).toBeLessThan(0.01);
    expect(auditSpace(ANISOTROPIC).anisotropy.flagged).toBe(true);
  });

  it('holds between its knots: twice the rings, same equalisation, still ≤ 1.05', () => {
    const equalization = equalizeSpace(ANISOTROPIC);
    expect(anisotropyIndex({ ...ANISOTROPIC, layout: { kind: 'rings', rings: 10, spokes: 16 }, equalization })).toBeLessThanOrEqual(1.05);
  });

  it('works on Diameters and Lattice layouts and elliptic seeds', () => {
    for (const space of [
      radialSpace({ kind: 'diameters', directions: 4, steps: 9 }),
      radialSpace({ kind: 'lattice', size: 7 }),
      ellipticSpace({ kind: 'rings', rings: 4, spokes: 12 }, { axes: [{ label: 'a2', changes: [{ harmonic: 2, field: 'a', delta: 0.12 }] }, { label: 'd3', changes: [{ harmonic: 3, field: 'd', delta: 0.02 }] }] }),
    ] satisfies SpaceDefinition[]) {
      const equalization = equalizeSpace(space);
      expect(anisotropyIndex(space)).toBeGreaterThan(1.2);
      expect(anisotropyIndex({ ...space, equalization })).toBeLessThanOrEqual(1.05);
    }
  });

  it('stores a valid, monotone map that keeps stimuli inside the designed extent', () => {
    const equalization = equalizeSpace(ANISOTROPIC);
    expect(equalization.directions).toHaveLength(16);
    expect(checkDefinition({ ...ANISOTROPIC, equalization })).toEqual([]);
    expect(checkSpace({ ...ANISOTROPIC, equalization }).ok).toBe(true);
    for (const { knots } of equalization.directions) {
      knots.forEach(([rho, mapped], i) => {
        expect(mapped).toBeLessThanOrEqual(1 + 1e-12);
        expect(mapped).toBeGreaterThan(0);
        if (i > 0) expect(mapped).toBeGreaterThanOrEqual((knots[i - 1] as readonly [number, number])[1]);
        expect(rho).toBeGreaterThan(i > 0 ? (knots[i - 1] as readonly [number, number])[0] : 0);
      });
    }
    // The slowest direction (Axis B, spoke 4 at 90°) reaches the full extent; the fastest (Axis A) is compressed.
    const last = (angle: number) => equalization.directions.find((d) => Math.abs(d.angle - angle) < 1e-12)?.knots.at(-1)?.[1];
    expect(last(Math.PI / 2)).toBeCloseTo(1, 9);
    expect(last(0)).toBeLessThan(0.6);
  });

  it('is deterministic, ignores an existing equalisation and does not mutate the definition', () => {
    const first = equalizeSpace(ANISOTROPIC);
    const frozen = deepFreeze({ ...ANISOTROPIC, equalization: first });
    expect(equalizeSpace(frozen)).toEqual(first);
    expect(equalizeSpace(ANISOTROPIC)).toEqual(first);
  });

  it('cannot equalise a direction that does not change the outline: the index stays infinite', () => {
    const phase: SpaceDefinition = radialSpace({ kind: 'rings', rings: 3, spokes: 8 }, {
      seed: { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.15, phase: 0 }] },
      axes: [{ label: 'phase', changes: [{ harmonic: 3, field: 'phase', delta: 1 }] }, amplitudeAxis(3, 0.1)],
    });
    const equalization = equalizeSpace(phase);
    expect(anisotropyIndex({ ...phase, equalization })).toBe(Infinity);
    // The still direction keeps the identity map.
    expect(equalization.directions[0]?.knots.every(([rho, mapped]) => rho === mapped)).toBe(true);
  });

  it('refuses a space with invalid stimuli', () => {
    expect(() => equalizeSpace({ ...ANISOTROPIC, axes: [amplitudeAxis(2, 0.5), amplitudeAxis(4, 0.03)], extent: 2.5 })).toThrow(/cannot be equalised/);
  });
});
