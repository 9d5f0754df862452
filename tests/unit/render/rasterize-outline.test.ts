import { describe, expect, it } from 'vitest';
import { rasterizeOutline, type RasterOutline } from '@/lib/render/rasterize-outline';
import { parseHexColour } from '@/lib/render/parse-hex-colour';

function target(width: number, height: number) {
  return { data: new Uint8ClampedArray(width * height * 4), width, height };
}

function coveredArea(data: Uint8ClampedArray): number {
  let sum = 0;
  for (let i = 3; i < data.length; i += 4) sum += data[i]! / 255;
  return sum;
}

function polygon(points: readonly (readonly [number, number])[], originX: number, originY: number, scale = 1): RasterOutline {
  return { x: points.map((p) => p[0]), y: points.map((p) => p[1]), originX, originY, scale, rgb: [10, 20, 30] };
}

function disc(samples: number, radius: number): [number, number][] {
  return Array.from({ length: samples }, (_, i) => {
    const t = (2 * Math.PI * i) / samples;
    return [radius * Math.cos(t), radius * Math.sin(t)];
  });
}

/** Shoelace area of a polygon. */
function shoelace(points: readonly (readonly [number, number])[]): number {
  let a = 0;
  for (let i = 0; i < points.length; i++) {
    const [x1, y1] = points[i]!;
    const [x2, y2] = points[(i + 1) % points.length]!;
    a += x1 * y2 - x2 * y1;
  }
  return Math.abs(a) / 2;
}

describe('rasterizeOutline', () => {
  it('fills a pixel-aligned square exactly: full pixels inside, nothing outside', () => {
    const t = target(10, 10);
    // y is up in outline units: the square spans pixel rows 2–5 and columns 2–5.
    rasterizeOutline(t, polygon([[0, 0], [4, 0], [4, 4], [0, 4]], 2, 6));
    for (let y = 0; y < 10; y++) {
      for (let x = 0; x < 10; x++) {
        const inside = x >= 2 && x < 6 && y >= 2 && y < 6;
        expect(t.data[(y * 10 + x) * 4 + 3], `pixel ${x},${y}`).toBe(inside ? 255 : 0);
      }
    }
    expect(Array.from(t.data.slice((3 * 10 + 3) * 4, (3 * 10 + 3) * 4 + 3))).toEqual([10, 20, 30]);
  });

  it('gives half coverage to pixels a vertical edge halves', () => {
    const t = target(10, 10);
    rasterizeOutline(t, polygon([[0, 0], [4, 0], [4, 4], [0, 4]], 2.5, 6));
    expect(t.data[(3 * 10 + 2) * 4 + 3]).toBe(128);
    expect(t.data[(3 * 10 + 6) * 4 + 3]).toBe(128);
    expect(t.data[(3 * 10 + 4) * 4 + 3]).toBe(255);
  });

  it('covers the area of a 256-vertex disc to within 0.5 %', () => {
    const t = target(64, 64);
    const points = disc(256, 1);
    rasterizeOutline(t, polygon(points, 31.3, 30.7, 12.4));
    const expected = shoelace(points) * 12.4 ** 2;
    expect(Math.abs(coveredArea(t.data) - expected) / expected).toBeLessThan(0.005);
  });

  it('clips an outline that leaves the target: a disc centred on a corner covers a quarter', () => {
    const t = target(40, 40);
    const points = disc(512, 20);
    rasterizeOutline(t, polygon(points, 0, 0));
    const quarter = shoelace(points) / 4;
    expect(Math.abs(coveredArea(t.data) - quarter) / quarter).toBeLessThan(0.01);
  });

  it('draws nothing for degenerate, non-finite or off-target outlines', () => {
    const t = target(8, 8);
    expect(rasterizeOutline(t, polygon([[0, 0], [1, 1]], 4, 4))).toBe(0);
    expect(rasterizeOutline(t, polygon([[0, 0], [1, Number.NaN], [1, 0]], 4, 4))).toBe(0);
    expect(rasterizeOutline(t, polygon([[0, 0], [2, 0], [2, 2]], 100, 100))).toBe(0);
    expect(coveredArea(t.data)).toBe(0);
  });

  it('keeps a concave outline\'s notch empty (even-odd spans)', () => {
    const t = target(12, 12);
    // A U shape: the notch spans columns 4–7, rows 1–6.
    rasterizeOutline(t, polygon([[0, 0], [10, 0], [10, 10], [7, 10], [7, 4], [3, 4], [3, 10], [0, 10]], 1, 11));
    expect(t.data[(3 * 12 + 5) * 4 + 3]).toBe(0);
    expect(t.data[(3 * 12 + 2) * 4 + 3]).toBe(255);
    expect(t.data[(9 * 12 + 5) * 4 + 3]).toBe(255);
  });
});

describe('parseHexColour', () => {
  it('reads #rrggbb and #rgb, and falls back on anything else', () => {
    expect(parseHexColour('#23262B', [0, 0, 0])).toEqual([0x23, 0x26, 0x2b]);
    expect(parseHexColour('#fa0', [0, 0, 0])).toEqual([0xff, 0xaa, 0x00]);
    expect(parseHexColour('teal', [1, 2, 3])).toEqual([1, 2, 3]);
  });
});
