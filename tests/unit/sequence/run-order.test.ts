import { describe, expect, it } from 'vitest';
import {
  buildRunOrder,
  checkPairBalance,
  checkType1Index1Sequence,
  cutIntoRuns,
  type RunConditionInput,
  type RunOrderOptions,
} from '@/lib/sequence';
import { expectSequenceError } from './support';

const conditions = (n: number): RunConditionInput[] =>
  Array.from({ length: n }, (_, i) => ({ id: `s${String(i + 1).padStart(2, '0')}`, stimFile: `edition-3/s${i + 1}.png` }));

const base = (overrides: Partial<RunOrderOptions> = {}): RunOrderOptions => ({
  conditions: conditions(4),
  sequence: { kind: 'de-bruijn' },
  timing: { trialDuration: 1, iti: { kind: 'fixed', duration: 1 }, tr: 2 },
  seed: 77,
  ...overrides,
});

describe('buildRunOrder: balanced runs', () => {
  it('de Bruijn: n² + 1 trials with a flat transition matrix', () => {
    // De Bruijn B(4, 2) plus its first item: 17 trials, every ordered pair once (REFERENCES.md "Trial orders").
    const order = buildRunOrder(base());
    const [run] = order.runs;
    expect(run?.trials).toHaveLength(17);
    expect(run?.summary.transitionCounts.flat()).toEqual(new Array(16).fill(1));
    expect(run?.summary.isTransitionFlat).toBe(true);
    // The first condition opens and closes the list: it is shown n + 1 times, the others n times (derived).
    const counts = [...(run?.summary.conditionCounts ?? [])];
    expect(counts.reduce((a, b) => a + b, 0)).toBe(17);
    expect(counts.sort()).toEqual([4, 4, 4, 5]);
  });

  it('type-1 index-1: n² + 1 trials in permuted blocks, flat', () => {
    // Nonyane & Theobald 2007: n² + 1 trials, every ordered pair once; checked with the same checker as the
    // published n = 6 example.
    const order = buildRunOrder(base({ conditions: conditions(7), sequence: { kind: 'type1-index1' } }));
    const [run] = order.runs;
    expect(run?.trials).toHaveLength(50);
    expect(checkType1Index1Sequence(run?.sequence ?? [], 7).isValid).toBe(true);
    expect(run?.summary.isTransitionFlat).toBe(true);
  });

  it('independent runs are each balanced and differ from one another', () => {
    const order = buildRunOrder(base({ conditions: conditions(6), sequence: { kind: 'type1-index1' }, runs: 3 }));
    expect(order.runs.map((run) => run.index)).toEqual([1, 2, 3]);
    for (const run of order.runs) expect(checkPairBalance(run.sequence, 6).isBalanced).toBe(true);
    expect(order.runs[0]?.sequence).not.toEqual(order.runs[1]?.sequence);
    expect(order.summary.transitionCounts.flat()).toEqual(new Array(36).fill(3));
    expect(order.lostPairs).toEqual([]);
  });

  it('shuffled blocks: n × blocks trials, no immediate repeat', () => {
    const order = buildRunOrder(base({ conditions: conditions(5), sequence: { kind: 'shuffled-blocks', blocks: 6 } }));
    const sequence = order.runs[0]?.sequence ?? [];
    expect(sequence).toHaveLength(30);
    expect(sequence.every((item, index) => index === 0 || item !== sequence[index - 1])).toBe(true);
    expect(order.runs[0]?.summary.conditionCounts).toEqual([6, 6, 6, 6, 6]);
  });

  it('adds null events as one more condition with stim_file n/a', () => {
    const order = buildRunOrder(base({ conditions: conditions(3), nullEvents: true }));
    expect(order.conditions.map((condition) => condition.id)).toEqual(['s01', 's02', 's03', 'null']);
    expect(order.conditions[3]).toEqual({ id: 'null', stimFile: null, isNullEvent: true });
    const nullTrials = order.runs[0]?.trials.filter((trial) => trial.trialType === 'null') ?? [];
    expect(nullTrials.length).toBeGreaterThanOrEqual(4);
    expect(nullTrials.every((trial) => trial.stimFile === null)).toBe(true);
    expect(buildRunOrder(base({ conditions: conditions(3), nullEvents: { trialType: 'blank' } })).conditions[3]?.id).toBe('blank');
  });

  it('is reproducible for a seed and changes with it', () => {
    const options = base({ conditions: conditions(6), timing: { trialDuration: 1.5, iti: { kind: 'uniform', min: 1, max: 3 }, tr: 2 }, runs: 2 });
    expect(buildRunOrder(options)).toEqual(buildRunOrder(options));
    expect(buildRunOrder({ ...options, seed: 78 }).runs[0]?.trials).not.toEqual(buildRunOrder(options).runs[0]?.trials);
  });

  it('does not change its inputs', () => {
    const options = base({ conditions: conditions(6), runs: 2, runMode: 'cut' });
    const snapshot = JSON.stringify(options);
    buildRunOrder(options);
    expect(JSON.stringify(options)).toBe(snapshot);
  });
});

describe('buildRunOrder: timing', () => {
  it('onsets step by trial duration + ITI, and run durations add up to the total', () => {
    const order = buildRunOrder(
      base({
        conditions: conditions(6),
        runs: 3,
        timing: { trialDuration: 0.8, iti: { kind: 'truncated-exponential', mean: 3, min: 2, max: 8 }, tr: 1.5 },
      }),
    );
    let total = 0;
    for (const run of order.runs) {
      const { trials, summary } = run;
      expect(trials[0]?.onset).toBe(0);
      trials.slice(1).forEach((trial, i) => {
        const previous = trials[i]!;
        expect(trial.onset - previous.onset).toBeCloseTo(previous.duration + previous.iti, 9);
      });
      const sumOfParts = trials.reduce((sum, trial) => sum + trial.duration + trial.iti, 0);
      expect(summary.duration).toBeCloseTo(sumOfParts, 9);
      expect(summary.volumes).toBe(Math.ceil(summary.duration / 1.5 - 1e-9));
      total += summary.duration;
    }
    expect(order.summary.duration).toBeCloseTo(total, 9);
    expect(order.summary.volumes).toBe(order.runs.reduce((sum, run) => sum + run.summary.volumes, 0));
    expect(order.summary.trials).toBe(3 * 37);
  });

  it('counts volumes exactly: 17 trials of 1 s + 1 s ITI at TR 2 s are 17 volumes', () => {
    // Derived: 17 × (1 + 1) s = 34 s = 17 × 2 s.
    const { summary } = buildRunOrder(base()).runs[0]!;
    expect(summary.duration).toBe(34);
    expect(summary.volumes).toBe(17);
    expect(summary.acquiredVolumes).toBe(17);
  });

  it('shifts onsets by dummies × TR only when the dummy volumes are stored', () => {
    // BIDS: onsets count from the first volume stored in the data file.
    const stored = buildRunOrder(base({ timing: { trialDuration: 1, iti: { kind: 'fixed', duration: 1 }, tr: 2, dummyVolumes: 3, dummyVolumesStored: true } }));
    const discarded = buildRunOrder(base({ timing: { trialDuration: 1, iti: { kind: 'fixed', duration: 1 }, tr: 2, dummyVolumes: 3, dummyVolumesStored: false } }));
    expect(stored.runs[0]?.trials[0]?.onset).toBe(6);
    expect(stored.runs[0]?.summary).toMatchObject({ duration: 40, volumes: 20, acquiredVolumes: 20 });
    expect(discarded.runs[0]?.trials[0]?.onset).toBe(0);
    expect(discarded.runs[0]?.summary).toMatchObject({ duration: 34, volumes: 17, acquiredVolumes: 20 });
  });

  it('flags onset rates above 3 per second (WCAG 2.3.1), ignoring null events', () => {
    // WCAG 2.3.1: no more than three flashes in any one-second period.
    const fast = buildRunOrder(base({ timing: { trialDuration: 0.1, iti: { kind: 'fixed', duration: 0.1 }, tr: 2 } }));
    expect(fast.runs[0]?.summary.peakOnsetRate).toBe(5);
    expect(fast.summary.exceedsFlashLimit).toBe(true);
    // Onsets every 0.334 s: 0, 0.334, 0.668 in the first second, 1.002 in the next (derived).
    const threePerSecond = buildRunOrder(base({ timing: { trialDuration: 0.1, iti: { kind: 'fixed', duration: 0.234 }, tr: 2 } }));
    expect(threePerSecond.runs[0]?.summary.peakOnsetRate).toBe(3);
    expect(threePerSecond.summary.exceedsFlashLimit).toBe(false);
    // Null events show nothing: with one stimulus and null events, stimuli never come faster than every other trial.
    const withNulls = buildRunOrder(
      base({ conditions: conditions(1), nullEvents: true, sequence: { kind: 'shuffled-blocks', blocks: 20 }, timing: { trialDuration: 0.1, iti: { kind: 'fixed', duration: 0.1 }, tr: 2 } }),
    );
    expect(withNulls.runs[0]?.summary.peakOnsetRate).toBe(3);
  });
});

describe('buildRunOrder: one long sequence cut into runs', () => {
  it('reports exactly the ordered pairs lost at the cuts', () => {
    // De Bruijn B(5, 2) plus its first item: 26 trials, every ordered pair once, cut into runs of 9, 9 and 8.
    const order = buildRunOrder(base({ conditions: conditions(5), runs: 3, runMode: 'cut' }));
    expect(order.runs.map((run) => run.trials.length)).toEqual([9, 9, 8]);
    const long = order.runs.flatMap((run) => run.sequence);
    expect(checkPairBalance(long, 5).isBalanced).toBe(true);
    expect(order.lostPairs).toEqual([
      { afterRun: 1, from: long[8], to: long[9], fromId: order.conditions[long[8]!]?.id, toId: order.conditions[long[9]!]?.id },
      { afterRun: 2, from: long[17], to: long[18], fromId: order.conditions[long[17]!]?.id, toId: order.conditions[long[18]!]?.id },
    ]);
    // Within runs, the lost pairs are never presented and every other pair is presented once.
    const lost = new Set(order.lostPairs.map((pair) => `${pair.from},${pair.to}`));
    order.summary.transitionCounts.forEach((row, from) =>
      row.forEach((count, to) => expect(count).toBe(lost.has(`${from},${to}`) ? 0 : 1)),
    );
    expect(order.summary.isTransitionFlat).toBe(false);
  });

  it('cutIntoRuns keeps the order, balances run lengths and names each cut', () => {
    const { pieces, cuts } = cutIntoRuns([0, 1, 2, 3, 4, 5, 6], 3);
    expect(pieces).toEqual([[0, 1, 2], [3, 4], [5, 6]]);
    expect(cuts).toEqual([
      { afterRun: 1, pair: [2, 3] },
      { afterRun: 2, pair: [4, 5] },
    ]);
    expect(cutIntoRuns([3, 1], 1)).toEqual({ pieces: [[3, 1]], cuts: [] });
  });

  it('refuses runs shorter than one trial', () => {
    // 4 conditions → 17 trials; 18 runs would leave one empty.
    const error = expectSequenceError(() => buildRunOrder(base({ runs: 18, runMode: 'cut' })), 'run-too-short');
    expect(error.details.trials).toBe(17);
    expect(() => buildRunOrder(base({ runs: 17, runMode: 'cut' }))).not.toThrow();
  });
});

describe('buildRunOrder: bad input', () => {
  it('refuses more than 200 conditions for a balanced order and names the trial count', () => {
    const error = expectSequenceError(() => buildRunOrder(base({ conditions: conditions(201) })), 'too-many-conditions');
    expect(error.details.trials).toBe(40_402);
    expect(error.message).toContain('40402');
    // Null events count as a condition.
    expectSequenceError(() => buildRunOrder(base({ conditions: conditions(200), nullEvents: true })), 'too-many-conditions');
  });

  it('accepts 200 conditions for a de Bruijn order', () => {
    const order = buildRunOrder(base({ conditions: conditions(200) }));
    expect(order.summary.trials).toBe(40_001);
    expect(order.summary.isTransitionFlat).toBe(true);
  });

  it('refuses n = 3…5 for type-1 index-1 and offers de Bruijn', () => {
    const error = expectSequenceError(() => buildRunOrder(base({ sequence: { kind: 'type1-index1' } })), 'no-type1-index1');
    expect(error.details.alternative).toBe('de-bruijn');
  });

  it('refuses durations ≤ 0 and a TR ≤ 0', () => {
    expectSequenceError(() => buildRunOrder(base({ timing: { trialDuration: 0, iti: { kind: 'fixed', duration: 1 }, tr: 2 } })), 'duration-not-positive');
    expectSequenceError(() => buildRunOrder(base({ timing: { trialDuration: -1, iti: { kind: 'fixed', duration: 1 }, tr: 2 } })), 'duration-not-positive');
    expectSequenceError(() => buildRunOrder(base({ timing: { trialDuration: 1, iti: { kind: 'fixed', duration: 1 }, tr: 0 } })), 'tr-not-positive');
  });

  it('refuses bad run counts, too few conditions and bad seeds', () => {
    expectSequenceError(() => buildRunOrder(base({ runs: 0 })), 'invalid-argument');
    expectSequenceError(() => buildRunOrder(base({ runs: 1.5 })), 'invalid-argument');
    expectSequenceError(() => buildRunOrder(base({ conditions: [] })), 'too-few-conditions');
    expectSequenceError(() => buildRunOrder(base({ conditions: conditions(1) })), 'too-few-conditions');
    expectSequenceError(() => buildRunOrder(base({ seed: 2 ** 32 })), 'invalid-seed');
  });

  it.each<[string, RunConditionInput[]]>([
    ['an empty id', [{ id: '' }, { id: 'b' }]],
    ['a tab in an id', [{ id: 'a\tb' }, { id: 'b' }]],
    ['the id n/a', [{ id: 'n/a' }, { id: 'b' }]],
    ['an absolute stimulus path', [{ id: 'a', stimFile: '/set/a.png' }, { id: 'b' }]],
    ['a parent-folder stimulus path', [{ id: 'a', stimFile: '../a.png' }, { id: 'b' }]],
    ['a backslash path', [{ id: 'a', stimFile: 'set\\a.png' }, { id: 'b' }]],
  ])('refuses %s', (_, input) => {
    expectSequenceError(() => buildRunOrder(base({ conditions: input })), 'invalid-condition');
  });

  it('refuses duplicate ids, including a clash with the null events', () => {
    expectSequenceError(() => buildRunOrder(base({ conditions: [{ id: 'a' }, { id: 'a' }] })), 'duplicate-condition');
    expectSequenceError(() => buildRunOrder(base({ conditions: [{ id: 'null' }, { id: 'a' }], nullEvents: true })), 'duplicate-condition');
  });
});
