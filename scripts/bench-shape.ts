// Benchmark of the contour engine (`npm run bench:shape`). Prints one JSON line per case. A script, not a test:
// figures depend on the machine and its load; run it alone. `seconds` is wall time; `cpu_seconds` is the
// process's CPU time over the same span (it includes V8's garbage-collector threads), which shows when a
// busy machine, rather than the code, slowed a run down.
//
// The reference for the first line is the same job in numpy, one shape at a time with fresh arrays, either as
// the direct sum `r = 1 + (A[:, None] * np.cos(k[:, None] * theta + phi[:, None])).sum(0); x, y = r * ct, r * st`
// or through `np.fft.ifft` of a 1,024-bin spectrum holding the same coefficients (the faster of the two).
import { availableParallelism } from 'node:os';
import { isMainThread, parentPort, Worker, workerData } from 'node:worker_threads';
import {
  fitEllipticHarmonics,
  fitRadialHarmonics,
  isSimpleContour,
  rasterizeContour,
  silhouetteDistance,
  synthesizeContour,
  type EllipticDescriptor,
  type RadialDescriptor,
  type SynthesisMethod,
} from '../lib/shape/index';

/** Deterministic pseudo-random numbers (mulberry32), so every run benches the same shapes. */
function mulberry32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const SEED = 4242;
const POOL_SIZE = 256;
const SAMPLES = 1024;
/** Shapes synthesised before timing, so the JIT has settled on optimised code. */
const WARMUP_SHAPES = 20_000;

/** Radial shapes with `harmonics` non-zero terms at distinct k in 2…(2·harmonics + 1), Σ|A| < 0.5. */
function radialPool(harmonics: number): RadialDescriptor[] {
  const random = mulberry32(SEED + harmonics);
  return Array.from({ length: POOL_SIZE }, () => {
    const ks = new Set<number>();
    while (ks.size < harmonics) ks.add(2 + Math.floor(random() * 2 * harmonics));
    return {
      family: 'radial' as const,
      baseRadius: 1,
      terms: [...ks].map((k) => ({ k, amplitude: (0.45 / harmonics) * random(), phase: 2 * Math.PI * random() })),
    };
  });
}

function ellipticPool(harmonics: number): EllipticDescriptor[] {
  const random = mulberry32(SEED + 1000 + harmonics);
  return Array.from({ length: POOL_SIZE }, () => ({
    family: 'elliptic' as const,
    center: [0, 0] as const,
    terms: [
      { n: 1, a: 1, b: 0, c: 0, d: 0.6 + 0.2 * random() },
      ...Array.from({ length: harmonics - 1 }, (_, i) => ({
        n: i + 2,
        a: 0.02 * (random() - 0.5),
        b: 0.02 * (random() - 0.5),
        c: 0.02 * (random() - 0.5),
        d: 0.02 * (random() - 0.5),
      })),
    ],
  }));
}

/**
 * Synthesises `shapes` contours from the pool; returns seconds and a checksum that keeps the work alive.
 * Callers run it once untimed first: a timed loop inside the first call would run in on-stack-replacement
 * code, measured ~1.5× slower than the fully optimised function.
 */
function runSynthesis(pool: readonly (RadialDescriptor | EllipticDescriptor)[], shapes: number, method: SynthesisMethod, checkSimple: boolean): { seconds: number; cpuSeconds: number; checksum: number } {
  let checksum = 0;
  const cpu = process.cpuUsage();
  const start = performance.now();
  for (let i = 0; i < shapes; i++) {
    const contour = synthesizeContour(pool[i % pool.length] as RadialDescriptor, SAMPLES, { method, checkSimple });
    checksum += (contour.x[i % SAMPLES] as number) + (contour.y[(i * 7) % SAMPLES] as number);
  }
  const seconds = (performance.now() - start) / 1000;
  const used = process.cpuUsage(cpu);
  return { seconds, cpuSeconds: (used.user + used.system) / 1e6, checksum };
}

function print(record: Record<string, string | number | boolean>): void {
  process.stdout.write(`${JSON.stringify(record)}\n`);
}

function synthesisCase(name: string, family: 'radial' | 'elliptic', harmonics: number, shapes: number, method: SynthesisMethod, checkSimple = false): void {
  const pool = family === 'radial' ? radialPool(harmonics) : ellipticPool(harmonics);
  runSynthesis(pool, Math.min(WARMUP_SHAPES, shapes), method, checkSimple);
  const { seconds, cpuSeconds } = runSynthesis(pool, shapes, method, checkSimple);
  print({ name, family, harmonics, method, shapes, samples: SAMPLES, threads: 1, seconds: round(seconds), cpu_seconds: round(cpuSeconds), shapes_per_s: Math.round(shapes / seconds) });
}

function round(value: number): number {
  return Number(value.toPrecision(4));
}

interface WorkerJob {
  readonly harmonics: number;
  readonly shapes: number;
}

/** Worker side: warm up, report ready, wait for the start signal, synthesise, report the time. */
function runWorker(job: WorkerJob): void {
  const pool = radialPool(job.harmonics);
  runSynthesis(pool, WARMUP_SHAPES, 'auto', false);
  parentPort?.once('message', () => {
    const { seconds, checksum } = runSynthesis(pool, job.shapes, 'auto', false);
    parentPort?.postMessage({ seconds, checksum });
  });
  parentPort?.postMessage('ready');
}

async function threadedCase(threads: number, harmonics: number, shapesPerThread: number): Promise<void> {
  // Workers do not inherit the tsx loader, so each one registers it and then imports this file.
  const bootstrap = `const { register } = await import(${JSON.stringify(import.meta.resolve('tsx/esm/api'))}); register(); await import(${JSON.stringify(import.meta.url)});`;
  const workers = Array.from(
    { length: threads },
    () => new Worker(new URL(`data:text/javascript,${encodeURIComponent(bootstrap)}`), { workerData: { harmonics, shapes: shapesPerThread } satisfies WorkerJob }),
  );
  await Promise.all(workers.map((w) => new Promise<void>((resolve) => w.once('message', () => resolve()))));
  const start = performance.now();
  await Promise.all(workers.map((w) => new Promise<void>((resolve) => {
    w.once('message', () => resolve());
    w.postMessage('go');
  })));
  const seconds = (performance.now() - start) / 1000;
  await Promise.all(workers.map((w) => w.terminate()));
  const shapes = threads * shapesPerThread;
  print({ name: 'synthesize', family: 'radial', harmonics, method: 'auto', shapes, samples: SAMPLES, threads, seconds: round(seconds), shapes_per_s: Math.round(shapes / seconds) });
}

function fitCase(name: string, harmonics: number, runs: number, fit: (outline: ReturnType<typeof synthesizeContour>) => unknown): void {
  const outlines = radialPool(4).slice(0, 16).map((d) => synthesizeContour(d, SAMPLES));
  for (let i = 0; i < 10; i++) fit(outlines[i % outlines.length] as ReturnType<typeof synthesizeContour>);
  const start = performance.now();
  for (let i = 0; i < runs; i++) fit(outlines[i % outlines.length] as ReturnType<typeof synthesizeContour>);
  const seconds = (performance.now() - start) / 1000;
  print({ name, vertices: SAMPLES, harmonics, fits: runs, seconds: round(seconds), fits_per_s: Math.round(runs / seconds) });
}

function simplePolygonCase(vertices: number, runs: number): void {
  const cases = [
    ['radial', synthesizeContour(radialPool(8)[0] as RadialDescriptor, vertices)],
    ['elliptic', synthesizeContour((ellipticPool(6)[0] as EllipticDescriptor), vertices, { checkSimple: false })],
  ] as const;
  for (const [family, contour] of cases) {
    let simple = true;
    for (let i = 0; i < 3; i++) simple = isSimpleContour(contour);
    const times: number[] = [];
    for (let i = 0; i < runs; i++) {
      const start = performance.now();
      simple = isSimpleContour(contour) && simple;
      times.push(performance.now() - start);
    }
    times.sort((p, q) => p - q);
    print({ name: 'is-simple', family, vertices, runs, simple, ms_median: round(times[runs >> 1] as number), ms_max: round(times[runs - 1] as number) });
  }
}

function silhouetteCase(pairs: number): void {
  const extent = { minX: -1.6, minY: -1.6, size: 3.2 };
  const masks = radialPool(4).slice(0, 64).map((d) => rasterizeContour(synthesizeContour(d, SAMPLES), { resolution: 256, extent }));
  let sum = 0;
  const start = performance.now();
  for (let i = 0; i < pairs; i++) sum += silhouetteDistance(masks[i % 64] as (typeof masks)[number], masks[(i * 7 + 3) % 64] as (typeof masks)[number]);
  const seconds = (performance.now() - start) / 1000;
  print({ name: 'silhouette-distance', resolution: 256, pairs, seconds: round(seconds), pairs_per_s: Math.round(pairs / seconds), mean_distance: round(sum / pairs) });
}

async function main(): Promise<void> {
  // The case: 4 non-zero harmonics, 1,024 samples, a fresh output array per shape, one thread.
  synthesisCase('synthesize', 'radial', 4, 100_000, 'auto');
  synthesisCase('synthesize', 'radial', 8, 100_000, 'auto');
  synthesisCase('synthesize', 'radial', 4, 50_000, 'direct');
  synthesisCase('synthesize', 'radial', 4, 50_000, 'fft');
  synthesisCase('synthesize', 'radial', 8, 50_000, 'direct');
  synthesisCase('synthesize', 'radial', 8, 50_000, 'fft');
  synthesisCase('synthesize', 'radial', 32, 50_000, 'auto');
  synthesisCase('synthesize', 'elliptic', 4, 50_000, 'auto');
  synthesisCase('synthesize-checked', 'elliptic', 4, 5_000, 'auto', true);
  await threadedCase(Math.min(2, availableParallelism()), 4, 100_000);
  fitCase('fit-elliptic', 16, 500, (outline) => fitEllipticHarmonics(outline, 16));
  fitCase('fit-radial', 16, 200, (outline) => fitRadialHarmonics(outline, 16));
  simplePolygonCase(8192, 21);
  silhouetteCase(200_000);
}

if (isMainThread) {
  void main();
} else {
  runWorker(workerData as WorkerJob);
}
