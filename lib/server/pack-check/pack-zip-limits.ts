import 'server-only';

const MIB = 1024 * 1024;

/** Limits on an uploaded pack zip. Every one is checked while reading, never trusted from the zip's headers alone. */
export interface PackZipLimits {
  /** Largest upload, bytes. A pack of ~1,000 stimuli with 512² PNGs is ~60–200 MB; 600 MB leaves room for larger renders. */
  readonly maxZipBytes: number;
  /** Most entries. A pack holds 2 files per stimulus plus ~10: 20,000 covers 9,995 stimuli. */
  readonly maxEntries: number;
  /** Most inflated bytes in all, counted while inflating. */
  readonly maxTotalBytes: number;
  /** Most inflated bytes of one entry, counted while inflating (the RDM tables of 1,001 stimuli are ~10 MB each). */
  readonly maxEntryBytes: number;
  /**
   * Largest inflated ÷ compressed ratio of an entry once it passes `ratioFloorBytes`. DEFLATE reaches ~1,032:1 on
   * runs of one byte; pack text (SVG, CSV, TSV, JSON) deflates ~3–15:1 at level 1 and PNGs are stored.
   */
  readonly maxRatio: number;
  /** Entries smaller than this when inflated are never refused for their ratio (tiny files deflate very well). */
  readonly ratioFloorBytes: number;
  /** `manifest.json` and `SHA256SUMS` are kept in memory to be read; everything else is hashed as it streams. */
  readonly maxKeptBytes: number;
  /** Longest entry name, bytes. */
  readonly maxNameBytes: number;
}

export const PACK_ZIP_LIMITS: PackZipLimits = {
  maxZipBytes: 600 * MIB,
  maxEntries: 20_000,
  maxTotalBytes: 2048 * MIB,
  maxEntryBytes: 512 * MIB,
  maxRatio: 100,
  ratioFloorBytes: 1 * MIB,
  maxKeptBytes: 64 * MIB,
  maxNameBytes: 1024,
};

/** Largest manifest-and-SHA256SUMS request (JSON), bytes: a manifest of ~10,000 stimuli is ~20 MB. */
export const PACK_MANIFEST_CHECK_MAX_BYTES = 64 * MIB;
