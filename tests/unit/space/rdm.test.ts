import { describe, expect, it } from 'vitest';
import { rasterizeContour, silhouetteDistance, synthesizeContour, type Contour } from '@/lib/shape';
import {
  condenseRdm,
  contourRdm,
  contourSpectrum,
  designRdm,
  generateSpace,
  rdmEntry,
  silhouetteRdm,
  spectrumDistance,
  stimulusContour,
  type Rdm,
} from '@/lib/space';
import { radialSpace } from './support';

const { stimuli } = generateSpace(radialSpace({ kind: 'rings', rings: 2, spokes: 6 }));
const contours = stimuli.map((s) => stimulusContour(s, 256));

function expectSymmetricZeroDiagonal(rdm: Rdm, n: number): void {
  expect(rdm.size).toBe(n);
  expect(rdm.values).toHaveLength(n * n);
  for (let i = 0; i < n; i++) {
    expect(rdmEntry(rdm, i, i)).toBe(0);
    for (let j = 0; j < n; j++) expect(rdmEntry(rdm, i, j)).toBe(rdmEntry(rdm, j, i));
  }
}

describe('model RDMs', () => {
  it('are symmetric with a zero diagonal, and off-diagonal entries are positive for distinct stimuli', () => {
    for (const rdm of [designRdm(stimuli), contourRdm(contours), silhouetteRdm(contours, { resolution: 128 })]) {
      expectSymmetricZeroDiagonal(rdm, stimuli.length);
      expect(Math.min(...condenseRdm(rdm))).toBeGreaterThan(0);
    }
  });

  it('design: Euclidean distance in (a, b)', () => {
    const rdm = designRdm(stimuli);
    stimuli.forEach((p, i) => stimuli.forEach((q, j) => expect(rdmEntry(rdm, i, j)).toBeCloseTo(Math.hypot(p.position.a - q.position.a, p.position.b - q.position.b), 15)));
    // Opposite spokes of ring 2 (ρ = 1) are a diameter apart.
    const i = stimuli.findIndex((s) => s.id === 'r02-s00');
    const j = stimuli.findIndex((s) => s.id === 'r02-s03');
    expect(rdmEntry(rdm, i, j)).toBeCloseTo(2, 14);
  });

  it('contour: every entry is the pair’s spectrumDistance', () => {
    const rdm = contourRdm(contours);
    const spectra = contours.map(contourSpectrum);
    for (let i = 0; i < spectra.length; i++) for (let j = 0; j < spectra.length; j++) if (i !== j) expect(rdmEntry(rdm, i, j)).toBeCloseTo(spectrumDistance(spectra[i]!, spectra[j]!), 12);
  });

  it('silhouette: every entry equals lib/shape’s 1 − IoU on the same raster', () => {
    const extent = { minX: -1.6, minY: -1.6, size: 3.2 };
    const rdm = silhouetteRdm(contours, { resolution: 100, extent });
    const masks = contours.map((c) => rasterizeContour(c, { resolution: 100, extent }));
    for (let i = 0; i < masks.length; i++) for (let j = 0; j < masks.length; j++) if (i !== j) expect(rdmEntry(rdm, i, j)).toBeCloseTo(silhouetteDistance(masks[i]!, masks[j]!), 14);
  });

  it('silhouette: concentric discs of radius 1 and 2 are 1 − (1/2)² = 3/4 apart', () => {
    // Derived: nested discs intersect in the small one, so IoU is the area ratio.
    const discs: Contour[] = [1, 2].map((r) => synthesizeContour({ family: 'radial', baseRadius: r, terms: [] }, 1024));
    expect(rdmEntry(silhouetteRdm(discs, { resolution: 512 }), 0, 1)).toBeCloseTo(0.75, 2);
  });

  it('reports progress from 0 to 1, in order', () => {
    for (const run of [(p: (f: number) => void) => contourRdm(contours, { onProgress: p }), (p: (f: number) => void) => silhouetteRdm(contours, { resolution: 64, onProgress: p })]) {
      const seen: number[] = [];
      run((f) => seen.push(f));
      expect(seen.length).toBeGreaterThan(2);
      expect(seen.at(-1)).toBe(1);
      seen.forEach((f, i) => {
        expect(f).toBeGreaterThanOrEqual(i === 0 ? 0 : (seen[i - 1] as number));
        expect(f).toBeLessThanOrEqual(1);
      });
    }
  });

  it('condenses the upper triangle row by row, and refuses indices outside the matrix', () => {
    const rdm: Rdm = { size: 3, values: Float64Array.from([0, 1, 2, 1, 0, 3, 2, 3, 0]) };
    expect(Array.from(condenseRdm(rdm))).toEqual([1, 2, 3]);
    expect(() => rdmEntry(rdm, 3, 0)).toThrow(/outside a 3 × 3/);
  });
});
