import { describe, expect, it } from 'vitest';
import { contrastFigures, parseSrgbColour, relativeLuminance, srgbToLinear } from '@/lib/render';

describe('sRGB decoding and relative luminance', () => {
  it('decodes by IEC 61966-2-1 and weighs by WCAG 2.x', () => {
    // REFERENCES.md: sRGB (IEC 61966-2-1) with WCAG 2.x luminance; grey 128 → 0.2158605001.
    expect(relativeLuminance(128)).toBeCloseTo(0.2158605001, 10);
    expect(relativeLuminance('#808080')).toBeCloseTo(0.2158605001, 10);
    expect(relativeLuminance(0)).toBe(0);
    expect(relativeLuminance('#FFFFFF')).toBeCloseTo(1, 12);
    // IEC 61966-2-1: V/12.92 at and below 0.04045, the power law above; the two pieces meet there.
    expect(srgbToLinear(0.04045)).toBeCloseTo(0.04045 / 12.92, 15);
    expect(srgbToLinear(0.04046)).toBeCloseTo(((0.04046 + 0.055) / 1.055) ** 2.4, 15);
    expect(Math.abs(srgbToLinear(0.0404501) - srgbToLinear(0.0404499))).toBeLessThan(1e-7);
    // WCAG 2.x weights: pure primaries give their coefficient.
    expect(relativeLuminance('#ff0000')).toBeCloseTo(0.2126, 12);
    expect(relativeLuminance('#00ff00')).toBeCloseTo(0.7152, 12);
    expect(relativeLuminance('#0000ff')).toBeCloseTo(0.0722, 12);
  });

  it('gives the contrast figures of REFERENCES.md', () => {
    // REFERENCES.md (WCAG 2.x): black on white has contrast ratio 21.
    const bw = contrastFigures(0, 255);
    expect(bw.luminanceRatio).toBeCloseTo(21, 10);
    expect(bw.michelson).toBeCloseTo(1, 12);
    expect(bw.weber).toBeCloseTo(-1, 12);
    // Weber (L − Lb)/Lb and Michelson (Lmax − Lmin)/(Lmax + Lmin) with grey 128 → 0.2158605001 (REFERENCES.md).
    const g = 0.2158605001;
    const white = contrastFigures(255, 128);
    expect(white.weber).toBeCloseTo((1 - g) / g, 8);
    expect(white.michelson).toBeCloseTo((1 - g) / (1 + g), 8);
    expect(white.luminanceRatio).toBeCloseTo(1.05 / (g + 0.05), 8);
    // Weber is undefined on a black background.
    expect(contrastFigures(128, 0).weber).toBeNull();
  });

  it('reads hex and grey levels and refuses anything else', () => {
    expect(parseSrgbColour('#AbCdEf')).toMatchObject({ hex: '#abcdef', r: 0xab, g: 0xcd, b: 0xef, isGrey: false });
    expect(parseSrgbColour(7)).toMatchObject({ hex: '#070707', isGrey: true });
    for (const bad of ['abcdef', '#abc', '#gggggg', 1.5, -1, 256, Number.NaN]) expect(parseSrgbColour(bad)).toBeNull();
  });
});
