import JSZip from 'jszip';
import { PACK_LIMITS } from './pack-limits';
import type { PackFile } from './types';

/** MS-DOS permission bits are left unset; the platform field says DOS, whatever machine builds the zip. */
const ZIP_PLATFORM = 'DOS';

/** jszip's generate options of every pack archive, whole or partial, so their entries are written alike. */
export const ZIP_GENERATE_OPTIONS = {
  compression: 'DEFLATE',
  compressionOptions: { level: PACK_LIMITS.deflateLevel },
  platform: ZIP_PLATFORM,
  streamFiles: false,
} as const;

/** A zip holding some of a pack's files, compressed ahead, and the paths it holds (in its order). */
export interface PremadeZip {
  readonly paths: readonly string[];
  readonly bytes: Uint8Array;
}

/** Adds `files` to `zip` in order, dated `date`, each with its own compression, no folder entries. */
export function addZipFiles(zip: JSZip, files: readonly Pick<PackFile, 'path' | 'data' | 'compression'>[], date: Date): void {
  for (const file of files) zip.file(file.path, file.data, { binary: true, createFolders: false, date, compression: file.compression });
}

/**
 * A zip of `files` alone, in order, made exactly as `zipPack` makes their entries (same dates, compression,
 * level and platform), so `zipPack` can merge its compressed entries instead of compressing them again: the
 * DEFLATE work of a pack's bulky text files (SVGs, RDM tables) can run in other threads, ahead of the zip.
 */
export async function zipEntries(files: readonly Pick<PackFile, 'path' | 'data' | 'compression'>[], date: Date): Promise<PremadeZip> {
  const zip = new JSZip();
  addZipFiles(zip, files, date);
  const bytes = await zip.generateAsync({ type: 'uint8array', ...ZIP_GENERATE_OPTIONS });
  return { paths: files.map((f) => f.path), bytes };
}
