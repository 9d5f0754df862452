// Benchmark of lib/space (`node --import tsx scripts/bench-space.ts`). Prints one JSON line per case. A script,
// not a test: figures depend on the machine and its load; run it alone. `ms` is wall time per run (median of
// `runs`); `cpu_ms` is the process's CPU time per run over the same span, which shows when a busy machine, rather
// than the code, slowed a run down. Node on a server core, not Chromium: the live view's own frame budget is
// measured in the e2e run.
import {
  auditSpace,
  contourRdm,
  equalizeSpace,
  generateSpace,
  silhouetteRdm,
  stimulusContour,
  type SpaceDefinition,
} from '../lib/space/index';
import { SEED_PRESETS } from '../lib/seed-presets';
import type { ShapeDescriptor } from '../lib/shape/index';

const SAMPLES = 256;

function presetSeed(id: string): ShapeDescriptor {
  const preset = SEED_PRESETS.find((p) => p.id === id);
  if (!preset) throw new Error(`no preset ${id}`);
  return preset.descriptor as ShapeDescriptor;
}

/** 441 stimuli three ways: Rings 20 × 22 + 1, Lattice 21 × 21, Diameters 20 × 23 → 441. */
const LAYOUTS = {
  rings: { kind: 'rings', rings: 20, spokes: 22 },
  lattice: { kind: 'lattice', size: 21 },
  diameters: { kind: 'diameters', directions: 20, steps: 23 },
} as const;

function space(seedId: string, layout: SpaceDefinition['layout']): SpaceDefinition {
  const seed = presetSeed(seedId);
  const axes: SpaceDefinition['axes'] =
    seed.family === 'radial'
      ? [
          { label: 'Lobes 2', changes: [{ harmonic: 2, field: 'amplitude', delta: 0.08 }] },
          { label: 'Lobes 4', changes: [{ harmonic: 4, field: 'amplitude', delta: 0.04 }] },
        ]
      : [
          { label: 'Harmonic 2', changes: [{ harmonic: 2, field: 'a', delta: 0.08 }] },
          { label: 'Harmonic 3', changes: [{ harmonic: 3, field: 'd', delta: 0.04 }] },
        ];
  return { seed, axes, extent: 1, layout, normalization: { scale: 'equal-area-radius', centroid: true } };
}

function time(runs: number, work: () => unknown): { ms: number; cpu_ms: number } {
  work(); // warm-up: JIT and trig tables
  const wall: number[] = [];
  const cpu = process.cpuUsage();
  for (let r = 0; r < runs; r++) {
    const start = performance.now();
    work();
    wall.push(performance.now() - start);
  }
  const used = process.cpuUsage(cpu);
  wall.sort((p, q) => p - q);
  return { ms: Number((wall[Math.floor(runs / 2)] as number).toFixed(3)), cpu_ms: Number(((used.user + used.system) / 1000 / runs).toFixed(3)) };
}

function print(record: Record<string, unknown>): void {
  process.stdout.write(`${JSON.stringify(record)}\n`);
}

// 1. The live view: generate 441 stimuli and synthesise each at 256 samples.
for (const seedId of ['pebble', 'bean']) {
  const definition = space(seedId, LAYOUTS.rings);
  print({ case: 'generate', seed: seedId, stimuli: 441, ...time(50, () => generateSpace(definition)) });
  print({
    case: 'generate+synthesise',
    seed: seedId,
    stimuli: 441,
    samples: SAMPLES,
    ...time(50, () => generateSpace(definition).stimuli.map((s) => stimulusContour(s, SAMPLES))),
  });
}

// 2. The RDMs on 441 contours (97,020 pairs).
{
  const contours = generateSpace(space('pebble', LAYOUTS.rings)).stimuli.map((s) => stimulusContour(s, SAMPLES));
  for (const resolution of [128, 256]) print({ case: 'silhouetteRdm', stimuli: 441, pairs: 97_020, resolution, ...time(3, () => silhouetteRdm(contours, { resolution })) });
  print({ case: 'contourRdm', stimuli: 441, pairs: 97_020, samples: SAMPLES, ...time(3, () => contourRdm(contours)) });
}

// 3. The full confound audit and equalisation of 441-stimulus spaces.
for (const [kind, layout] of Object.entries(LAYOUTS)) {
  for (const seedId of ['pebble', 'bean']) {
    const definition = space(seedId, layout);
    print({ case: 'auditSpace', layout: kind, seed: seedId, stimuli: 441, ...time(2, () => auditSpace(definition)) });
    print({ case: 'equalizeSpace', layout: kind, seed: seedId, stimuli: 441, ...time(2, () => equalizeSpace(definition)) });
  }
}
