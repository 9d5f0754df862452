// Worker-thread entry (see png-pool.ts) that rasterises stimulus SVGs with sharp (lib/render/render-png.ts). Messages:
// in { seq, request: PngRequest } → out { seq, bytes } (transferred) or { seq, error }.
import { parentPort } from 'node:worker_threads';
import sharp from 'sharp';
import { renderPng, type PngRequest } from '@/lib/render/render-png';

// One libvips thread per job: the pool's threads already spread the jobs over the cores.
sharp.concurrency(1);

const port = parentPort;
if (!port) throw new Error('png-render-worker runs only as a worker thread');

port.on('message', (message: { seq: number; request: PngRequest }) => {
  renderPng(message.request).then(
    (png) => {
      // A fresh ArrayBuffer of exactly this size, so it can be transferred instead of copied again.
      const bytes = png.slice();
      port.postMessage({ seq: message.seq, bytes }, [bytes.buffer]);
    },
    (error: unknown) => port.postMessage({ seq: message.seq, error: error instanceof Error ? error.message : String(error) }),
  );
});
