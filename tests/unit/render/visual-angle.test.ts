import { describe, expect, it } from 'vitest';
import {
  checkRender,
  degreesToPixels,
  pixelsPerCm,
  pixelsPerDegree,
  pixelsToDegrees,
  sizeForVisualAngle,
  visualAngle,
  type DisplayProfile,
  type RenderOptions,
} from '@/lib/render';

const profile = (over: Partial<DisplayProfile> = {}): DisplayProfile => ({
  name: 'Lab display',
  resolutionPx: { width: 1920, height: 1080 },
  widthCm: 48,
  pixelsPerCm: null,
  viewingDistanceCm: 57,
  ...over,
});

describe('visual angle θ = 2·atan(S/2D)', () => {
  it('matches the values in REFERENCES.md', () => {
    // REFERENCES.md (derived from θ = 2·atan(S/2D)): 1 cm subtends exactly 1° at 57.294325 cm.
    expect(visualAngle(1, 57.294325)).toBeCloseTo(1, 6);
    // REFERENCES.md: at 57 cm 1 cm subtends 1.005163° (the "1 cm at 57 cm" rule of thumb is 0.5 % off).
    expect(visualAngle(1, 57)).toBeCloseTo(1.005163, 6);
    // REFERENCES.md: 1° at 57 cm = 0.994863 cm.
    expect(sizeForVisualAngle(1, 57)).toBeCloseTo(0.994863, 6);
    // REFERENCES.md: 5 cm at 100 cm = 2.864192°.
    expect(visualAngle(5, 100)).toBeCloseTo(2.864192, 6);
    // REFERENCES.md: 10° centred at 50 cm = 8.748866 cm.
    expect(sizeForVisualAngle(10, 50)).toBeCloseTo(8.748866, 6);
  });

  it('size and angle are inverses over a wide range', () => {
    for (const deg of [0.01, 0.5, 3, 20, 90, 170]) expect(visualAngle(sizeForVisualAngle(deg, 73), 73)).toBeCloseTo(deg, 9);
  });
});

describe('display profiles', () => {
  it('derives px/cm from the width or takes it as given', () => {
    expect(pixelsPerCm(profile())).toBeCloseTo(40, 12);
    expect(pixelsPerCm(profile({ widthCm: null, pixelsPerCm: 37.8 }))).toBe(37.8);
  });

  it('pixels per degree at the distance where 1 cm is 1° equals px/cm', () => {
    // REFERENCES.md: 1 cm subtends 1° at 57.294325 cm, so 40 px/cm gives 40 px per degree there.
    expect(pixelsPerDegree(profile({ viewingDistanceCm: 57.294325 }))).toBeCloseTo(40, 4);
    // At 57 cm a degree is 0.994863 cm (REFERENCES.md) = 39.79452 px.
    expect(pixelsPerDegree(profile())).toBeCloseTo(40 * 0.994863, 3);
    // 10° at 50 cm is 8.748866 cm (REFERENCES.md), not 10 × the 1° size.
    expect(degreesToPixels(10, profile({ viewingDistanceCm: 50 }))).toBeCloseTo(8.748866 * 40, 3);
    expect(pixelsToDegrees(8.748866 * 40, profile({ viewingDistanceCm: 50 }))).toBeCloseTo(10, 5);
  });
});

const options = (over: Partial<RenderOptions> = {}): RenderOptions => ({
  sizeDeg: 4,
  sizeMeasure: 'equal-area-diameter',
  canvasDeg: 6,
  style: 'silhouette',
  strokeArcmin: null,
  fill: 0,
  background: 128,
  antiAlias: true,
  transparent: false,
  samples: 256,
  ...over,
});

describe('checkRender', () => {
  it('derives sizes: stimulus px, square canvas px, canvas mm and stroke px', () => {
    const check = checkRender(profile({ viewingDistanceCm: 57.294325 }), options({ style: 'outline', strokeArcmin: 6 }));
    expect(check.ok).toBe(true);
    const sizes = check.sizes!;
    expect(sizes.stimulusPx).toBeCloseTo(2 * 57.294325 * Math.tan((4 * Math.PI) / 360) * 40, 9);
    expect(sizes.canvasPx).toBe(Math.round(2 * 57.294325 * Math.tan((6 * Math.PI) / 360) * 40));
    expect(sizes.canvasMm).toBeCloseTo((sizes.canvasPx / 40) * 10, 12);
    // 6 arc-minutes = 0.1°, ≈ 4 px at 40 px per degree.
    expect(sizes.strokePx).toBeCloseTo(2 * 57.294325 * Math.tan((0.1 * Math.PI) / 360) * 40, 9);
  });

  it('refuses a viewing distance ≤ 0 with a field-level message', () => {
    for (const d of [0, -10, Number.NaN]) {
      const check = checkRender(profile({ viewingDistanceCm: d }), options());
      expect(check.ok).toBe(false);
      expect(check.errors.map((e) => [e.field, e.code])).toContainEqual(['profile.viewingDistanceCm', 'distance-invalid']);
      expect(check.sizes).toBeNull();
    }
  });

  it('refuses a size under 8 px and over 4096 px', () => {
    // 0.1° at 57 cm and 40 px/cm is ~4 px.
    const small = checkRender(profile(), options({ sizeDeg: 0.1, canvasDeg: 0.5 }));
    expect(small.errors.map((e) => e.code)).toContain('size-too-small');
    expect(small.errors.find((e) => e.code === 'size-too-small')?.message).toMatch(/at least 8 px/);
    const large = checkRender(profile(), options({ sizeDeg: 100, canvasDeg: 120 }));
    expect(large.errors.map((e) => [e.field, e.code])).toContainEqual(['sizeDeg', 'size-too-large']);
    expect(large.errors.map((e) => [e.field, e.code])).toContainEqual(['canvasDeg', 'size-too-large']);
  });

  it('refuses a missing or doubled pixel pitch, a bad stroke, colour and canvas', () => {
    expect(checkRender(profile({ widthCm: null }), options()).errors.map((e) => e.code)).toContain('pitch-missing');
    expect(checkRender(profile({ pixelsPerCm: 40 }), options()).errors.map((e) => e.code)).toContain('pitch-ambiguous');
    expect(checkRender(profile(), options({ style: 'outline', strokeArcmin: 0 })).errors.map((e) => e.code)).toContain('stroke-invalid');
    expect(checkRender(profile(), options({ fill: '#12345' })).errors.map((e) => [e.field, e.code])).toContainEqual(['fill', 'colour-invalid']);
    expect(checkRender(profile(), options({ background: 256 })).errors.map((e) => e.code)).toContain('colour-invalid');
    expect(checkRender(profile(), options({ canvasDeg: 3 })).errors.map((e) => e.code)).toContain('canvas-too-small');
  });

  it('warns, without failing, on zero contrast', () => {
    const check = checkRender(profile(), options({ fill: 128, background: '#808080' }));
    expect(check.ok).toBe(true);
    expect(check.warnings.map((w) => w.code)).toEqual(['zero-contrast']);
    expect(check.contrast?.michelson).toBe(0);
    expect(checkRender(profile(), options()).warnings).toEqual([]);
  });
});
