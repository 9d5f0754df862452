import { describe, expect, it } from 'vitest';
import { distanceFromBlindSpotCm, isPlausibleDistanceCm, pixelsPerMm } from '@/lib/take/screen-geometry';

describe('screen check geometry', () => {
  it('px per mm is the card width on screen over 85.60 mm (ISO/IEC 7810 ID-1, REFERENCES.md)', () => {
    expect(pixelsPerMm(856)).toBeCloseTo(10, 12);
    expect(pixelsPerMm(323.5)).toBeCloseTo(3.7792, 4);
  });

  it('blind-spot distance: D = s / tan 15.5° = 3.605884·s (Rohrschneider 2004, REFERENCES.md)', () => {
    // 10 px per mm: a 100 mm separation (1000 px) puts the eye 360.5884 mm = 36.05884 cm away.
    expect(distanceFromBlindSpotCm([1000], 10)).toBeCloseTo(36.05884, 4);
    // Sweeps are averaged: 900, 1000 and 1100 px give the same as 1000 px.
    expect(distanceFromBlindSpotCm([900, 1000, 1100], 10)).toBeCloseTo(36.05884, 4);
    // At 57 cm the dot vanishes 57 / 3.605884 = 15.8075 cm from the fixation mark.
    expect(distanceFromBlindSpotCm([1580.75], 10)).toBeCloseTo(57, 2);
  });

  it('no sweep or no scale gives no distance; implausible distances are refused', () => {
    expect(distanceFromBlindSpotCm([], 10)).toBeNull();
    expect(distanceFromBlindSpotCm([100], 0)).toBeNull();
    expect(isPlausibleDistanceCm(null)).toBe(false);
    expect(isPlausibleDistanceCm(19.9)).toBe(false);
    expect(isPlausibleDistanceCm(57)).toBe(true);
    expect(isPlausibleDistanceCm(200)).toBe(true);
    expect(isPlausibleDistanceCm(Number.NaN)).toBe(false);
  });
});
