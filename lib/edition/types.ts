/**
 * The JSON subset that canonical JSON (RFC 8785, the JSON Canonicalization Scheme) accepts here: objects,
 * arrays, strings without lone surrogates, finite numbers, booleans and null. `canonicalJson` takes `unknown`
 * and checks at run time; this type documents what passes.
 */
export type JsonValue = null | boolean | number | string | readonly JsonValue[] | { readonly [key: string]: JsonValue };

/** One stimulus as an edition stores it: its layout-position id, designed position and descriptor. */
export interface EditionStimulus {
  readonly id: string;
  /** Designed (a, b), axis units. */
  readonly position: { readonly a: number; readonly b: number };
  /** A `lib/shape` descriptor (plain data: family, numbers, arrays of terms). */
  readonly descriptor: unknown;
}

/** What changed about a stimulus present in both editions. */
export type StimulusChangeField = 'position' | 'descriptor';

/** A stimulus present in both editions whose position or descriptor moved beyond the tolerance. */
export interface ChangedStimulus<S extends EditionStimulus = EditionStimulus> {
  readonly id: string;
  readonly before: S;
  readonly after: S;
  /** Which parts differ, in this order: 'position', 'descriptor'. */
  readonly fields: readonly StimulusChangeField[];
}

/** The stimuli of two editions matched by id; each list in the order of its edition (new edition for changed). */
export interface EditionDiff<S extends EditionStimulus = EditionStimulus> {
  readonly added: readonly S[];
  readonly removed: readonly S[];
  readonly changed: readonly ChangedStimulus<S>[];
  readonly unchanged: readonly S[];
}

/**
 * One changed leaf of a parameter tree: `path` a JSON Pointer (RFC 6901) such as `/axes/0/changes/0/delta`;
 * `before` undefined when the entry was added, `after` undefined when it was removed.
 */
export interface ParameterChange {
  readonly path: string;
  readonly before: unknown;
  readonly after: unknown;
}

/** One stimulus of a frozen edition: a layout stimulus, or a category prototype of one boundary. */
export interface SnapshotStimulus extends EditionStimulus {
  readonly kind: 'layout' | 'prototype';
  readonly polar: { readonly rho: number; readonly angle: number };
  /** Added to every synthesised point (see `lib/space` `Stimulus.contourOffset`). */
  readonly contourOffset: readonly [number, number];
  /** Prototypes only: whose, and which side. */
  readonly prototypeOf?: { readonly boundaryKey: string; readonly side: 'A' | 'B' };
}

/** A boundary as frozen: the prototype distance is always resolved. */
export interface SnapshotBoundary {
  readonly key: string;
  readonly label: string;
  readonly angleDeg: number;
  readonly prototypeDistance: number;
}

/**
 * Everything an edition freezes, as plain JSON: hashed with `contentHash` (canonical JSON, RFC 8785), so two
 * snapshots with the same content have the same hash whatever the key order.
 */
export interface EditionSnapshot {
  readonly format: 1;
  readonly engineVersion: string;
  readonly space: { readonly id: string; readonly name: string };
  readonly seed: { readonly id: string; readonly name: string; readonly descriptor: unknown };
  readonly definition: {
    readonly axes: unknown;
    readonly extent: number;
    readonly layout: unknown;
    readonly normalization: unknown;
    readonly equalization: unknown;
  };
  readonly boundaries: readonly SnapshotBoundary[];
  readonly stimuli: readonly SnapshotStimulus[];
}
