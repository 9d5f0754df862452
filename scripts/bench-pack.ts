// Benchmark of lib/pack (`npm run bench:pack`): one stimulus pack end to end — Rings 10 × 100 + centre (1,001
// layout stimuli) plus two boundaries' prototypes, 512 samples, 512 × 512 PNG, the three model RDMs, tables,
// checksums and the zip streamed to a temporary file. The job worker's thread pool (PackPool, one thread per core)
// renders the PNGs and runs lib/pack's jobs (contour and silhouette RDM rows, RDM table lines, perimeters) while the main
// thread does the rest. A script, not a test: the figures depend on the machine and its load.
// Prints one JSON line: stimuli, seconds, stimuli_per_s, peak_rss_mb, cpu_s (all threads), load average,
// breakdown (ms per stage).
import { createHash } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { mkdtemp, rm, stat } from 'node:fs/promises';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { buildPack, type PackInput } from '../lib/pack/index';
import { PackPool } from '../lib/server/jobs/pack-pool';

/** Bench input: a radial seed with two lobe axes, Rings 10 × 100, a 512-px canvas on a 1920-px display. */
function benchInput(): PackInput {
  return {
    edition: {
      spaceName: 'Bench rings',
      number: 1,
      contentHash: 'a'.repeat(64),
      state: 'approved',
      createdAt: '2025-01-15T10:00:00Z',
    },
    definition: {
      seed: { family: 'radial', baseRadius: 1, terms: [{ k: 3, amplitude: 0.08, phase: 0 }] },
      axes: [
        { label: 'Lobes 2', changes: [{ harmonic: 2, field: 'amplitude', delta: 0.08 }] },
        { label: 'Lobes 4', changes: [{ harmonic: 4, field: 'amplitude', delta: 0.04 }] },
      ],
      extent: 1,
      layout: { kind: 'rings', rings: 10, spokes: 100 },
      normalization: { scale: 'equal-area-radius', centroid: true },
    },
    boundaries: [
      { key: 'horizontal', label: 'Horizontal', angleDeg: 0 },
      { key: 'diagonal', angleDeg: 45 },
    ],
    // 40 px/cm at 57.294325 cm: 1° = 40 px exactly (REFERENCES: 1 cm subtends 1° at that distance); 12.8° → 512 px.
    profile: { name: 'Bench display', resolutionPx: { width: 1920, height: 1080 }, widthCm: 48, pixelsPerCm: null, viewingDistanceCm: 57.294325 },
    render: {
      sizeDeg: 8,
      sizeMeasure: 'equal-area-diameter',
      canvasDeg: 12.8,
      style: 'silhouette',
      strokeArcmin: null,
      fill: 0,
      background: 128,
      antiAlias: true,
      transparent: false,
      samples: 512,
    },
    versions: { product: 'bench', engine: 'bench' },
  };
}

async function main(): Promise<void> {
  let peakRss = process.memoryUsage.rss();
  const sampler = setInterval(() => (peakRss = Math.max(peakRss, process.memoryUsage.rss())), 20);
  const pool = new PackPool(Math.max(1, availableParallelism()));
  await pool.warm();
  const dir = await mkdtemp(join(tmpdir(), 'bench-pack-'));
  try {
    const start = performance.now();
    const cpuStart = process.cpuUsage();
    const pack = await buildPack(benchInput(), {
      renderPng: pool.render,
      runJob: pool.run,
      sha256Hex: (bytes) => createHash('sha256').update(bytes).digest('hex'),
      onProgress: () => (peakRss = Math.max(peakRss, process.memoryUsage.rss())),
    });
    const zipStart = performance.now();
    const out = createWriteStream(join(dir, 'pack.zip'));
    await pack.writeZip(
      (chunk) =>
        new Promise<void>((resolve, reject) => {
          peakRss = Math.max(peakRss, process.memoryUsage.rss());
          out.write(chunk, (error) => (error ? reject(error) : resolve()));
        }),
    );
    await new Promise<void>((resolve, reject) => out.end((error?: Error | null) => (error ? reject(error) : resolve())));
    const end = performance.now();
    const cpu = process.cpuUsage(cpuStart);
    const seconds = (end - start) / 1000;
    const layout = pack.manifest.space.layoutStimuli;
    const breakdown = Object.fromEntries([...Object.entries(pack.timings), ['zip', end - zipStart]].map(([k, v]) => [k, Math.round(v as number)]));
    const zipBytes = (await stat(join(dir, 'pack.zip'))).size;
    clearInterval(sampler);
    peakRss = Math.max(peakRss, process.memoryUsage.rss());
    console.log(
      JSON.stringify({
        stimuli: layout,
        prototypes: pack.manifest.space.prototypes,
        seconds: Number(seconds.toFixed(3)),
        stimuli_per_s: Number((layout / seconds).toFixed(1)),
        peak_rss_mb: Math.round(peakRss / 2 ** 20),
        zip_mb: Number((zipBytes / 2 ** 20).toFixed(1)),
        workers: availableParallelism(),
        // CPU of every thread of this process (main, workers, libuv's sharp threads), seconds; load-independent-ish.
        cpu_s: Number(((cpu.user + cpu.system) / 1e6).toFixed(2)),
        load_average_1m: Number((loadavg()[0] as number).toFixed(2)),
        breakdown,
      }),
    );
  } finally {
    clearInterval(sampler);
    await pool.close();
    await rm(dir, { recursive: true, force: true });
  }
}

await main();
