// Times lib/stats on a study of 40 participants × 16 directions × 11 levels × 10 repetitions: every fit with its
// bootstrap CIs, then the slope comparison per participant. Single-threaded; pass a fraction of the resamples
// (e.g. `-- 0.1`) for a quick run, the figures scaling linearly.
import { bootstrapFit, compareSlopes, drawBinomial, evaluatePsychometric, seededRandom, type FitOptions } from '@/lib/stats';

const PARTICIPANTS = 40;
const DIRECTIONS = 16;
const LEVELS = [-5, -4, -3, -2, -1, 0, 1, 2, 3, 4, 5];
const REPETITIONS = 10;
const RESAMPLES = Math.round(1000 * Number(process.argv[2] ?? 1));

const random = seededRandom(2026);
const study = Array.from({ length: PARTICIPANTS }, () =>
  Array.from({ length: DIRECTIONS }, (_, d) => ({
    x: LEVELS,
    n: LEVELS.map(() => REPETITIONS),
    k: LEVELS.map((x) =>
      drawBinomial(REPETITIONS, evaluatePsychometric('logit', { threshold: 0.3 * Math.sin(d), spread: 1.2, lapse: 0.02 }, x), random),
    ),
  })),
);

for (const options of [{ link: 'logit' }, { link: 'logit', lapse: { max: 0.06 } }] as FitOptions[]) {
  const start = performance.now();
  study.forEach((participant, p) => participant.forEach((data, d) => bootstrapFit(data, options, { resamples: RESAMPLES, seed: p * DIRECTIONS + d })));
  const seconds = (performance.now() - start) / 1000;
  const fits = PARTICIPANTS * DIRECTIONS * (RESAMPLES + 1);
  console.log(`fits + ${RESAMPLES} resamples, lapse ${options.lapse ? 'free' : 'none'}: ${seconds.toFixed(2)} s (${((seconds / fits) * 1e6).toFixed(1)} µs/fit)`);
}
const start = performance.now();
for (const participant of study) compareSlopes(participant, { link: 'logit', lapse: { max: 0.06 } });
console.log(`compareSlopes, ${PARTICIPANTS} participants, lapse free: ${((performance.now() - start) / 1000).toFixed(2)} s`);
