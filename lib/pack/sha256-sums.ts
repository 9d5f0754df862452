import type { PackFileRef } from './types';

/**
 * `SHA256SUMS` in the GNU coreutils format `sha256sum -c` reads: per file `<64 lowercase hex><space><space><path>`
 * (two spaces: text mode, which on POSIX reads the same bytes as binary), one line each, LF, in the given order.
 * Paths must not hold line breaks or backslashes (coreutils would escape them).
 */
export function sha256Sums(files: readonly PackFileRef[]): string {
  return files
    .map((f) => {
      if (/[\n\r\\]/.test(f.path)) throw new RangeError(`path ${JSON.stringify(f.path)} cannot be listed in SHA256SUMS`);
      return `${f.sha256}  ${f.path}\n`;
    })
    .join('');
}
