import type { Rdm } from '../space/types';
import type { PackJobRunner } from './pack-job';
import { PACK_LIMITS } from './pack-limits';

/**
 * `rdmTsv`'s table as UTF-8 bytes — the same bytes as encoding its text — formatted in `PACK_LIMITS.tsvBlocks`
 * blocks of consecutive rows (`tsv-rows` jobs, each given copies of its rows only) handed to `run` at once, then
 * joined in order.
 */
export async function rdmTsvBytes(rdm: Rdm, ids: readonly string[], run: PackJobRunner): Promise<Uint8Array> {
  const n = rdm.size;
  if (ids.length !== n) throw new RangeError(`an RDM of size ${n} needs ${n} ids, got ${ids.length}`);
  const parts = Math.max(1, Math.min(PACK_LIMITS.tsvBlocks, n));
  const bounds = Array.from({ length: parts + 1 }, (_, b) => Math.round((n * b) / parts));
  const blocks = await Promise.all(
    bounds.slice(0, -1).map((from, b) => {
      const to = bounds[b + 1] as number;
      return run({ kind: 'tsv-rows', ids, rows: rdm.values.slice(from * n, to * n), from, to });
    }),
  );
  const bytes = new Uint8Array(blocks.reduce((sum, block) => sum + block.length, 0));
  let offset = 0;
  for (const block of blocks) {
    bytes.set(block, offset);
    offset += block.length;
  }
  return bytes;
}
