/**
 * Constants of stimulus packs.
 * - `schemaVersion` 1: bumped whenever `manifest.json` changes shape; `manifest.schema.json` carries it too.
 * - `deflateLevel` 1: zlib's fastest level, fixed so the zip's bytes never change with a library default. The
 *   text files (chiefly three million-value RDM tables at 1,001 stimuli) deflate in native zlib (`compressFiles`);
 *   PNGs are stored, being deflated already.
 * - Zip dates hold 1980…2107 (MS-DOS date fields).
 * - `silhouetteResolution` 256: the silhouette RDM's raster, `lib/space`'s default, so pack and audit agree.
 * - `rdmBlocks` 6, `silhouetteBlocks` 2, `tsvBlocks` 3, `perimeterBlocks` 2: how many `PackJob`s the contour
 *   RDM, the silhouette RDM, each RDM table and the perimeters are split into, so two or more worker threads
 *   share them while the PNGs render. Silhouette blocks are few: each carries and rasterises every contour from
 *   its first row on (six blocks rasterised each contour ~3.5 times and copied ~30 MB of outlines).
 * - `svgCompressBlocks` 2: the SVGs are compressed ahead in this many `compress` jobs, each RDM table in one more.
 */
export const PACK_LIMITS = {
  schemaVersion: 1,
  deflateLevel: 1,
  minZipYear: 1980,
  maxZipYear: 2107,
  silhouetteResolution: 256,
  rdmBlocks: 6,
  silhouetteBlocks: 2,
  tsvBlocks: 3,
  perimeterBlocks: 2,
  svgCompressBlocks: 2,
} as const;

/** The product's name as it appears in manifests. */
export const PRODUCT_NAME = 'Epicycle';
