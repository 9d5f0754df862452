import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import type { PackPngRequest } from '@/lib/pack/types';
import type { PngRequest } from '@/lib/render/render-png';

const TSX_API = import.meta.resolve('tsx/esm/api');
const THREAD_ENTRY = new URL('./png-render-thread.ts', import.meta.url).href;

/**
 * PNG rendering across the cores: one worker thread per core, requests spread round-robin, many in flight.
 * Node 20 does not pass the tsx loader on to worker threads, so each thread registers it, then loads its entry.
 */
export class PngPool {
  private readonly workers: Worker[];
  private readonly pending = new Map<number, { resolve: (b: Uint8Array) => void; reject: (e: Error) => void }>();
  private seq = 0;

  constructor(size = availableParallelism()) {
    this.workers = Array.from({ length: Math.max(1, size) }, () => {
      const bootstrap = `import(${JSON.stringify(TSX_API)}).then((tsx) => { tsx.register(); return import(${JSON.stringify(THREAD_ENTRY)}); });`;
      const worker = new Worker(bootstrap, { eval: true });
      worker.on('message', (m: { seq: number; bytes?: Uint8Array; error?: string }) => {
        const job = this.pending.get(m.seq);
        if (!job) return;
        this.pending.delete(m.seq);
        if (m.bytes) job.resolve(m.bytes);
        else job.reject(new Error(m.error ?? 'render failed'));
      });
      worker.on('error', (error) => {
        for (const job of this.pending.values()) job.reject(error);
        this.pending.clear();
      });
      return worker;
    });
  }

  get size(): number {
    return this.workers.length;
  }

  render = (request: PackPngRequest): Promise<Uint8Array> => {
    const seq = this.seq++;
    const message: { seq: number; request: PngRequest } = { seq, request: { svg: request.svg, sizePx: request.sizePx, channels: request.channels } };
    return new Promise((resolve, reject) => {
      this.pending.set(seq, { resolve, reject });
      this.workers[seq % this.workers.length]!.postMessage(message);
    });
  };

  /** Resolves once every thread has loaded sharp (one tiny render each). */
  async warm(): Promise<void> {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="8" height="8"><rect width="8" height="8"/></svg>';
    await Promise.all(this.workers.map(() => this.render({ id: 'warm', svg, sizePx: 8, channels: 'grey' })));
  }

  async close(): Promise<void> {
    await Promise.all(this.workers.map((w) => w.terminate()));
  }
}
