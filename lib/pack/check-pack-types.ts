import type { EditionState } from './types';

/** What was checked: a whole pack (every file), or only its manifest with its `SHA256SUMS`. */
export type PackCheckMode = 'zip' | 'manifest';

/**
 * The overall finding, most serious first: `unreadable` (no usable SHA256SUMS or manifest), `altered` (a file's
 * bytes differ from its listed hash), `incomplete` (listed files are missing), `inconsistent` (the lists disagree,
 * the manifest breaks its schema, or files not listed are present), `intact` (nothing wrong found).
 */
export type PackCheckVerdict = 'unreadable' | 'altered' | 'incomplete' | 'inconsistent' | 'intact';

/** A file whose bytes differ from the hash a list gives for it. */
export interface PackCheckAltered {
  readonly path: string;
  /** Lowercase hex SHA-256 the pack lists (SHA256SUMS first, else the manifest). */
  readonly expected: string;
  /** Lowercase hex SHA-256 of the bytes found. */
  readonly actual: string;
}

/** One thing wrong with the pack, in plain language. `code` is stable for clients; `path` names a file if one is at fault. */
export interface PackCheckProblem {
  readonly code: PackCheckProblemCode;
  readonly message: string;
  readonly path?: string;
}

export type PackCheckProblemCode =
  | 'no-sums'
  | 'sums-line'
  | 'sums-duplicate'
  | 'no-manifest'
  | 'manifest-json'
  | 'manifest-schema'
  | 'manifest-hash'
  | 'lists-disagree'
  | 'altered'
  | 'size-differs'
  | 'missing'
  | 'extra';

/** The edition a manifest says the pack was made from, for the server to match against the lab's editions. */
export interface PackCheckEditionClaim {
  readonly spaceName: string;
  readonly number: number;
  readonly contentHash: string;
  readonly state: EditionState;
  readonly createdAt: string;
}

/** A schema violation of `manifest.json`: a JSON Pointer into the manifest (`/stimuli/3/files/svg/sha256`) and why. */
export interface ManifestSchemaIssue {
  readonly pointer: string;
  readonly message: string;
}

/** The result of checking a pack. Plain data; every list sorted by path. */
export interface PackCheckReport {
  readonly mode: PackCheckMode;
  readonly verdict: PackCheckVerdict;
  /** One sentence a person can act on. */
  readonly summary: string;
  readonly counts: {
    /** Distinct paths listed in SHA256SUMS or the manifest. */
    readonly listed: number;
    /** Listed files whose bytes were hashed (0 in manifest mode, where only `manifest.json` is hashed). */
    readonly checked: number;
    readonly intact: number;
    readonly altered: number;
    readonly missing: number;
    readonly extra: number;
  };
  readonly altered: readonly PackCheckAltered[];
  readonly missing: readonly string[];
  readonly extra: readonly string[];
  readonly manifest: {
    readonly present: boolean;
    /** The manifest parsed as JSON. */
    readonly parsed: boolean;
    /** manifest.json's own SHA-256 equals its SHA256SUMS line; null when either is absent. */
    readonly hashMatchesSums: boolean | null;
    /** Violations of `MANIFEST_SCHEMA` (at most `MAX_SCHEMA_ISSUES`). */
    readonly schemaIssues: readonly ManifestSchemaIssue[];
  };
  readonly sums: { readonly present: boolean; readonly lines: number };
  /**
   * The one top-level folder the pack's files were found in (e.g. `my-pack/` when an unpacked pack was zipped
   * again), stripped before checking; null when the files sit at the top of the zip.
   */
  readonly folder: string | null;
  /** What the manifest claims; null when it cannot be read. */
  readonly edition: PackCheckEditionClaim | null;
  /** Every problem, the most serious first (capped at `MAX_REPORTED_PROBLEMS`). */
  readonly problems: readonly PackCheckProblem[];
  /** Problems left off the list above. */
  readonly problemsLeftOff: number;
}

/**
 * One file of the pack as the check receives it: its bytes, or (so a server need not hold a large pack in memory)
 * its SHA-256 and size computed while it was read. `manifest.json` and `SHA256SUMS` must come with their bytes.
 */
export type PackCheckEntry = Uint8Array | { readonly sha256: string; readonly size: number; readonly data?: Uint8Array };

/** Options of the pack check. */
export interface PackCheckOptions {
  /** Lowercase hex SHA-256; default `lib/edition`'s pure `sha256` (the server passes node:crypto's, which is faster). */
  readonly sha256Hex?: (bytes: Uint8Array) => string;
}
