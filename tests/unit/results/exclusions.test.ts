import { describe, expect, it } from 'vitest';
import { decideExclusions, findCatchFailures, findRtOutliers, MAD_SCALE, medianOf, type ResultTrial } from '@/lib/results';

let nextIndex = 0;
function trial(over: Partial<ResultTrial>): ResultTrial {
  return { participant: 0, trialIndex: nextIndex++, directionDeg: 0, x: 0, choseB: true, rtMs: 600, isCatch: false, isCorrect: null, ...over };
}

describe('findRtOutliers', () => {
  it("flags the value of Leys et al.'s worked example and nothing else (J. Exp. Soc. Psychol. 2013, 49:764)", () => {
    // Leys et al. 2013: 1, 3, 3, 6, 8, 10, 10, 1000 → median 7, MAD = 1.4826 × 3.5 = 5.189; with k = 3 the
    // interval is 7 ± 15.57, so only 1000 lies outside.
    const rts = [1, 3, 3, 6, 8, 10, 10, 1000];
    expect(medianOf(rts)).toBe(7);
    expect(MAD_SCALE * medianOf(rts.map((r) => Math.abs(r - 7)))).toBeCloseTo(5.189, 3);
    const trials = rts.map((rtMs) => trial({ rtMs }));
    const out = findRtOutliers(trials, 3);
    expect(out.map((e) => e.trialIndex)).toEqual([trials[7]!.trialIndex]);
    expect(out[0]).toMatchObject({ rule: 'rt-outlier', participant: 0, trialIndex: trials[7]!.trialIndex, isOverridden: false });
    expect(out[0]!.reason).toMatch(/1000 ms is 191\.4 scaled MADs .* median of 7 ms \(limit 3\)/);
  });

  it('judges each participant against their own median, skips catch trials and misses, and can be turned off', () => {
    const fast = [500, 510, 490, 505, 495].map((rtMs) => trial({ participant: 1, rtMs }));
    const slow = [1500, 1510, 1490, 1505, 1495].map((rtMs) => trial({ participant: 2, rtMs }));
    const odd = [trial({ participant: 1, rtMs: 1500, isCatch: true }), trial({ participant: 1, rtMs: 9000, choseB: null })];
    expect(findRtOutliers([...fast, ...slow, ...odd], 2.5)).toEqual([]);
    const late = trial({ participant: 1, rtMs: 1500 });
    expect(findRtOutliers([...fast, ...slow, late], 2.5).map((e) => e.trialIndex)).toEqual([late.trialIndex]);
    expect(findRtOutliers([...fast, late], null)).toEqual([]);
    // Identical RTs: the MAD is 0 and nothing can be called an outlier.
    expect(findRtOutliers([600, 600, 600, 2000].map((rtMs) => trial({ participant: 3, rtMs })), 2.5)).toEqual([]);
  });
});

describe('findCatchFailures', () => {
  it('excludes a participant below the threshold, counting a miss as wrong, and keeps one exactly at it', () => {
    const catches = (participant: number, correct: (boolean | null)[]) => correct.map((c) => trial({ participant, isCatch: true, isCorrect: c, choseB: c === null ? null : true }));
    const trials = [...catches(0, [true, true, true, true, false]), ...catches(1, [true, true, true, null, false]), trial({ participant: 2 })];
    const out = findCatchFailures(trials, 0.8);
    expect(out.map((e) => e.participant)).toEqual([1]);
    expect(out[0]).toMatchObject({ rule: 'catch-accuracy', trialIndex: null });
    expect(out[0]!.reason).toContain('3/5 (60 %) is below 80 %');
    expect(findCatchFailures(trials, 0)).toEqual([]);
  });
});

describe('decideExclusions', () => {
  const rules = { catchAccuracyMin: 0.75, rtMadK: 2.5 };
  const base = [
    ...[true, false, false, false].map((c) => trial({ participant: 0, isCatch: true, isCorrect: c })),
    ...[500, 505, 495, 510, 490].map((rtMs) => trial({ participant: 0, rtMs })),
    ...[true, true, true, true].map((c) => trial({ participant: 1, isCatch: true, isCorrect: c })),
    ...[600, 605, 595, 610, 590, 4000].map((rtMs) => trial({ participant: 1, rtMs })),
    trial({ participant: 1, choseB: null, rtMs: null }),
  ];
  const slowTrial = base.find((t) => t.rtMs === 4000)!;

  it('leaves out failed participants and outlying trials, and never fits catch trials or misses', () => {
    const { exclusions, included } = decideExclusions(base, rules, []);
    expect(exclusions.map((e) => [e.rule, e.participant, e.trialIndex])).toEqual([
      ['catch-accuracy', 0, null],
      ['rt-outlier', 1, slowTrial.trialIndex],
    ]);
    expect(included).toHaveLength(5);
    expect(included.every((t) => t.participant === 1 && !t.isCatch && t.choseB !== null && t.rtMs !== 4000)).toBe(true);
  });

  it('a manual keep overrides an automatic exclusion, and a manual exclude adds one', () => {
    const manual = [
      { id: 'k1', participant: 0, trialIndex: null, action: 'keep' as const, reason: 'Catch trials were misprogrammed for this session.' },
      { id: 'x1', participant: 1, trialIndex: base.find((t) => t.participant === 1 && !t.isCatch && t.rtMs === 600)!.trialIndex, action: 'exclude' as const, reason: 'Fire alarm.' },
    ];
    const { exclusions, included } = decideExclusions(base, rules, manual);
    expect(exclusions.find((e) => e.rule === 'catch-accuracy')).toMatchObject({ isOverridden: true, manualId: 'k1' });
    expect(exclusions.find((e) => e.rule === 'manual')).toMatchObject({ participant: 1, reason: 'Fire alarm.', manualId: 'x1' });
    expect(included.filter((t) => t.participant === 0)).toHaveLength(5);
    expect(included.filter((t) => t.participant === 1)).toHaveLength(4);
  });
});
