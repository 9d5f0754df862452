import { describe, expect, it } from 'vitest';
import { addHarmonic, assessDraft, convertFamily, removeHarmonic, setTermField } from '@/lib/seed-editor';
import { SEED_PRESETS } from '@/lib/seed-presets';
import type { DescriptorInput } from '@/lib/schemas/descriptor';

const radial = (terms: { k: number; amplitude: number; phase: number }[]): DescriptorInput => ({ family: 'radial', baseRadius: 1, terms });

describe('the seed-shape editor model', () => {
  it('every preset is a valid, simple shape', () => {
    for (const p of SEED_PRESETS) {
      const a = assessDraft(p.descriptor);
      expect(a.problems, p.id).toEqual([]);
      expect(a.metrics?.isSimple, p.id).toBe(true);
    }
  });

  it('measures the radial-frequency area from the live draft', () => {
    // Wilkinson, Wilson & Habak (1998): area = π r0² (1 + ½ΣA²) for distinct ω (REFERENCES.md: (0.2, 5, φ 0.7) → 3.20442451).
    const a = assessDraft(radial([{ k: 5, amplitude: 0.2, phase: 0.7 }]));
    expect(a.metrics!.area).toBeCloseTo(3.20442451, 3);
  });

  it('names the harmonic whose amplitude drives the radius below zero', () => {
    const a = assessDraft(radial([{ k: 2, amplitude: 0.1, phase: 0 }, { k: 4, amplitude: 1.3, phase: 0 }]));
    expect(a.problems[0]?.field).toBe('terms.1.amplitude');
    expect(a.problems[0]?.message).toMatch(/k = 4/);
  });

  it('reports schema problems on their fields without throwing', () => {
    const a = assessDraft(radial([{ k: 0, amplitude: 0.1, phase: 0 }]));
    expect(a.problems.map((p) => p.field)).toContain('terms.0.k');
    expect(a.contour).toBeUndefined();
  });

  it('switching radial → complex → elliptic keeps the outline (area unchanged)', () => {
    const start = radial([{ k: 3, amplitude: 0.15, phase: 0.3 }, { k: 5, amplitude: 0.05, phase: 1 }]);
    const area = assessDraft(start).metrics!.area;
    const complex = convertFamily(start, 'complex').descriptor;
    expect(complex.family).toBe('complex');
    expect(assessDraft(complex).metrics!.area).toBeCloseTo(area, 6);
    const elliptic = convertFamily(complex, 'elliptic').descriptor;
    expect(elliptic.family).toBe('elliptic');
    expect(assessDraft(elliptic).metrics!.area).toBeCloseTo(area, 6);
    const back = convertFamily(elliptic, 'radial');
    expect(back.note).toMatch(/Fitted/);
    expect(assessDraft(back.descriptor).metrics!.area).toBeCloseTo(area, 2);
  });

  it('adds the lowest free harmonic, removes and sets without touching the input', () => {
    const d = radial([{ k: 2, amplitude: 0.1, phase: 0 }, { k: 3, amplitude: 0.1, phase: 0 }]);
    const frozen = JSON.stringify(d);
    expect(addHarmonic(d).terms.map((t) => (t as { k: number }).k)).toEqual([2, 3, 4]);
    expect(removeHarmonic(d, 0).terms).toHaveLength(1);
    expect((setTermField(d, 1, 'amplitude', 0.2).terms[1] as { amplitude: number }).amplitude).toBe(0.2);
    expect(JSON.stringify(d)).toBe(frozen);
  });
});
