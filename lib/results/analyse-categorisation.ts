import {
  bootstrapFit,
  combineChiSquareTests,
  compareSlopes,
  describeIsotropy,
  goodnessOfFit,
  slopeRatioInterval,
  StatsError,
  testNoBias,
  type BootstrapResult,
  type FitOptions,
  type SlopeComparison,
} from '@/lib/stats';
import type { AnalysisOptions, AnalysisProgress, AssembledData, CategorisationAnalysis, DirectionData, DirectionFit, ParticipantSlopeTest } from './types';

/** A fit needs at least this many levels with trials (threshold, spread and lapse). */
const MIN_LEVELS = 3;
/** Odd multiplier (the 32-bit golden ratio) spreading fit-set indices over the seed range. */
const SEED_STEP = 0x9e3779b1;

/** The seed of fit set `index`: distinct per set, the same on every run. The goodness of fit takes the next one. */
export function fitSetSeed(seed: number, index: number): number {
  return (seed + Math.imul(2 * index + 1, SEED_STEP)) >>> 0;
}

function hasEnoughLevels(d: DirectionData): boolean {
  return d.data.x.length >= MIN_LEVELS;
}

function fitOne(d: DirectionData, participant: number | null, fitOptions: FitOptions, options: AnalysisOptions, index: number): { result: DirectionFit; bootstrap: BootstrapResult | null } {
  const levels = d.data.x.map((x, i) => ({ x, n: d.data.n[i] as number, k: d.data.k[i] as number }));
  const base = { directionDeg: d.directionDeg, participant, levels, trials: d.trials, misses: d.misses };
  if (!hasEnoughLevels(d)) {
    return { result: { ...base, fit: null, intervals: null, spreadAtBoundCount: 0, goodnessOfFit: null, problem: `Only ${d.data.x.length} level(s) with answers; a fit needs ${MIN_LEVELS}.` }, bootstrap: null };
  }
  try {
    const seed = fitSetSeed(options.seed, index);
    const bootstrap = bootstrapFit(d.data, fitOptions, { resamples: options.resamples, seed });
    const gof = goodnessOfFit(d.data, fitOptions, { resamples: options.resamples, seed: (seed + 1) >>> 0 });
    return { result: { ...base, fit: bootstrap.fit, intervals: bootstrap.intervals, spreadAtBoundCount: bootstrap.spreadAtBoundCount, goodnessOfFit: gof, problem: null }, bootstrap };
  } catch (error) {
    if (!(error instanceof StatsError)) throw error;
    return { result: { ...base, fit: null, intervals: null, spreadAtBoundCount: 0, goodnessOfFit: null, problem: error.message }, bootstrap: null };
  }
}

/** Runs a test, turning a `StatsError` into a note. */
function tryTest(run: () => SlopeComparison, what: string, notes: string[]): SlopeComparison | null {
  try {
    return run();
  } catch (error) {
    if (!(error instanceof StatsError)) throw error;
    notes.push(`${what}: ${error.message}`);
    return null;
  }
}

/** Fit sets the analysis will bootstrap: pooled directions plus every participant's directions with enough levels. */
export function countFitSets(data: AssembledData): number {
  return data.pooled.filter(hasEnoughLevels).length + data.participants.reduce((s, p) => s + p.directions.filter(hasEnoughLevels).length, 0);
}

/**
 * The categorisation analysis of a study, as a generator that yields its progress after every fit set (so a job can
 * report it and stay responsive) and returns the result:
 * 1. every pooled direction and every participant's direction: the ML fit (`bootstrapFit`, percentile 95 %
 *    intervals from `resamples` seeded parametric resamples) and its goodness of fit (`goodnessOfFit`);
 * 2. per participant, the likelihood-ratio test of a common slope across directions (`compareSlopes`, one lapse per
 *    participant), summed over participants into the group test (`combineChiSquareTests`);
 * 3. the test that every pooled PSE is 0 (`testNoBias`), the max/min slope ratio of the pooled fits with its
 *    interval (`slopeRatioInterval`) and the verdict in words (`describeIsotropy`).
 * Sets that cannot be fitted or tested are reported with the reason instead of failing the whole analysis.
 */
export function* analyseCategorisation(data: AssembledData, options: AnalysisOptions): Generator<AnalysisProgress, CategorisationAnalysis, void> {
  const fitOptions: FitOptions = { link: options.link, lapse: options.lapse };
  const total = countFitSets(data) + 1;
  const notes: string[] = [];
  let done = 0;
  let index = 0;

  const pooled: DirectionFit[] = [];
  const pooledBootstraps: BootstrapResult[] = [];
  for (const d of data.pooled) {
    const { result, bootstrap } = fitOne(d, null, fitOptions, options, index++);
    pooled.push(result);
    if (bootstrap) {
      pooledBootstraps.push(bootstrap);
      yield { done: ++done, total };
    }
  }

  const participants: { participant: number; fits: DirectionFit[] }[] = [];
  const slopeTests: ParticipantSlopeTest[] = [];
  for (const p of data.participants) {
    const fits: DirectionFit[] = [];
    for (const d of p.directions) {
      const { result, bootstrap } = fitOne(d, p.participant, fitOptions, options, index++);
      fits.push(result);
      if (bootstrap) yield { done: ++done, total };
    }
    participants.push({ participant: p.participant, fits });
    const testable = p.directions.filter(hasEnoughLevels);
    if (testable.length < 2) {
      slopeTests.push({ participant: p.participant, test: null, problem: 'Fewer than two directions with enough levels to compare.' });
      continue;
    }
    const problems: string[] = [];
    const test = tryTest(() => compareSlopes(testable.map((d) => d.data), fitOptions), `Participant ${p.participant}`, problems);
    slopeTests.push({ participant: p.participant, test, problem: problems[0] ?? null });
  }

  const tested = slopeTests.flatMap((t) => (t.test ? [t.test] : []));
  const groupSlopeTest = tested.length > 0 ? combineChiSquareTests(tested) : null;
  if (!groupSlopeTest) notes.push('No participant had two or more directions to compare, so there is no test of a common slope.');
  const fittedPooled = data.pooled.filter(hasEnoughLevels);
  const noBiasTest = fittedPooled.length > 0 ? tryTest(() => testNoBias(fittedPooled.map((d) => d.data), fitOptions), 'The no-bias test', notes) : null;
  let slopeRatio: CategorisationAnalysis['slopeRatio'] = null;
  if (pooledBootstraps.length >= 2) {
    const r = slopeRatioInterval(pooledBootstraps);
    slopeRatio = { ratio: r.ratio, interval: r.interval, resamples: r.resamples };
  } else {
    notes.push('The slope ratio needs at least two fitted directions.');
  }
  const verdict =
    groupSlopeTest && slopeRatio
      ? describeIsotropy({ slopes: groupSlopeTest, ...(noBiasTest ? { bias: noBiasTest } : {}), slopeRatio: { ...slopeRatio }, alpha: options.alpha })
      : null;
  yield { done: ++done, total };
  return { options, directionsDeg: data.directionsDeg, pooled, participants, slopeTests, groupSlopeTest, noBiasTest, slopeRatio, verdict, notes };
}

/** Runs `analyseCategorisation` to the end in one go (tests, small studies). */
export function analyseCategorisationNow(data: AssembledData, options: AnalysisOptions): CategorisationAnalysis {
  const steps = analyseCategorisation(data, options);
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
  }
}
