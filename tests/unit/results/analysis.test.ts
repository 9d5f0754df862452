import { describe, expect, it } from 'vitest';
import { analyseCategorisation, analyseCategorisationNow, assembleDirectionData, countFitSets, fitSetSeed, type AnalysisOptions, type ResultTrial } from '@/lib/results';
import { evaluatePsychometric, seededRandom } from '@/lib/stats';

const LEVELS = [-0.8, -0.533, -0.267, 0, 0.267, 0.533, 0.8];
/** Seconds of fitting when idle; the shared 2-core machine runs it several times slower under load. */
const ANALYSIS_TIMEOUT_MS = 60_000;
const OPTIONS: AnalysisOptions = { link: 'logit', lapse: { max: 0.06 }, resamples: 200, seed: 99, alpha: 0.05 };

/** Invented observers answering a logistic ψ with the given spread per direction (seeded). */
function simulate(participants: number, spreads: Record<number, number>, repetitions: number, seed: number): ResultTrial[] {
  const random = seededRandom(seed);
  const trials: ResultTrial[] = [];
  for (let p = 0; p < participants; p++) {
    let index = 0;
    for (const [direction, spread] of Object.entries(spreads)) {
      for (const x of LEVELS) {
        for (let r = 0; r < repetitions; r++) {
          const choseB = random() < evaluatePsychometric('logit', { threshold: 0, spread, lapse: 0.01 }, x);
          trials.push({ participant: p, trialIndex: index++, directionDeg: Number(direction), x, choseB, rtMs: 600, isCatch: false, isCorrect: null });
        }
      }
    }
  }
  return trials;
}

describe('assembleDirectionData', () => {
  it('counts n and k per level for each participant and sums them for the pooled data', () => {
    const t = (participant: number, directionDeg: number, x: number, choseB: boolean | null, trialIndex: number): ResultTrial => ({ participant, trialIndex, directionDeg, x, choseB, rtMs: 500, isCatch: false, isCorrect: null });
    const data = assembleDirectionData(
      [t(1, 90, 0.5, true, 0), t(1, 90, 0.5, false, 1), t(1, 90, -0.5, false, 2), t(0, 90, 0.5, true, 0), t(0, 90, 0.5, null, 1), t(0, 0, 0.5, true, 2)],
      [0, 90, 45],
    );
    expect(data.participants.map((p) => p.participant)).toEqual([0, 1]);
    expect(data.pooled.map((d) => d.directionDeg)).toEqual([0, 90, 45]);
    expect(data.pooled[1]).toEqual({ directionDeg: 90, data: { x: [-0.5, 0.5], n: [1, 3], k: [0, 2] }, trials: 4, misses: 1 });
    expect(data.participants[1]!.directions[1]!.data).toEqual({ x: [-0.5, 0.5], n: [1, 2], k: [0, 1] });
    expect(data.pooled[2]).toEqual({ directionDeg: 45, data: { x: [], n: [], k: [] }, trials: 0, misses: 0 });
  });
});

describe('analyseCategorisation', () => {
  it('recovers an isotropic observer group, reports progress to the end, and is reproducible', () => {
    const data = assembleDirectionData(simulate(3, { 0: 0.12, 45: 0.12, 90: 0.12, 135: 0.12 }, 8, 1), [0, 45, 90, 135]);
    expect(countFitSets(data)).toBe(16);
    const steps = analyseCategorisation(data, OPTIONS);
    const seen: number[] = [];
    let step = steps.next();
    while (!step.done) {
      seen.push(step.value.done);
      expect(step.value.total).toBe(17);
      step = steps.next();
    }
    expect(seen).toEqual(Array.from({ length: 17 }, (_, i) => i + 1));
    const a = step.value;
    expect(a.pooled).toHaveLength(4);
    for (const fit of a.pooled) {
      expect(fit.fit).not.toBeNull();
      expect(Math.abs(fit.fit!.threshold)).toBeLessThan(0.1);
      expect(fit.intervals!.threshold[0]).toBeLessThan(fit.fit!.threshold);
      expect(fit.intervals!.threshold[1]).toBeGreaterThan(fit.fit!.threshold);
      expect(fit.goodnessOfFit!.p).toBeGreaterThan(0);
    }
    expect(a.slopeTests.every((t) => t.test?.df === 3)).toBe(true);
    expect(a.groupSlopeTest!.df).toBe(9);
    expect(a.noBiasTest!.df).toBe(4);
    expect(a.slopeRatio!.ratio).toBeGreaterThanOrEqual(1);
    expect(a.verdict!.text).toMatch(/slope/);
    expect(analyseCategorisationNow(data, OPTIONS)).toEqual(a);
    expect(analyseCategorisationNow(data, { ...OPTIONS, seed: 100 }).pooled[0]!.intervals).not.toEqual(a.pooled[0]!.intervals);
  }, ANALYSIS_TIMEOUT_MS);

  it('finds a threefold slope difference between two directions with enough trials', () => {
    const data = assembleDirectionData(simulate(4, { 0: 0.06, 90: 0.18 }, 20, 2), [0, 90]);
    const a = analyseCategorisationNow(data, OPTIONS);
    expect(a.groupSlopeTest!.p).toBeLessThan(0.01);
    expect(a.verdict!.hasSlopeDifference).toBe(true);
    expect(a.slopeRatio!.interval[0]).toBeGreaterThan(1.5);
  }, ANALYSIS_TIMEOUT_MS);

  it('reports, rather than fails on, directions too thin to fit and a single direction', () => {
    const trials = simulate(1, { 0: 0.1 }, 6, 3);
    const thin: ResultTrial = { participant: 0, trialIndex: 999, directionDeg: 90, x: 0.8, choseB: true, rtMs: 500, isCatch: false, isCorrect: null };
    const a = analyseCategorisationNow(assembleDirectionData([...trials, thin], [0, 90]), OPTIONS);
    expect(a.pooled[1]!.fit).toBeNull();
    expect(a.pooled[1]!.problem).toMatch(/1 level/);
    expect(a.slopeTests[0]!.test).toBeNull();
    expect(a.groupSlopeTest).toBeNull();
    expect(a.verdict).toBeNull();
    expect(a.notes.length).toBeGreaterThan(0);
  }, ANALYSIS_TIMEOUT_MS);

  it('gives every fit set its own seed', () => {
    const seeds = new Set(Array.from({ length: 1000 }, (_, i) => fitSetSeed(7, i)));
    expect(seeds.size).toBe(1000);
  });
});
