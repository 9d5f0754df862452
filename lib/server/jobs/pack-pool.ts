import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import type { PackJob, PackJobResult } from '@/lib/pack/pack-job';
import type { PackPngRequest } from '@/lib/pack/types';
import type { PngRequest } from '@/lib/render/render-png';

const TSX_API = import.meta.resolve('tsx/esm/api');
const THREAD_ENTRY = new URL('./pack-thread.ts', import.meta.url).href;

/**
 * The threads a pack is built on: one worker thread per core rendering PNGs (sharp) and running lib/pack's heavy
 * pure jobs (RDM rows, table lines, perimeters), requests spread round-robin with many in flight. Used by the job
 * worker (scripts/worker.ts) and the pack benchmark alike. Node 20 does not pass the tsx loader on to worker
 * threads, so each thread registers it, then loads its entry.
 */
export class PackPool {
  private readonly workers: Worker[];
  private readonly pending = new Map<number, { resolve: (value: never) => void; reject: (e: Error) => void }>();
  private seq = 0;

  constructor(size = availableParallelism()) {
    this.workers = Array.from({ length: Math.max(1, size) }, () => {
      const bootstrap = `import(${JSON.stringify(TSX_API)}).then((tsx) => { tsx.register(); return import(${JSON.stringify(THREAD_ENTRY)}); });`;
      const worker = new Worker(bootstrap, { eval: true });
      worker.on('message', (m: { seq: number; bytes?: Uint8Array; result?: PackJobResult; error?: string }) => {
        const job = this.pending.get(m.seq);
        if (!job) return;
        this.pending.delete(m.seq);
        const value = m.bytes ?? m.result;
        if (value) job.resolve(value as never);
        else job.reject(new Error(m.error ?? 'pack thread failed'));
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

  private send<T>(message: { seq: number; request?: PngRequest; job?: PackJob }): Promise<T> {
    return new Promise<T>((resolve, reject) => {
      this.pending.set(message.seq, { resolve: resolve as (value: never) => void, reject });
      this.workers[message.seq % this.workers.length]!.postMessage(message);
    });
  }

  render = (request: PackPngRequest): Promise<Uint8Array> => {
    const { svg, sizePx, channels } = request;
    return this.send({ seq: this.seq++, request: { svg, sizePx, channels } });
  };

  run = <J extends PackJob>(job: J): Promise<PackJobResult<J['kind']>> => this.send({ seq: this.seq++, job });

  /** Resolves once every thread has loaded sharp (one tiny render each). */
  async warm(): Promise<void> {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="8" height="8"><rect width="8" height="8"/></svg>';
    await Promise.all(this.workers.map(() => this.render({ id: 'warm', svg, sizePx: 8, channels: 'grey' })));
  }

  async close(): Promise<void> {
    await Promise.all(this.workers.map((w) => w.terminate()));
  }
}
