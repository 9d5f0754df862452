// Node-only: DEFLATE and CRC-32 through node:zlib (native zlib), several times faster than jszip's pure-JS pako on
// a pack's ~35 MB of text. Packs are only ever built in Node (the job worker, its threads, the benchmark).
import { crc32, deflateRawSync } from 'node:zlib';
import { PACK_LIMITS } from './pack-limits';
import type { PackFile } from './types';

/**
 * Files compressed ahead of the zip, in one buffer: entry i is `bytes[offsets[i] … offsets[i + 1])`, a raw
 * DEFLATE stream (level `PACK_LIMITS.deflateLevel`) or, for STORE, the data itself; `crc32s[i]` and `sizes[i]`
 * are those of the uncompressed data, as the zip records them. One buffer, so a thread can transfer it.
 */
export interface CompressedFiles {
  readonly paths: readonly string[];
  readonly compressions: readonly PackFile['compression'][];
  readonly crc32s: Uint32Array;
  readonly sizes: Float64Array;
  readonly offsets: Float64Array;
  readonly bytes: Uint8Array;
}

/** The data of entry `i` of `block` as the zip stores it (a view, not a copy). */
export function compressedEntry(block: CompressedFiles, i: number): Uint8Array {
  return block.bytes.subarray(block.offsets[i] as number, block.offsets[i + 1] as number);
}

/**
 * Compresses `files` as the pack's zip stores them: DEFLATE at `PACK_LIMITS.deflateLevel` (zlib's fastest level,
 * fixed so the bytes never follow a library default), or STORE. The same data give the same bytes for a given
 * Node build (its bundled zlib); where this runs (a thread or the main one) does not change them.
 */
export function compressFiles(files: readonly Pick<PackFile, 'path' | 'data' | 'compression'>[]): CompressedFiles {
  const parts = files.map((f) => (f.compression === 'DEFLATE' ? deflateRawSync(f.data, { level: PACK_LIMITS.deflateLevel }) : f.data));
  const offsets = new Float64Array(files.length + 1);
  parts.forEach((p, i) => (offsets[i + 1] = (offsets[i] as number) + p.length));
  const bytes = new Uint8Array(offsets[files.length] as number);
  parts.forEach((p, i) => bytes.set(p, offsets[i] as number));
  return {
    paths: files.map((f) => f.path),
    compressions: files.map((f) => f.compression),
    crc32s: Uint32Array.from(files, (f) => crc32(f.data) >>> 0),
    sizes: Float64Array.from(files, (f) => f.data.length),
    offsets,
    bytes,
  };
}
