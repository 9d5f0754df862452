import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import {
  classicalMds,
  directionData,
  mantelTest,
  pearson,
  perceptualRdm,
  procrustes,
  radialRates,
  seededRandom,
  smacof,
  spearman,
  StatsError,
  suggestEqualization,
  symmetricEigen,
  type SquareMatrix,
} from '@/lib/stats';

/** Euclidean distance matrix of row points. */
function distances(points: readonly (readonly number[])[]): SquareMatrix {
  const n = points.length;
  const values = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) values[i * n + j] = Math.hypot(...points[i]!.map((v, c) => v - points[j]![c]!));
  return { size: n, values };
}

describe('spearman', () => {
  it('gives ρ = −29/165 on the IQ vs TV-hours textbook example (REFERENCES.md, a widely reproduced example)', () => {
    const iq = [106, 86, 100, 101, 99, 103, 97, 113, 112, 110];
    const tv = [7, 0, 27, 50, 28, 29, 20, 12, 6, 17];
    expect(spearman(iq, tv)).toBeCloseTo(-29 / 165, 12);
  });

  it('uses average ranks for ties: equal to Pearson on the mid-ranks', () => {
    // Ranks of [1, 2, 2, 3] are [1, 2.5, 2.5, 4]; of [1, 3, 2, 4] are themselves.
    expect(spearman([1, 2, 2, 3], [1, 3, 2, 4])).toBeCloseTo(pearson([1, 2.5, 2.5, 4], [1, 3, 2, 4]), 14);
    expect(spearman([1, 2, 3], [3, 2, 1])).toBe(-1);
    expect(() => spearman([1, 2], [1])).toThrow(StatsError);
  });
});

describe('symmetricEigen (Jacobi)', () => {
  it('agrees with ml-matrix on random symmetric matrices (sizes 2–30, seeded), and its vectors satisfy Av = λv', () => {
    const random = seededRandom(20261202);
    for (const n of [2, 3, 5, 8, 13, 21, 30]) {
      const values = new Float64Array(n * n);
      for (let i = 0; i < n; i++) {
        for (let j = i; j < n; j++) {
          const v = random() * 4 - 2;
          values[i * n + j] = v;
          values[j * n + i] = v;
        }
      }
      const ours = symmetricEigen({ size: n, values });
      const rows = Array.from({ length: n }, (_, i) => Array.from(values.slice(i * n, i * n + n)));
      const reference = new EigenvalueDecomposition(new Matrix(rows), { assumeSymmetric: true }).realEigenvalues.slice().sort((a, b) => b - a);
      for (let k = 0; k < n; k++) expect(ours.values[k]).toBeCloseTo(reference[k]!, 10);
      for (let k = 0; k < n; k++) {
        for (let i = 0; i < n; i++) {
          let av = 0;
          for (let j = 0; j < n; j++) av += values[i * n + j]! * ours.vectors[j * n + k]!;
          expect(av).toBeCloseTo(ours.values[k]! * ours.vectors[i * n + k]!, 9);
        }
      }
    }
  });
});

describe('classicalMds', () => {
  it('places the unit square at 1/√2 from the centroid with eigenvalues 1, 1, 0, 0 (Torgerson 1952; Gower 1966; REFERENCES.md)', () => {
    const { eigenvalues, coordinates } = classicalMds(distances([[0, 0], [1, 0], [1, 1], [0, 1]]), 2);
    expect(eigenvalues).toHaveLength(4);
    [1, 1, 0, 0].forEach((l, k) => expect(eigenvalues[k]).toBeCloseTo(l, 12));
    for (const [x, y] of coordinates) expect(Math.hypot(x!, y!)).toBeCloseTo(1 / Math.SQRT2, 12);
    // The map reproduces the distances.
    const back = distances(coordinates);
    expect(back.values[0 * 4 + 2]).toBeCloseTo(Math.SQRT2, 12);
    expect(back.values[0 * 4 + 1]).toBeCloseTo(1, 12);
  });

  it('gives eigenvalues 16, 9, 0, 0 for the 3 × 4 rectangle (REFERENCES.md)', () => {
    const { eigenvalues } = classicalMds(distances([[0, 0], [4, 0], [4, 3], [0, 3]]), 2);
    [16, 9, 0, 0].forEach((l, k) => expect(eigenvalues[k]).toBeCloseTo(l, 10));
  });

  it('reports negative eigenvalues for non-Euclidean dissimilarities', () => {
    // A "triangle" violating the triangle inequality: d(0,2) > d(0,1) + d(1,2).
    const d = { size: 3, values: Float64Array.from([0, 1, 3, 1, 0, 1, 3, 1, 0]) };
    const { eigenvalues } = classicalMds(d, 2);
    expect(Math.min(...eigenvalues)).toBeLessThan(-0.1);
    expect(eigenvalues).toEqual([...eigenvalues].sort((a, b) => b - a));
  });
});

describe('smacof (weighted majorisation, de Leeuw & Mair 2009)', () => {
  const random = seededRandom(2009);
  const points = Array.from({ length: 14 }, () => [random() * 4 - 2, random() * 4 - 2]);
  const full = distances(points);
  /** The same matrix with a share of its pairs blanked (NaN), kept symmetric; a path through all items stays. */
  function withGaps(share: number, seed: number): SquareMatrix {
    const draw = seededRandom(seed);
    const n = full.size;
    const values = Float64Array.from(full.values);
    for (let i = 0; i < n; i++) for (let j = i + 2; j < n; j++) if (draw() < share) values[i * n + j] = values[j * n + i] = NaN;
    return { size: n, values };
  }

  it('recovers points in the plane from 45 % of their pairwise distances, up to rotation and translation', () => {
    const gaps = withGaps(0.45, 7);
    const blanks = Array.from(gaps.values).filter((v) => Number.isNaN(v)).length / 2;
    expect(blanks).toBeGreaterThan(25);
    const fit = smacof(gaps, 2, { tolerance: 1e-16, maxIterations: 5000 });
    expect(fit.pairsUsed).toBe((14 * 13) / 2 - blanks);
    expect(fit.stress).toBeLessThan(1e-6);
    const aligned = procrustes(points, fit.coordinates);
    // The recovered map matches the true points in shape and size (scale 1), the blank pairs included.
    expect(aligned.scale).toBeCloseTo(1, 5);
    expect(aligned.standardizedResidual).toBeLessThan(1e-8);
    const back = distances(fit.coordinates);
    for (let c = 0; c < full.values.length; c++) expect(back.values[c]).toBeCloseTo(full.values[c]!, 4);
  });

  it('never raises the stress, and improves on the classical map of noisy complete data', () => {
    const noise = seededRandom(11);
    const n = full.size;
    const noisy = Float64Array.from(full.values);
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) noisy[i * n + j] = noisy[j * n + i] = full.values[i * n + j]! * (1 + 0.2 * (noise() - 0.5));
    const fit = smacof({ size: n, values: noisy }, 2);
    for (let k = 1; k < fit.stressHistory.length; k++) expect(fit.stressHistory[k]!).toBeLessThanOrEqual(fit.stressHistory[k - 1]!);
    expect(fit.converged).toBe(true);
    // The start is the classical map, so the result can only be as good or better.
    const classical = classicalMds({ size: n, values: noisy }, 2).coordinates;
    const stressOf = (config: readonly (readonly number[])[]): number => {
      const d = distances(config);
      let num = 0, den = 0;
      for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) {
        num += (noisy[i * n + j]! - d.values[i * n + j]!) ** 2;
        den += noisy[i * n + j]! ** 2;
      }
      return Math.sqrt(num / den);
    };
    expect(fit.stress).toBeCloseTo(stressOf(fit.coordinates), 10);
    expect(fit.stress).toBeLessThan(stressOf(classical));
    expect(fit.stress).toBeGreaterThan(0.01);
  });

  it('refuses rated pairs that leave a stimulus unlinked, and bad options', () => {
    const n = 4;
    const values = new Float64Array(n * n).fill(NaN);
    for (let i = 0; i < n; i++) values[i * n + i] = 0;
    // 0–1 and 2–3 rated, nothing between the two pairs.
    values[1] = values[4] = 1;
    values[2 * n + 3] = values[3 * n + 2] = 1;
    expect(() => smacof({ size: n, values }, 2)).toThrow(/do not link every stimulus/);
    expect(() => smacof(full, 14)).toThrow(StatsError);
    expect(() => smacof({ size: 3, values: Float64Array.from([0, -1, 1, -1, 0, 1, 1, 1, 0]) }, 2)).toThrow(/finite and ≥ 0/);
  });
});

describe('procrustes', () => {
  it('recovers a known rotation, scale and translation exactly', () => {
    const random = seededRandom(99);
    const y = Array.from({ length: 12 }, () => [random() * 2 - 1, random() * 2 - 1]);
    const theta = 0.7, s = 2.5, t = [3, -1.25];
    const r = [[Math.cos(theta), Math.sin(theta)], [-Math.sin(theta), Math.cos(theta)]];
    const x = y.map(([a, b]) => [s * (a! * r[0]![0]! + b! * r[1]![0]!) + t[0]!, s * (a! * r[0]![1]! + b! * r[1]![1]!) + t[1]!]);
    const fit = procrustes(x, y);
    expect(fit.scale).toBeCloseTo(s, 12);
    fit.rotation.forEach((row, i) => row.forEach((v, j) => expect(v).toBeCloseTo(r[i]![j]!, 12)));
    fit.translation.forEach((v, i) => expect(v).toBeCloseTo(t[i]!, 12));
    expect(fit.residual).toBeLessThan(1e-20);
  });

  it('undoes a reflection too, and leaves a positive residual for noisy data', () => {
    const y = [[0, 0], [1, 0], [0, 2], [3, 1]];
    const x = y.map(([a, b]) => [a!, -b!]);
    const fit = procrustes(x, y);
    expect(fit.residual).toBeLessThan(1e-20);
    expect(fit.rotation[1]![1]).toBeCloseTo(-1, 12);
    const noisy = procrustes([[0, 0], [1, 0.1], [0, 2], [3, 1.3]], y);
    expect(noisy.residual).toBeGreaterThan(0.001);
    expect(noisy.standardizedResidual).toBeLessThan(1);
  });
});

describe('mantelTest', () => {
  it('finds a strong association significant and keeps p = (b + 1)/(m + 1) on its grid', () => {
    const random = seededRandom(5);
    const points = Array.from({ length: 12 }, () => [random(), random()]);
    const a = distances(points);
    const b = distances(points.map(([x, y]) => [x! + 0.02 * random(), y! + 0.02 * random()]));
    for (const method of ['pearson', 'spearman'] as const) {
      const r = mantelTest(a, b, { permutations: 5000, seed: 1, method });
      expect(r.statistic).toBeGreaterThan(0.9);
      expect(r.p).toBeCloseTo(1 / 5001, 12);
    }
    expect(() => mantelTest(a, b, { permutations: 999, seed: 1, method: 'pearson' })).toThrow(/5000/);
  });

  it('is uniform under the null: over 200 seeded pairs of independent matrices, P(p ≤ α) ≈ α (North, Curtis & Sham 2002)', () => {
    const random = seededRandom(424242);
    const ps: number[] = [];
    for (let s = 0; s < 200; s++) {
      const a = distances(Array.from({ length: 8 }, () => [random(), random()]));
      const b = distances(Array.from({ length: 8 }, () => [random(), random()]));
      ps.push(mantelTest(a, b, { permutations: 5000, seed: s, method: 'spearman' }).p);
    }
    // Binomial(200, α) SD: √(200·α(1−α)); allow 3 SD.
    for (const alpha of [0.1, 0.25, 0.5]) {
      const hits = ps.filter((p) => p <= alpha).length;
      expect(Math.abs(hits - 200 * alpha)).toBeLessThan(3 * Math.sqrt(200 * alpha * (1 - alpha)));
    }
    const mean = ps.reduce((t, p) => t + p, 0) / ps.length;
    // A uniform's mean is 1/2 with SD 0.289/√200 ≈ 0.02.
    expect(Math.abs(mean - 0.5)).toBeLessThan(0.07);
  }, 60_000);
});

describe('perceptualRdm', () => {
  it('turns mean ratings into dissimilarities (7 = most similar → 0), leaves unrated pairs NaN, and splits by participant', () => {
    const ids = ['a', 'b', 'c', 'd'];
    const ratings = [
      { participant: 0, first: 'a', second: 'b', rating: 7 },
      { participant: 1, first: 'b', second: 'a', rating: 5 },
      { participant: 0, first: 'a', second: 'c', rating: 1 },
      { participant: 1, first: 'a', second: 'c', rating: 2 },
      { participant: 0, first: 'b', second: 'c', rating: 4 },
      { participant: 1, first: 'c', second: 'b', rating: 4 },
      { participant: 0, first: 'c', second: 'd', rating: 3 },
      { participant: 1, first: 'c', second: 'd', rating: 3 },
    ];
    const rdm = perceptualRdm(ids, ratings, { scaleMax: 7 });
    expect(rdm.values[0 * 4 + 1]).toBeCloseTo((7 - 6) / 6, 14);
    expect(rdm.values[1 * 4 + 0]).toBeCloseTo((7 - 6) / 6, 14);
    expect(rdm.values[0 * 4 + 2]).toBeCloseTo((7 - 1.5) / 6, 14);
    expect(Number.isNaN(rdm.values[0 * 4 + 3]!)).toBe(true);
    expect(rdm.counts[0 * 4 + 1]).toBe(2);
    expect(rdm.participants).toBe(2);
    // Halves: participant 0 gives dissimilarities over (ab, ac, bc, cd) ∝ 0, 6, 3, 4; participant 1: 2, 5, 3, 4.
    // Ranks 1 4 2 3 vs 1 4 2 3: ρ = 1, so the Spearman–Brown ceiling is 1.
    expect(rdm.noiseCeiling).toMatchObject({ split: 'participants', splitHalf: 1, ceiling: 1, pairs: 4 });
  });

  it('steps up the split-half ρ by Spearman–Brown, 2ρ/(1 + ρ), and splits one participant by repetition', () => {
    const ids = ['a', 'b', 'c', 'd'];
    const first = [['a', 'b', 1], ['a', 'c', 2], ['a', 'd', 3], ['b', 'c', 4], ['b', 'd', 5], ['c', 'd', 6]] as const;
    const second = [['a', 'b', 2], ['a', 'c', 1], ['a', 'd', 3], ['b', 'c', 4], ['b', 'd', 6], ['c', 'd', 5]] as const;
    const ratings = [...first, ...second].map(([f, s, rating]) => ({ participant: 3, first: f, second: s, rating }));
    const rdm = perceptualRdm(ids, ratings, { scaleMax: 7 });
    const rho = spearman([1, 2, 3, 4, 5, 6], [2, 1, 3, 4, 6, 5]);
    expect(rdm.noiseCeiling!.split).toBe('repetitions');
    expect(rdm.noiseCeiling!.splitHalf).toBeCloseTo(rho, 14);
    expect(rdm.noiseCeiling!.ceiling).toBeCloseTo((2 * rho) / (1 + rho), 14);
    expect(() => perceptualRdm(ids, [{ participant: 0, first: 'a', second: 'b', rating: 8 }], { scaleMax: 7 })).toThrow(StatsError);
  });
});

describe('directionData, radialRates and suggestEqualization', () => {
  it('pools answers per direction and position, counting "A"', () => {
    const d = directionData([
      { directionDeg: 90, position: 0.5, chose: 'A' },
      { directionDeg: 0, position: -0.5, chose: 'B' },
      { directionDeg: 0, position: 0.5, chose: 'A' },
      { directionDeg: 0, position: 0.5, chose: 'B' },
    ]);
    expect(d).toEqual([
      { directionDeg: 0, data: { x: [-0.5, 0.5], n: [1, 2], k: [0, 1] } },
      { directionDeg: 90, data: { x: [0.5], n: [1], k: [1] } },
    ]);
  });

  it('measures the map rate per ray (a map stretched ×2 along b gives rates 1 and 2)', () => {
    const stimuli = [0, Math.PI / 2].flatMap((angle) => [1, 2].map((rho) => ({ rho, angle, recovered: [rho * Math.cos(angle), 2 * rho * Math.sin(angle)] as [number, number] })));
    const rates = radialRates([{ rho: 0, angle: 0, recovered: [0, 0] }, ...stimuli]);
    expect(rates.map((r) => r.angle)).toEqual([0, Math.PI / 2]);
    expect(rates[0]!.rate).toBeCloseTo(1, 12);
    expect(rates[1]!.rate).toBeCloseTo(2, 12);
  });

  it('compresses faster directions to the slowest one, predicting a ratio of 1, unless the floor holds a scale', () => {
    const s = suggestEqualization([{ angle: 0, rate: 2 }, { angle: 1, rate: 4 }, { angle: 2, rate: 2.5 }]);
    expect(s.ratioBefore).toBeCloseTo(2, 14);
    expect(s.directions.map((d) => d.scale)).toEqual([1, 0.5, 0.8]);
    expect(s.ratioAfter).toBeCloseTo(1, 14);
    const floored = suggestEqualization([{ angle: 0, rate: 1 }, { angle: 1, rate: 10 }], { minScale: 0.25 });
    expect(floored.directions[1]).toMatchObject({ scale: 0.25, limited: true });
    expect(floored.ratioAfter).toBeCloseTo(2.5, 14);
    expect(() => suggestEqualization([{ angle: 0, rate: -1 }])).toThrow(StatsError);
  });
});
