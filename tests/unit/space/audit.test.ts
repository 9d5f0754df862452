import { describe, expect, it } from 'vitest';
import {
  DEFAULT_AUDIT_THRESHOLDS,
  SpaceError,
  anisotropyIndex,
  auditSpace,
  contourRdm,
  generateSpace,
  rdmEntry,
  stimulusContour,
  type SpaceDefinition,
} from '@/lib/space';
import { TREFOIL, amplitudeAxis, ellipticSpace, radialSpace } from './support';

/**
 * The known answer: a seed with one harmonic (A3 = 0.15) and Axis A changing only that harmonic's phase. A
 * phase change φ₃ ↦ φ₃ + δ turns r(θ) into r(θ + δ/3): a rotation. So along Axis A (spokes 0 and 4) every
 * stimulus is the centre rotated, at contour distance 0 after Procrustes alignment, and contour distance does
 * not grow there at all — the anisotropy flag must fire.
 */
const PHASE_SPACE: SpaceDefinition = {
  seed: { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.15, phase: 0 }] },
  axes: [{ label: 'Phase of k = 3', changes: [{ harmonic: 3, field: 'phase', delta: 1 }] }, amplitudeAxis(3, 0.1, 'Amplitude of k = 3')],
  extent: 1,
  layout: { kind: 'rings', rings: 3, spokes: 8 },
  normalization: { scale: 'equal-area-radius', centroid: true },
};

describe('the confound audit on a space whose answer is known', () => {
  const audit = auditSpace(PHASE_SPACE);
  const index = (id: string) => audit.ids.indexOf(id);

  it('a phase step of a single harmonic is a rotation: contour distance 0 along that axis', () => {
    for (const spoke of ['s00', 's04']) {
      for (const ring of ['r01', 'r02', 'r03']) expect(rdmEntry(audit.rdms.contour, index('c'), index(`${ring}-${spoke}`))).toBe(0);
      expect(rdmEntry(audit.rdms.contour, index(`r01-${spoke}`), index(`r03-${spoke}`))).toBe(0);
    }
    // Off that axis the amplitude changes, and so does the outline.
    expect(rdmEntry(audit.rdms.contour, index('c'), index('r03-s02'))).toBeGreaterThan(0.01);
    // The designed distances along the phase axis are not zero: design and contour disagree there.
    expect(rdmEntry(audit.rdms.design, index('c'), index('r03-s00'))).toBeCloseTo(1, 14);
  });

  it('the anisotropy flag fires: contour distance does not grow along the phase axis', () => {
    const ray = audit.anisotropy.rays.find((r) => r.label.startsWith('spoke 0 '));
    expect(ray?.distance).toEqual([0, 0, 0]);
    expect(ray?.rate).toBe(0);
    expect(audit.anisotropy.value).toBe(Infinity);
    expect(audit.anisotropy.flagged).toBe(true);
    expect(audit.anisotropy.message).toMatch(/does not change the outline/);
    expect(audit.flags.map((f) => f.measure)).toContain('anisotropy');
    expect(anisotropyIndex(PHASE_SPACE)).toBe(Infinity);
    // Spacing along the phase axis cannot be judged either: no step changes the outline.
    expect(audit.spacing.flagged).toBe(true);
  });

  it('the contour RDM is the one contourRdm finds on the sampled outlines', () => {
    const sampled = contourRdm(generateSpace(PHASE_SPACE).stimuli.map((s) => stimulusContour(s, 256)));
    audit.rdms.contour.values.forEach((v, i) => expect(sampled.values[i]).toBeCloseTo(v, 10));
  });
});

describe('the confound audit: spreads, flags and thresholds', () => {
  const space = radialSpace({ kind: 'rings', rings: 3, spokes: 8 });

  it('equal-area normalisation leaves no area spread; without it, a size axis is flagged', () => {
    const audit = auditSpace(space);
    expect(audit.area.value).toBeLessThan(1e-12);
    expect(audit.area.flagged).toBe(false);
    const sized = auditSpace({ ...space, normalization: { scale: 'none', centroid: true }, axes: [{ label: 'size', changes: [{ harmonic: 0, field: 'baseRadius', delta: 0.3 }] }, amplitudeAxis(4, 0.03)] });
    expect(sized.area.flagged).toBe(true);
    expect(sized.area.message).toMatch(/^Area varies across the space \(CV \d+\.\d %, above 5\.0 %\)/);
    expect(sized.flags[0]?.measure).toBe('area');
  });

  it('takes thresholds from the caller', () => {
    const strict = auditSpace(space, { thresholds: { anisotropy: 1.0001, areaCv: 0 } });
    expect(strict.thresholds).toEqual({ ...DEFAULT_AUDIT_THRESHOLDS, anisotropy: 1.0001, areaCv: 0 });
    expect(strict.anisotropy.flagged).toBe(true);
    const lenient = auditSpace(space, { thresholds: { anisotropy: 100 } });
    expect(lenient.anisotropy.flagged).toBe(false);
    expect(lenient.anisotropy.value).toBe(strict.anisotropy.value);
  });

  it('measures anisotropy as the ratio of the fastest to the slowest least-squares rate', () => {
    const audit = auditSpace(space);
    const rates = audit.anisotropy.rays.map((r) => r.rate);
    expect(audit.anisotropy.value).toBeCloseTo(Math.max(...rates) / Math.min(...rates), 12);
    for (const ray of audit.anisotropy.rays) {
      const slope = ray.rho.reduce((s, r, i) => s + r * (ray.distance[i] as number), 0) / ray.rho.reduce((s, r) => s + r * r, 0);
      expect(ray.rate).toBeCloseTo(slope, 14);
    }
    // Axis A changes A2 by 0.1 per unit, Axis B changes A4 by 0.03: contour distance grows faster along A.
    expect(audit.anisotropy.value).toBeGreaterThan(2);
    expect(audit.anisotropy.flagged).toBe(true);
  });

  it('measures spacing along every spoke: CV of neighbour distances', () => {
    const audit = auditSpace(space);
    expect(audit.spacing.lines).toHaveLength(8);
    for (const line of audit.spacing.lines) {
      expect(line.ids[0]).toBe('c');
      expect(line.gaps).toHaveLength(3);
      const mean = line.gaps.reduce((s, g) => s + g, 0) / 3;
      const sd = Math.sqrt(line.gaps.reduce((s, g) => s + (g - mean) ** 2, 0) / 3);
      expect(line.cv).toBeCloseTo(sd / mean, 12);
    }
  });

  it('reports progress as it goes, from 0 to 1 in order', () => {
    const seen: number[] = [];
    auditSpace(space, { onProgress: (f) => seen.push(f) });
    expect(seen.length).toBeGreaterThan(10);
    expect(seen.at(-1)).toBe(1);
    seen.forEach((f, i) => {
      expect(f).toBeGreaterThanOrEqual(i === 0 ? 0 : (seen[i - 1] as number));
      expect(f).toBeLessThanOrEqual(1);
    });
  });

  it('refuses a space with invalid stimuli, listing them', () => {
    const broken = radialSpace({ kind: 'rings', rings: 3, spokes: 8 }, { axes: [amplitudeAxis(2, 0.5), amplitudeAxis(4, 0.03)], extent: 2.5 });
    expect(() => auditSpace(broken)).toThrow(SpaceError);
    try {
      auditSpace(broken);
    } catch (error) {
      expect((error as SpaceError).code).toBe('invalid-space');
      expect((error as SpaceError).failures.some((f) => f.id === 'r03-s00')).toBe(true);
    }
  });
});

describe('the confound audit on every layout', () => {
  it('Lattice (odd n): the eight compass directions through the middle point, four lines', () => {
    const audit = auditSpace(radialSpace({ kind: 'lattice', size: 5 }));
    expect(audit.count).toBe(25);
    expect(audit.anisotropy.rays.map((r) => r.label)).toEqual(['E', 'NE', 'N', 'NW', 'W', 'SW', 'S', 'SE']);
    expect(audit.anisotropy.rays[1]?.ids).toEqual(['l01-03', 'l00-04']);
    expect(audit.anisotropy.rays[1]?.rho[1]).toBeCloseTo(Math.SQRT2, 14);
    expect(audit.spacing.lines.map((l) => l.ids.length)).toEqual([5, 5, 5, 5]);
    expect(audit.spacing.lines[0]?.ids).toEqual(['l02-00', 'l02-01', 'l02-02', 'l02-03', 'l02-04']);
  });

  it('Lattice (even n): four diagonal directions from the centre shape, which is not a stimulus', () => {
    const audit = auditSpace(ellipticSpace({ kind: 'lattice', size: 4 }));
    expect(audit.count).toBe(16);
    expect(audit.anisotropy.rays.map((r) => r.label)).toEqual(['NE', 'NW', 'SW', 'SE']);
    expect(audit.anisotropy.rays[0]?.ids).toEqual(['l01-02', 'l00-03']);
    expect(audit.spacing.lines.map((l) => l.label)).toEqual(['SW–NE diagonal', 'SE–NW diagonal']);
    expect(Number.isFinite(audit.anisotropy.value)).toBe(true);
  });

  it('Diameters: both halves of every diameter as directions, each whole diameter as a line', () => {
    const audit = auditSpace(ellipticSpace({ kind: 'diameters', directions: 3, steps: 7 }));
    expect(audit.count).toBe(19);
    expect(audit.anisotropy.rays).toHaveLength(6);
    expect(audit.anisotropy.rays[1]?.angle).toBeCloseTo(Math.PI, 14);
    expect(audit.spacing.lines[0]?.ids).toEqual(['d00-m03', 'd00-m02', 'd00-m01', 'c', 'd00-p01', 'd00-p02', 'd00-p03']);
    expect(audit.correlations.designContour.value).toBeGreaterThan(0.5);
  });

  it('a single stimulus: nothing to compare, nothing flagged but what applies', () => {
    const audit = auditSpace({ ...radialSpace({ kind: 'lattice', size: 1 }), seed: TREFOIL });
    expect(audit.count).toBe(1);
    expect(audit.correlations.designContour.value).toBeNull();
    expect(audit.anisotropy.value).toBeNull();
    expect(audit.flags).toEqual([]);
  });
});
