import JSZip from 'jszip';
import CompressedObject from 'jszip/lib/compressedObject';
import * as compressions from 'jszip/lib/compressions';
import { compressedEntry, compressFiles, type CompressedFiles } from './compress-files';
import type { PackFile } from './types';

/** MS-DOS permission bits are left unset; the platform field says DOS, whatever machine builds the zip. */
const ZIP_PLATFORM = 'DOS';
/** About how many bytes the sink is given at a time (the last chunk may be smaller). */
const SINK_CHUNK_BYTES = 1 << 20;

/**
 * Streams a deterministic zip of `files` to `sink`: entries in the given order (callers sort by path), no folder
 * entries (`createFolders: false`), every entry dated `date` (an MS-DOS date and time to 2 s, which jszip
 * writes from the UTC fields, so the machine's time zone does not matter), DEFLATE at `PACK_LIMITS.deflateLevel`
 * or STORE per file, DOS platform, no comment. The same files and date always give the same bytes. Uses jszip's
 * internal stream, so the archive is never held whole (about 1 MiB of it at a time).
 *
 * Every entry's data is compressed by `compressFiles` (native zlib): here, or ahead in `compressed` blocks (e.g.
 * in worker threads) for the files they list with the same compression. jszip is handed each entry as a
 * `CompressedObject`, as its `loadAsync` does for a zip it reads, so it only writes headers and copies bytes:
 * the zip is the same wherever the compression ran.
 */
export async function zipPack(files: readonly Pick<PackFile, 'path' | 'data' | 'compression'>[], date: Date, sink: (chunk: Uint8Array) => void | Promise<void>, compressed: readonly CompressedFiles[] = []): Promise<void> {
  const ahead = new Map<string, { block: CompressedFiles; index: number }>();
  for (const block of compressed) block.paths.forEach((path, index) => ahead.set(path, { block, index }));
  const zip = new JSZip();
  for (const file of files) {
    const found = ahead.get(file.path);
    const usable = found && found.block.compressions[found.index] === file.compression && found.block.sizes[found.index] === file.data.length;
    const { block, index } = usable ? found : { block: compressFiles([file]), index: 0 };
    const data = compressedEntry(block, index);
    const method = file.compression === 'DEFLATE' ? compressions.DEFLATE : compressions.STORE;
    const entry = new CompressedObject(data.length, file.data.length, block.crc32s[index] as number, method, data);
    zip.file(file.path, entry as unknown as Uint8Array, { binary: true, createFolders: false, date, compression: file.compression });
  }
  const stream = zip.generateInternalStream({ type: 'uint8array', platform: ZIP_PLATFORM, streamFiles: false });
  // jszip streams chunks of 16 KiB or less; they reach the sink gathered into about SINK_CHUNK_BYTES, so a sink
  // that waits for each write (a file, an upload) is not paced by thousands of small ones.
  let held: Uint8Array[] = [];
  let heldBytes = 0;
  const flush = (): void | Promise<void> => {
    if (heldBytes === 0) return;
    const chunk = held.length === 1 ? (held[0] as Uint8Array) : concatBytes(held, heldBytes);
    held = [];
    heldBytes = 0;
    return sink(chunk);
  };
  await new Promise<void>((resolve, reject) => {
    let failed = false;
    const fail = (error: unknown): void => {
      failed = true;
      reject(error);
    };
    stream
      .on('data', (chunk: Uint8Array) => {
        held.push(chunk);
        heldBytes += chunk.length;
        if (heldBytes < SINK_CHUNK_BYTES) return;
        const written = flush();
        if (written instanceof Promise) {
          stream.pause();
          written.then(() => stream.resume(), fail);
        }
      })
      .on('error', fail)
      .on('end', () => {
        if (failed) return;
        Promise.resolve()
          .then(flush)
          .then(resolve, fail);
      })
      .resume();
  });
}

function concatBytes(parts: readonly Uint8Array[], total: number): Uint8Array {
  const bytes = new Uint8Array(total);
  let offset = 0;
  for (const p of parts) {
    bytes.set(p, offset);
    offset += p.length;
  }
  return bytes;
}

/** A whole zip of `files` in memory, made as `zipPack` makes it (e.g. a run order's files). */
export async function zipBytes(files: readonly Pick<PackFile, 'path' | 'data' | 'compression'>[], date: Date): Promise<Uint8Array> {
  const chunks: Uint8Array[] = [];
  await zipPack(files, date, (chunk) => void chunks.push(chunk));
  return concatBytes(chunks, chunks.reduce((sum, c) => sum + c.length, 0));
}
