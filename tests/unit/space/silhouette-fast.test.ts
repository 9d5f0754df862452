import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { rasterizeContour, silhouetteDistance, synthesizeContour, type Contour, type RasterExtent } from '@/lib/shape';
import {
  descriptorSpectrum,
  generateSpace,
  rdmEntry,
  rdmFromRows,
  silhouetteExtent,
  silhouetteRdm,
  silhouetteRdmRows,
  spectrumRdm,
  spectrumRdmRows,
  splitRdmRows,
  stimulusContour,
} from '@/lib/space';
import { silhouetteRuns } from '@/lib/space/silhouette-runs';
import { PROPERTY_SEED, radialSpace } from './support';

/** A closed polygon from polar vertices: radius r_i at angle θ_i (unsorted angles make self-crossing outlines). */
const polygon = (vertices: readonly (readonly [number, number])[], shift: readonly [number, number]): Contour => ({
  x: Float64Array.from(vertices, ([r, t]) => shift[0] + r * Math.cos(t)),
  y: Float64Array.from(vertices, ([r, t]) => shift[1] + r * Math.sin(t)),
});

/** Star-shaped outlines (one run a row), spiky and self-crossing ones (several runs a row), shifted about. */
const outline = fc
  .tuple(
    fc.array(fc.tuple(fc.double({ min: 0.05, max: 1.4, noNaN: true }), fc.double({ min: 0, max: 2 * Math.PI, noNaN: true })), { minLength: 3, maxLength: 40 }),
    fc.boolean(),
    fc.tuple(fc.double({ min: -0.6, max: 0.6, noNaN: true }), fc.double({ min: -0.6, max: 0.6, noNaN: true })),
  )
  .map(([vertices, star, shift]) => polygon(star ? [...vertices].sort((p, q) => p[1] - q[1]) : vertices, shift));

/** The plain definition: lib/shape's bitmask, read pixel by pixel. */
function bitmaskPixels(contour: Contour, resolution: number, extent: RasterExtent): Set<number> {
  const { bits, wordsPerRow } = rasterizeContour(contour, { resolution, extent });
  const set = new Set<number>();
  for (let row = 0; row < resolution; row++) for (let col = 0; col < resolution; col++) if ((((bits[row * wordsPerRow + (col >>> 5)] as number) >>> (col & 31)) & 1) === 1) set.add(row * resolution + col);
  return set;
}

function runPixels(contour: Contour, resolution: number, extent: RasterExtent): Set<number> {
  const { rowStart, runs, count } = silhouetteRuns(contour, resolution, extent);
  const set = new Set<number>();
  for (let row = 0; row < resolution; row++) {
    for (let m = rowStart[row] as number; m < (rowStart[row + 1] as number); m++) for (let col = runs[2 * m] as number; col < (runs[2 * m + 1] as number); col++) set.add(row * resolution + col);
  }
  expect(set.size).toBe(count);
  return set;
}

describe('silhouette RDM fast path', () => {
  it('silhouetteRuns sets exactly the pixels of lib/shape’s rasterizeContour, clipped outlines included', () => {
    fc.assert(
      fc.property(outline, fc.integer({ min: 1, max: 97 }), fc.double({ min: 1.2, max: 4, noNaN: true }), (contour, resolution, size) => {
        // A square that sometimes clips the outline, so edges past the raster are handled as rasterizeContour does.
        const extent = { minX: -size / 2, minY: -size / 2 + 0.1, size };
        expect(runPixels(contour, resolution, extent)).toEqual(bitmaskPixels(contour, resolution, extent));
      }),
      { seed: PROPERTY_SEED, numRuns: 150 },
    );
  });

  it('every silhouetteRdm entry is exactly the bitmask 1 − IoU (lib/shape’s silhouetteDistance)', () => {
    fc.assert(
      fc.property(fc.array(outline, { minLength: 2, maxLength: 7 }), fc.integer({ min: 8, max: 130 }), (contours, resolution) => {
        const extent = { minX: -2.1, minY: -2.1, size: 4.2 };
        const rdm = silhouetteRdm(contours, { resolution, extent });
        const masks = contours.map((c) => rasterizeContour(c, { resolution, extent }));
        for (let i = 0; i < contours.length; i++) for (let j = 0; j < contours.length; j++) if (i !== j) expect(rdmEntry(rdm, i, j)).toBe(silhouetteDistance(masks[i]!, masks[j]!));
      }),
      { seed: PROPERTY_SEED, numRuns: 60 },
    );
  });

  it('agrees exactly at the default 256² raster on smooth radial shapes', () => {
    const contours = [0, 0.05, 0.1, 0.2].map((a, i) => synthesizeContour({ family: 'radial', baseRadius: 1, terms: [{ k: 3 + i, amplitude: a, phase: i }] }, 512));
    const rdm = silhouetteRdm(contours);
    // The default extent: the union bounding square, 2 % margin each side (silhouetteRdm's own rule).
    const xs = contours.flatMap((c) => [...c.x]), ys = contours.flatMap((c) => [...c.y]);
    const side = Math.max(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys)) * (1 + 2 * 0.02);
    const extent = { minX: (Math.min(...xs) + Math.max(...xs) - side) / 2, minY: (Math.min(...ys) + Math.max(...ys) - side) / 2, size: side };
    const masks = contours.map((c) => rasterizeContour(c, { resolution: 256, extent }));
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) if (i !== j) expect(rdmEntry(rdm, i, j)).toBe(silhouetteDistance(masks[i]!, masks[j]!));
  });

  it('refuses resolutions outside 1 … 4096 and an empty extent', () => {
    const contour = synthesizeContour({ family: 'radial', baseRadius: 1, terms: [] }, 64);
    const extent = { minX: -1, minY: -1, size: 2 };
    expect(() => silhouetteRuns(contour, 0, extent)).toThrow(/resolution/);
    expect(() => silhouetteRuns(contour, 4097, extent)).toThrow(/resolution/);
    expect(() => silhouetteRuns(contour, 2.5, extent)).toThrow(/resolution/);
    expect(() => silhouetteRuns(contour, 16, { minX: 0, minY: 0, size: 0 })).toThrow(/extent/);
  });
});

describe('RDM rows computed apart', () => {
  const stimuli = generateSpace(radialSpace({ kind: 'rings', rings: 3, spokes: 7 })).stimuli;
  const contours = stimuli.map((s) => stimulusContour(s, 128));
  const spectra = stimuli.map((s) => descriptorSpectrum(s.descriptor));

  it('splitRdmRows covers every row once, in blocks of about equal pair counts', () => {
    for (const [n, parts] of [[22, 4], [1001, 8], [5, 9], [1, 3], [2, 2]] as const) {
      const blocks = splitRdmRows(n, parts);
      expect(blocks[0]!.from).toBe(0);
      expect(blocks.at(-1)!.to).toBe(n);
      blocks.forEach((b, i) => {
        expect(b.to).toBeGreaterThan(b.from);
        if (i > 0) expect(b.from).toBe(blocks[i - 1]!.to);
      });
      if (n === 1001) {
        const pairs = blocks.map((b) => ((b.to - b.from) * (2 * n - 1 - b.from - b.to)) / 2);
        expect(Math.max(...pairs) / Math.min(...pairs)).toBeLessThan(1.02);
      }
    }
  });

  it('silhouette and contour blocks join to exactly the whole-matrix values', () => {
    const extent = silhouetteExtent(contours);
    for (const parts of [1, 3, 5]) {
      const blocks = splitRdmRows(contours.length, parts);
      const silhouette = rdmFromRows(contours.length, blocks.map((b) => silhouetteRdmRows(contours, b.from, b.to, { resolution: 96, extent })).reverse());
      expect(Array.from(silhouette.values)).toEqual(Array.from(silhouetteRdm(contours, { resolution: 96 }).values));
      const contour = rdmFromRows(spectra.length, blocks.map((b) => spectrumRdmRows(spectra, b.from, b.to)));
      expect(Array.from(contour.values)).toEqual(Array.from(spectrumRdm(spectra).values));
    }
  });

  it('refuses blocks that miss or repeat a row', () => {
    const a = spectrumRdmRows(spectra, 0, 10);
    const b = spectrumRdmRows(spectra, 10, spectra.length);
    expect(() => rdmFromRows(spectra.length, [a])).toThrow(/no block/);
    expect(() => rdmFromRows(spectra.length, [a, a, b])).toThrow(/two blocks/);
    expect(() => spectrumRdmRows(spectra, 5, 2)).toThrow(RangeError);
  });
});
