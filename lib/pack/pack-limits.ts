/**
 * Constants of stimulus packs.
 * - `schemaVersion` 1: bumped whenever `manifest.json` changes shape; `manifest.schema.json` carries it too.
 * - `deflateLevel` 6: zlib's default trade of size for time, fixed so the zip's bytes never change with a
 *   library default.
 * - Zip dates hold 1980…2107 (MS-DOS date fields).
 * - `silhouetteResolution` 256: the silhouette RDM's raster, `lib/space`'s default, so pack and audit agree.
 */
export const PACK_LIMITS = {
  schemaVersion: 1,
  deflateLevel: 6,
  minZipYear: 1980,
  maxZipYear: 2107,
  silhouetteResolution: 256,
} as const;

/** The product's name as it appears in manifests. */
export const PRODUCT_NAME = 'Epicycle';
