import JSZip from 'jszip';
import { PACK_LIMITS } from './pack-limits';
import type { PackFile } from './types';

/** MS-DOS permission bits are left unset; the platform field says DOS, whatever machine builds the zip. */
const ZIP_PLATFORM = 'DOS';

/**
 * Streams a deterministic zip of `files` to `sink`: entries in the given order (callers sort by path), no folder
 * entries (`createFolders: false`), every entry dated `date` (an MS-DOS date and time to 2 s, which jszip
 * writes from the UTC fields, so the machine's time zone does not matter), DEFLATE at `PACK_LIMITS.deflateLevel` or STORE per file, DOS platform, no comment. The same files and
 * date always give the same bytes. Uses jszip's internal stream, so the archive is never held whole.
 */
export async function zipPack(files: readonly PackFile[], date: Date, sink: (chunk: Uint8Array) => void | Promise<void>): Promise<void> {
  const zip = new JSZip();
  for (const file of files) {
    zip.file(file.path, file.data, { binary: true, createFolders: false, date, compression: file.compression });
  }
  const stream = zip.generateInternalStream({
    type: 'uint8array',
    compression: 'DEFLATE',
    compressionOptions: { level: PACK_LIMITS.deflateLevel },
    platform: ZIP_PLATFORM,
    streamFiles: false,
  });
  await new Promise<void>((resolve, reject) => {
    let failed = false;
    stream
      .on('data', (chunk: Uint8Array) => {
        const written = sink(chunk);
        if (written instanceof Promise) {
          stream.pause();
          written.then(
            () => stream.resume(),
            (error: unknown) => {
              failed = true;
              reject(error);
            },
          );
        }
      })
      .on('error', (error: Error) => {
        failed = true;
        reject(error);
      })
      .on('end', () => {
        if (!failed) resolve();
      })
      .resume();
  });
}
