import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  balancedPairCounts,
  balancedPairSubset,
  buildTrialPlan,
  categorisationLevels,
  checkFlashRate,
  checkStudyDesign,
  countPlannedTrials,
  estimateDuration,
  summarizePlan,
  type CategorisationTask,
  type CategorisationTrial,
  type SimilarityTask,
  type SimilarityTrial,
  type StudyDesign,
} from '@/lib/study';
import { seededRandom } from '@/lib/sequence/seeded-random';

const CATEGORISATION: CategorisationTask = {
  directionsDeg: [0, 22.5, 45, 67.5, 90, 112.5, 135, 157.5],
  steps: 9,
  extent: 0.8,
  repetitions: 4,
  blocking: 'interleaved',
  practiceTrials: 6,
  catchRate: 0.1,
  timing: { fixationMs: 500, probeMs: 300, blankMs: 200, responseMs: 2000, itiMs: 600 },
  keys: ['f', 'j'],
};
const SIMILARITY: SimilarityTask = {
  pairSet: 'balanced',
  pairCount: 30,
  presentation: 'sequential',
  scaleLow: 'Very different',
  scaleHigh: 'Very similar',
  repetitions: 2,
  timing: { fixationMs: 500, stimulusMs: 800, gapMs: 400, responseMs: 4000, itiMs: 600 },
};
const design = (over: Partial<StudyDesign> = {}): StudyDesign => ({ seed: 20261202, stimulusSizeDeg: 4, categorisation: CATEGORISATION, similarity: SIMILARITY, ...over });
const STIMULI = { stimulusIds: Array.from({ length: 12 }, (_, i) => `s${i}`) };
const cat = (trials: readonly { task: string }[]) => trials.filter((t): t is CategorisationTrial => t.task === 'categorisation');
const sim = (trials: readonly { task: string }[]) => trials.filter((t): t is SimilarityTrial => t.task === 'similarity');

describe('categorisation levels', () => {
  it('spaces odd step counts evenly from −extent to +extent with the centre at 0', () => {
    expect(categorisationLevels({ steps: 7, extent: 0.9 })).toEqual([-0.9, -0.6, -0.3, 0, 0.3, 0.6, 0.9].map((v) => expect.closeTo(v, 12)));
  });
});

describe('trial plans', () => {
  it('gives every (direction, level) cell its repetitions, and catch and practice trials as set', () => {
    const plan = buildTrialPlan(design(), STIMULI, 3);
    const summary = summarizePlan(plan, CATEGORISATION);
    expect(summary.cells).toHaveLength(8 * 9);
    for (const cell of summary.cells) expect(cell.trials).toBe(4);
    // Per direction 36 ordinary trials; catch c = round(36·0.1/0.9) = 4, half on each anchor.
    const catches = cat(plan.trials).filter((t) => t.isCatch);
    expect(catches).toHaveLength(8 * 4);
    for (const d of CATEGORISATION.directionsDeg) {
      const mine = catches.filter((t) => t.directionDeg === d);
      expect(mine.filter((t) => t.level === 8)).toHaveLength(2);
      expect(mine.filter((t) => t.level === 0)).toHaveLength(2);
    }
    expect(cat(plan.trials).filter((t) => t.isPractice)).toHaveLength(6);
    expect(cat(plan.trials).slice(0, 6).every((t) => t.isPractice && t.block === 0)).toBe(true);
    const counts = countPlannedTrials(design(), 12);
    expect(plan.trials).toHaveLength(counts.total);
    expect(counts.categorisation).toBe(8 * (36 + 4) + 6);
    expect(counts.similarity).toBe(60);
    expect(plan.trials.map((t) => t.index)).toEqual(plan.trials.map((_, i) => i));
  });

  it('the probe sits on the diameter: ρ = |position|, angle θ or θ + 180°, and the right key picks the nearer anchor', () => {
    const plan = buildTrialPlan(design(), STIMULI, 0);
    for (const t of cat(plan.trials)) {
      expect(t.probe.rho).toBeCloseTo(Math.abs(t.position), 12);
      if (t.position < 0) expect(t.probe.angleDeg).toBeCloseTo((t.directionDeg + 180) % 360, 9);
      else expect(t.probe.angleDeg).toBeCloseTo(t.directionDeg, 9);
      const nearer = t.position > 0 ? 'A' : t.position < 0 ? 'B' : null;
      const expected = nearer === null ? null : nearer === t.leftAnchor ? plan.keys!.left : plan.keys!.right;
      expect(t.correctKey).toBe(expected);
    }
  });

  it('blocked designs give each direction its own block, in an order that differs between participants', () => {
    const blocked = design({ categorisation: { ...CATEGORISATION, blocking: 'blocked', practiceTrials: 0, catchRate: 0 }, similarity: null });
    const orders = [0, 1, 2, 3, 4, 5].map((p) => {
      const trials = cat(buildTrialPlan(blocked, STIMULI, p).trials);
      const order: number[] = [];
      for (let b = 0; b < 8; b++) {
        const dirs = new Set(trials.filter((t) => t.block === b).map((t) => t.directionIndex));
        expect(dirs.size).toBe(1);
        order.push([...dirs][0]!);
      }
      expect(new Set(order).size).toBe(8);
      return order.join(',');
    });
    expect(new Set(orders).size).toBeGreaterThan(1);
  });

  it('the same seed and participant give the same plan; another seed or participant a different one', () => {
    const a = buildTrialPlan(design(), STIMULI, 7);
    expect(buildTrialPlan(design(), STIMULI, 7)).toEqual(a);
    expect(buildTrialPlan(design({ seed: 20261203 }), STIMULI, 7).trials).not.toEqual(a.trials);
    expect(buildTrialPlan(design(), STIMULI, 8).trials).not.toEqual(a.trials);
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 0xffffffff }), fc.integer({ min: 0, max: 10_000 }), (seed, p) => {
        const d = design({ seed, similarity: null });
        expect(buildTrialPlan(d, STIMULI, p)).toEqual(buildTrialPlan(d, STIMULI, p));
      }),
      { numRuns: 25 },
    );
  });

  it('balances anchor sides within each cell (even repetitions) and across participant pairs (odd repetitions)', () => {
    const even = summarizePlan(buildTrialPlan(design(), STIMULI, 5), CATEGORISATION);
    for (const cell of even.cells) expect(cell.leftA).toBe(2);
    const odd = design({ categorisation: { ...CATEGORISATION, repetitions: 3 } });
    const p0 = summarizePlan(buildTrialPlan(odd, STIMULI, 0), odd.categorisation);
    const p1 = summarizePlan(buildTrialPlan(odd, STIMULI, 1), odd.categorisation);
    p0.cells.forEach((cell, i) => {
      expect(Math.abs(cell.leftA * 2 - cell.trials)).toBe(1);
      expect(cell.leftA + p1.cells[i]!.leftA).toBe(3);
    });
    // Over all ordinary trials the sides are even to within one.
    const ordinary = cat(buildTrialPlan(odd, STIMULI, 0).trials).filter((t) => !t.isCatch && !t.isPractice);
    expect(Math.abs(ordinary.filter((t) => t.leftAnchor === 'A').length * 2 - ordinary.length)).toBeLessThanOrEqual(1);
  });

  it('counterbalances the key mapping across participants: even and odd indices swap the keys', () => {
    const keys = [0, 1, 2, 3].map((p) => buildTrialPlan(design(), STIMULI, p).keys);
    expect(keys).toEqual([
      { left: 'f', right: 'j' },
      { left: 'j', right: 'f' },
      { left: 'f', right: 'j' },
      { left: 'j', right: 'f' },
    ]);
    // The same trial cell needs the other key when the mapping swaps (side held equal).
    const t0 = cat(buildTrialPlan(design(), STIMULI, 0).trials).filter((t) => t.level === 8 && t.leftAnchor === 'A');
    const t1 = cat(buildTrialPlan(design(), STIMULI, 1).trials).filter((t) => t.level === 8 && t.leftAnchor === 'A');
    expect(new Set(t0.map((t) => t.correctKey))).toEqual(new Set(['f']));
    expect(new Set(t1.map((t) => t.correctKey))).toEqual(new Set(['j']));
  });
});

describe('pair similarity', () => {
  it('"all pairs" uses every unordered pair `repetitions` times, with the two orders alternating', () => {
    const d = design({ categorisation: null, similarity: { ...SIMILARITY, pairSet: 'all', pairCount: null, repetitions: 2 } });
    const trials = sim(buildTrialPlan(d, STIMULI, 0).trials);
    expect(trials).toHaveLength(66 * 2);
    const unordered = new Map<string, string[]>();
    for (const t of trials) {
      const key = [t.first, t.second].sort().join('|');
      unordered.set(key, [...(unordered.get(key) ?? []), t.first]);
    }
    expect(unordered.size).toBe(66);
    for (const firsts of unordered.values()) expect(new Set(firsts).size).toBe(2);
  });

  it('a balanced subset of K pairs uses each stimulus equally often, with no pair twice', () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 40 }), fc.integer({ min: 0, max: 1000 }), fc.integer({ min: 0, max: 0xffffffff }), (n, pick, seed) => {
        const counts = balancedPairCounts(n);
        const k = counts[pick % counts.length]!;
        const pairs = balancedPairSubset(n, k, seededRandom(seed));
        expect(pairs).toHaveLength(k);
        expect(new Set(pairs.map((p) => p.join(','))).size).toBe(k);
        const use = new Array<number>(n).fill(0);
        for (const [a, b] of pairs) {
          expect(a).toBeLessThan(b);
          use[a]!++;
          use[b]!++;
        }
        expect(new Set(use)).toEqual(new Set([(2 * k) / n]));
      }),
      { numRuns: 200 },
    );
  });

  it('the plan of a balanced design shows each stimulus equally often, and the subset differs between participants', () => {
    const a = summarizePlan(buildTrialPlan(design(), STIMULI, 0), null);
    // 30 pairs of 12 stimuli: each in 5 pairs, 2 repetitions → 10 appearances.
    expect(Object.keys(a.stimulusUse)).toHaveLength(12);
    for (const n of Object.values(a.stimulusUse)) expect(n).toBe(10);
    const pairsOf = (p: number) => new Set(sim(buildTrialPlan(design(), STIMULI, p).trials).map((t) => [t.first, t.second].sort().join('|')));
    expect(pairsOf(0)).not.toEqual(pairsOf(1));
  });

  it('refuses an infeasible pair count and names the nearest valid ones', () => {
    expect(() => balancedPairSubset(7, 5, seededRandom(1))).toThrow(RangeError);
    const issues = checkStudyDesign(design({ similarity: { ...SIMILARITY, pairCount: 31 } }), 12);
    expect(issues).toEqual([{ field: 'similarity.pairCount', message: expect.stringContaining('try 30 or 36') }]);
  });
});

describe('design checks', () => {
  it('accepts the example design', () => {
    expect(checkStudyDesign(design(), 12)).toEqual([]);
  });
  it('puts each problem on its field', () => {
    const fields = (d: StudyDesign) => checkStudyDesign(d, 12).map((i) => i.field);
    expect(fields(design({ categorisation: { ...CATEGORISATION, directionsDeg: [] } }))).toEqual(['categorisation.directionsDeg']);
    expect(fields(design({ categorisation: { ...CATEGORISATION, steps: 8 } }))).toEqual(['categorisation.steps']);
    expect(fields(design({ categorisation: { ...CATEGORISATION, timing: { ...CATEGORISATION.timing, probeMs: 0 } } }))).toEqual(['categorisation.timing.probeMs']);
    expect(fields(design({ similarity: { ...SIMILARITY, timing: { ...SIMILARITY.timing, itiMs: -5 } } }))).toEqual(['similarity.timing.itiMs']);
    expect(fields(design({ categorisation: null, similarity: null }))).toEqual(['tasks']);
    expect(fields(design({ categorisation: { ...CATEGORISATION, keys: ['f', 'F'] } }))).toEqual(['categorisation.keys']);
  });
  it('refuses more than 5,000 trials per participant', () => {
    // 8 directions × 21 steps × 30 repetitions = 5,040 ordinary trials.
    const big = design({ categorisation: { ...CATEGORISATION, steps: 21, repetitions: 30, catchRate: 0, practiceTrials: 0 }, similarity: null });
    expect(countPlannedTrials(big, 12).total).toBe(5040);
    expect(checkStudyDesign(big, 12)).toEqual([{ field: 'categorisation.repetitions', message: expect.stringContaining('5,040') }]);
  });
});

describe('duration and flash check', () => {
  it('estimates the session from the longest trial times plus a reading allowance', () => {
    const d = design();
    const e = estimateDuration(d, 12);
    expect(e.categorisationSeconds).toBeCloseTo((8 * 40 + 6) * 3.6, 9);
    expect(e.similaritySeconds).toBeCloseTo(60 * (0.5 + 0.8 * 2 + 0.4 + 4 + 0.6), 9);
    expect(e.seconds).toBeCloseTo(e.categorisationSeconds + e.similaritySeconds + 180, 9);
  });
  it('flags timing that puts more than 3 onsets in one second (WCAG 2.3.1), assuming the fastest answers', () => {
    // Slow timing: fixation and probe 500 ms apart, then a trial of 1.8 s at the fastest → at most 2 onsets per second.
    expect(checkFlashRate(design({ similarity: null }))).toMatchObject({ peakPerSecond: 2, isAboveLimit: false });
    // 100 ms screens: a trial of 100+100+100+200+100 = 600 ms with onsets at 0 and 100 ms: [0, 0.1, 0.6, 0.7] in 1 s → 4.
    const fast = design({ similarity: null, categorisation: { ...CATEGORISATION, timing: { fixationMs: 100, probeMs: 100, blankMs: 100, responseMs: 1500, itiMs: 100 } } });
    expect(checkFlashRate(fast)).toMatchObject({ peakPerSecond: 4, isAboveLimit: true });
  });
});
