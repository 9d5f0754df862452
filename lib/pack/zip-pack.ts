import JSZip from 'jszip';
import type { PackFile } from './types';
import { addZipFiles, ZIP_GENERATE_OPTIONS, type PremadeZip } from './zip-entries';

/**
 * Streams a deterministic zip of `files` to `sink`: entries in the given order (callers sort by path), no folder
 * entries (`createFolders: false`), every entry dated `date` (an MS-DOS date and time to 2 s, which jszip
 * writes from the UTC fields, so the machine's time zone does not matter), DEFLATE at `PACK_LIMITS.deflateLevel`
 * or STORE per file, DOS platform, no comment. The same files and date always give the same bytes. Uses jszip's
 * internal stream, so the archive is never held whole.
 *
 * `premade` zips (`zipEntries` of runs of consecutive files, same date) are merged in their place with
 * `loadAsync`; jszip then copies their compressed entries rather than compressing again, which gives the same
 * bytes as compressing here (a file whose run is not in place is compressed here, as usual).
 */
export async function zipPack(files: readonly PackFile[], date: Date, sink: (chunk: Uint8Array) => void | Promise<void>, premade: readonly PremadeZip[] = []): Promise<void> {
  const zip = new JSZip();
  const runs = new Map(premade.filter((p) => p.paths.length > 0).map((p) => [p.paths[0] as string, p]));
  for (let i = 0; i < files.length; ) {
    const run = runs.get((files[i] as PackFile).path);
    if (run && run.paths.every((path, k) => files[i + k]?.path === path)) {
      await zip.loadAsync(run.bytes, { createFolders: false });
      i += run.paths.length;
      continue;
    }
    addZipFiles(zip, [files[i] as PackFile], date);
    i++;
  }
  const stream = zip.generateInternalStream({ type: 'uint8array', ...ZIP_GENERATE_OPTIONS });
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
