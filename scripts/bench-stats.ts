// Times lib/stats on a study of 40 participants × 16 directions × 11 levels × 10 repetitions: every fit (per
// participant per direction, and pooled across participants per direction) with 1,000 parametric-bootstrap
// resamples for its CIs, λ free on [0, 0.06], on worker threads (default: one per core); then, on a field of its
// own, the goodness-of-fit bootstrap of the same fits. Prints one JSON line. Optional arguments: the fraction of
// 1,000 resamples (e.g. `-- 0.1` for a quick run, the figures scaling linearly) and the thread count.
import { availableParallelism } from 'node:os';
import { isMainThread, parentPort, Worker, workerData } from 'node:worker_threads';
import { bootstrapFit, drawBinomial, evaluatePsychometric, goodnessOfFit, seededRandom, type FitOptions, type PsychometricData } from '@/lib/stats';

const PARTICIPANTS = 40;
const DIRECTIONS = 16;
const LEVELS = [-5, -4, -3, -2, -1, 0, 1, 2, 3, 4, 5];
const REPETITIONS = 10;
const OPTIONS: FitOptions = { link: 'logit', lapse: { max: 0.06 } };
/** One simulated observer type for the whole study: a mild PSE shift by direction and a 2 % lapse. */
const TRUTH = (d: number) => ({ threshold: 0.3 * Math.sin(d), spread: 1.2, lapse: 0.02 });

/** The study's fit sets: every participant × direction, then the pooled data of each direction (seeded). */
function simulateStudy(): PsychometricData[] {
  const random = seededRandom(2026);
  const perParticipant = Array.from({ length: PARTICIPANTS }, () =>
    Array.from({ length: DIRECTIONS }, (_, d) => ({
      x: LEVELS,
      n: LEVELS.map(() => REPETITIONS),
      k: LEVELS.map((x) => drawBinomial(REPETITIONS, evaluatePsychometric('logit', TRUTH(d), x), random)),
    })),
  );
  const pooled = Array.from({ length: DIRECTIONS }, (_, d) => ({
    x: LEVELS,
    n: LEVELS.map(() => REPETITIONS * PARTICIPANTS),
    k: LEVELS.map((_, i) => perParticipant.reduce((s, participant) => s + (participant[d]?.k[i] as number), 0)),
  }));
  return [...perParticipant.flat(), ...pooled];
}

interface Job {
  readonly phase: 'ci' | 'gof';
}

if (isMainThread) {
  const fraction = Number(process.argv[2] ?? 1);
  const threads = Number(process.argv[3] ?? availableParallelism());
  const resamples = Math.round(1000 * fraction);
  const sets = simulateStudy().length;
  // Node 20 workers do not inherit the TypeScript loader, so each registers tsx before importing this file.
  const entry = `import('tsx/esm/api').then(({ register }) => { register(); return import(${JSON.stringify(import.meta.url)}); });`;
  const workers = Array.from({ length: threads }, (_, w) => new Worker(entry, { eval: true, workerData: { w, threads, resamples } }));
  const ready = workers.map((worker) => new Promise((resolve) => worker.once('message', resolve)));
  const run = async (job: Job) => {
    const start = performance.now();
    const done = workers.map((worker) => new Promise<{ refits: number }>((resolve) => worker.once('message', resolve)));
    for (const worker of workers) worker.postMessage(job);
    const results = await Promise.all(done);
    return { seconds: (performance.now() - start) / 1000, refits: results.reduce((s, r) => s + r.refits, 0) };
  };
  await Promise.all(ready);
  const ci = await run({ phase: 'ci' });
  const gof = await run({ phase: 'gof' });
  for (const worker of workers) await worker.terminate();
  const fits = sets * (resamples + 1);
  if (ci.refits !== sets * resamples || gof.refits !== sets * resamples) throw new Error('A worker skipped fit sets.');
  console.log(
    JSON.stringify({
      participants: PARTICIPANTS,
      directions: DIRECTIONS,
      levels: LEVELS.length,
      repetitions: REPETITIONS,
      link: OPTIONS.link,
      lapse_max: 0.06,
      fit_sets: sets,
      resamples,
      fits,
      seconds: Number(ci.seconds.toFixed(3)),
      fits_per_s: Math.round(fits / ci.seconds),
      gof_seconds: Number(gof.seconds.toFixed(3)),
      gof_fits_per_s: Math.round(fits / gof.seconds),
      threads,
    }),
  );
} else {
  const { w, threads, resamples } = workerData as { w: number; threads: number; resamples: number };
  const mine = simulateStudy().filter((_, i) => i % threads === w);
  parentPort?.postMessage('ready');
  parentPort?.on('message', (job: Job) => {
    let refits = 0;
    mine.forEach((data, i) => {
      const seed = i * threads + w;
      refits += job.phase === 'ci' ? bootstrapFit(data, OPTIONS, { resamples, seed }).resamples : goodnessOfFit(data, OPTIONS, { resamples, seed }).resamples;
    });
    parentPort?.postMessage({ refits });
  });
}
