/**
 * Constants of stimulus packs.
 * - `schemaVersion` 1: bumped whenever `manifest.json` changes shape; `manifest.schema.json` carries it too.
 * - `deflateLevel` 1: zlib's fastest level, fixed so the zip's bytes never change with a library default.
 *   The text files (chiefly three million-value RDM tables at 1,001 stimuli) deflate in pure JS (jszip's pako),
 *   where the zip stage dominated at level 6. PNGs are stored, being deflated already.
 * - Zip dates hold 1980…2107 (MS-DOS date fields).
 * - `silhouetteResolution` 256: the silhouette RDM's raster, `lib/space`'s default, so pack and audit agree.
 * - `rdmBlocks` 6, `tsvBlocks` 3, `perimeterBlocks` 2: how many `PackJob`s the contour and silhouette RDMs, each
 *   RDM table and the perimeters are split into, so two or more worker threads share them evenly while the PNGs
 *   render; more blocks would mostly add copying (a silhouette block carries its contours).
 */
export const PACK_LIMITS = {
  schemaVersion: 1,
  deflateLevel: 1,
  minZipYear: 1980,
  maxZipYear: 2107,
  silhouetteResolution: 256,
  rdmBlocks: 6,
  tsvBlocks: 3,
  perimeterBlocks: 2,
} as const;

/** The product's name as it appears in manifests. */
export const PRODUCT_NAME = 'Epicycle';
