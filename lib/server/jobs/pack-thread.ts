// Worker-thread entry of the pack pool (pack-pool.ts): rasterises stimulus SVGs with sharp (lib/render/render-png.ts) and runs
// lib/pack's pure jobs (RDM rows, RDM table lines, perimeters; runPackJob). Messages:
// in { seq, request: PngRequest } → out { seq, bytes } (transferred) or { seq, error };
// in { seq, job: PackJob } → out { seq, result } (its bytes or values transferred) or { seq, error }.
// sharp renders on libuv's thread pool, so a job running on this thread does not hold up PNGs already started.
import { parentPort } from 'node:worker_threads';
import sharp from 'sharp';
import { runPackJob, type PackJob, type PackJobResult } from '@/lib/pack/pack-job';
import { renderPng, type PngRequest } from '@/lib/render/render-png';

// One libvips thread per job: the pool's threads already spread the jobs over the cores.
sharp.concurrency(1);

const port = parentPort;
if (!port) throw new Error('pack-thread.ts runs only as a worker thread');

const message = (error: unknown): string => (error instanceof Error ? error.message : String(error));

/** The buffer to transfer with a job's result (each result owns its buffer). */
function transferable(result: PackJobResult): ArrayBuffer {
  // Typed arrays have a values() method too, so test for one, not for the property.
  const array = ArrayBuffer.isView(result) ? result : 'bytes' in result ? result.bytes : result.values;
  return array.buffer as ArrayBuffer;
}

port.on('message', (m: { seq: number; request?: PngRequest; job?: PackJob }) => {
  if (m.job) {
    runPackJob(m.job).then(
      (result) => port.postMessage({ seq: m.seq, result }, [transferable(result)]),
      (error: unknown) => port.postMessage({ seq: m.seq, error: message(error) }),
    );
    return;
  }
  if (!m.request) return;
  renderPng(m.request).then(
    (png) => {
      // A fresh ArrayBuffer of exactly this size, so it can be transferred instead of copied again.
      const bytes = png.slice();
      port.postMessage({ seq: m.seq, bytes }, [bytes.buffer]);
    },
    (error: unknown) => port.postMessage({ seq: m.seq, error: message(error) }),
  );
});
