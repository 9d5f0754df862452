import type { Boundary } from '../boundary/types';
import type { ContrastFigures, DerivedSizes, DisplayProfile, PngChannels, RenderIssue, RenderOptions } from '../render/types';
import type { ShapeDescriptor } from '../shape/types';
import type { SpaceDefinition } from '../space/types';
import type { PackJobRunner } from './pack-job';

/** Edition states, as stored (Draft → In review → Approved | Returned). */
export type EditionState = 'draft' | 'in_review' | 'approved' | 'returned';

/** The edition a pack is made from: plain data. */
export interface PackEdition {
  readonly spaceName: string;
  /** Edition number within its space, whole, ≥ 1. */
  readonly number: number;
  /** Lowercase hex SHA-256 of the edition's canonical JSON (`lib/edition` `contentHash`), 64 characters. */
  readonly contentHash: string;
  readonly state: EditionState;
  /**
   * When the edition was frozen, ISO 8601 with a time zone (e.g. `2025-03-01T09:30:00Z`), 1980…2107 (the zip
   * date range). Every zip entry carries this date, never the current time, so a pack rebuilds byte for byte.
   */
  readonly createdAt: string;
}

/** A run-order file attached under `sequences/` (e.g. a BIDS `events.tsv`). */
export interface PackSequenceFile {
  /** Name inside `sequences/`: letters, digits, `.`, `_`, `-`, one optional subfolder level. */
  readonly name: string;
  readonly text: string;
}

/** Everything a stimulus pack is made from: plain data, no I/O handles. */
export interface PackInput {
  readonly edition: PackEdition;
  readonly definition: SpaceDefinition;
  readonly boundaries: readonly Boundary[];
  readonly profile: DisplayProfile;
  readonly render: RenderOptions;
  readonly versions: { readonly product: string; readonly engine: string };
  readonly sequences?: readonly PackSequenceFile[];
}

/** One thing wrong with a pack input; `field` is a dotted path into `PackInput`. */
export interface PackIssue {
  readonly field: string;
  readonly code: string;
  readonly message: string;
}

/** A file of the pack as listed in the manifest. */
export interface PackFileRef {
  /** Path inside the zip, `/`-separated. */
  readonly path: string;
  /** Lowercase hex SHA-256 of the file's bytes. */
  readonly sha256: string;
  readonly bytes: number;
}

/** Where a stimulus lies with respect to one boundary. */
export interface ManifestPlacement {
  readonly boundaryKey: string;
  /** 'A' along the boundary's normal, 'B' against it; null on the boundary (within 1e-9 axis units). */
  readonly category: 'A' | 'B' | null;
  readonly onBoundary: boolean;
  /** Signed distance to the boundary, axis units, positive on side A. */
  readonly signedDistance: number;
  /** signedDistance / ρmax. */
  readonly fraction: number;
}

/** One stimulus in the manifest. */
export interface ManifestStimulus {
  readonly id: string;
  /** A layout position (`c`, `r03-s07`, …) or a category prototype (`p-<key>-a|b`). */
  readonly kind: 'layout' | 'prototype';
  /** For prototypes: the boundary and side it stands for; null for layout stimuli. */
  readonly prototypeOf: { readonly boundaryKey: string; readonly side: 'A' | 'B' } | null;
  readonly files: { readonly svg: PackFileRef; readonly png: PackFileRef };
  /** Designed coordinates, axis units. */
  readonly position: { readonly a: number; readonly b: number };
  /** ρ axis units; angle degrees in [0, 360), counter-clockwise from +a. */
  readonly polar: { readonly rho: number; readonly angleDeg: number };
  readonly descriptor: ShapeDescriptor;
  /** Shift added to every synthesised point (radial centroid normalisation), shape units. */
  readonly contourOffset: readonly [number, number];
  readonly metrics: {
    /** Shape units², exact from the descriptor. */
    readonly area: number;
    /** Shape units. */
    readonly perimeter: number;
    /** 4πA/P². */
    readonly compactness: number;
    /** As drawn, degrees of visual angle. */
    readonly equalAreaDiameterDeg: number;
    readonly maxExtentDeg: number;
  };
  readonly boundaries: readonly ManifestPlacement[];
}

/** One model RDM file. */
export interface ManifestRdm {
  readonly name: 'design' | 'contour' | 'silhouette';
  readonly path: string;
  readonly unit: string;
  readonly description: string;
}

/** The pack's manifest (`manifest.json`; validates against `MANIFEST_SCHEMA`). Key order is fixed. */
export interface PackManifest {
  /** Present, and first, only when the edition is not approved. */
  readonly notice?: string;
  readonly schemaVersion: number;
  readonly approved: boolean;
  readonly product: { readonly name: string; readonly version: string };
  readonly engine: { readonly version: string };
  readonly edition: PackEdition;
  readonly displayProfile: DisplayProfile & { readonly derived: { readonly pixelsPerCm: number; readonly pixelsPerDegree: number } };
  readonly render: {
    readonly options: RenderOptions & { readonly fill: string; readonly background: string };
    readonly sizes: DerivedSizes;
    /** Pixels per shape unit, shared by every stimulus; the shape origin is at the canvas centre. */
    readonly pxPerUnit: number;
    readonly png: { readonly channels: PngChannels; readonly widthPx: number; readonly heightPx: number };
    readonly contrast: ContrastFigures & { readonly basis: string };
    readonly warnings: readonly RenderIssue[];
  };
  readonly space: { readonly definition: SpaceDefinition; readonly layoutStimuli: number; readonly prototypes: number };
  readonly boundaries: readonly { readonly key: string; readonly label: string | null; readonly angleDeg: number; readonly prototypeDistance: number }[];
  readonly rdms: readonly ManifestRdm[];
  /** The pack's other files (README, schema, tables, RDMs, sequences) with their hashes; stimuli list their own. */
  readonly files: readonly PackFileRef[];
  readonly stimuli: readonly ManifestStimulus[];
}

/** Stages of `buildPack`, in order, as reported to `onProgress` and timed in `timings`. */
export type PackStage = 'check' | 'synthesize' | 'svg' | 'rdm' | 'png' | 'tables' | 'hash';

/** What a render back end receives for one stimulus. */
export interface PackPngRequest {
  readonly id: string;
  /** Pixel-unit SVG (`stimulusSvg(…, { units: 'pixels' })`). */
  readonly svg: string;
  readonly sizePx: number;
  readonly channels: PngChannels;
}

/** The edges `buildPack` calls out to, so the core stays free of Node. */
export interface PackBackends {
  /**
   * Rasterises one stimulus. Called once per stimulus, all before the RDMs are computed, so a worker pool works
   * while the main thread computes them; results are awaited in order. Server: `renderPng` in a worker pool.
   */
  readonly renderPng: (request: PackPngRequest) => Promise<Uint8Array>;
  /** Lowercase hex SHA-256; default `lib/edition`'s pure `sha256` (the server may pass node:crypto's). */
  readonly sha256Hex?: (bytes: Uint8Array) => string;
  readonly onProgress?: (stage: PackStage, fraction: number) => void;
  /**
   * Runs a pure `PackJob` (RDM rows, RDM table lines, perimeters) and resolves with `runPackJob(job)`'s result,
   * e.g. in a worker thread; the jobs are handed out together, after the PNG requests, so a pool works on both
   * at once. Default: each job runs in the calling thread. Results do not depend on where a job runs.
   */
  readonly runJob?: PackJobRunner;
}

/** One file of a built pack. */
export interface PackFile extends PackFileRef {
  readonly data: Uint8Array;
  /** STORE for PNGs (already deflated), DEFLATE otherwise. */
  readonly compression: 'STORE' | 'DEFLATE';
}

/** A built pack: its manifest, its files and the zip, streamed. */
export interface BuiltPack {
  readonly manifest: PackManifest;
  /** Every file in zip order (sorted by path), each held once. */
  readonly files: readonly PackFile[];
  /** Wall time per stage, ms (not part of the pack's bytes). */
  readonly timings: Readonly<Record<PackStage, number>>;
  /**
   * Streams the zip to `sink` chunk by chunk (the sink may return a promise; the stream waits for it). The same
   * pack always gives the same bytes.
   */
  readonly writeZip: (sink: (chunk: Uint8Array) => void | Promise<void>) => Promise<void>;
}
