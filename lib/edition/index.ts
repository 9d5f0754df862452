// lib/edition — immutable editions of a shape space: RFC 8785 canonical JSON, SHA-256 content hashes and
// the diff between two editions. Pure and deterministic; runs in the browser and on the server alike.

export type { JsonValue } from './types';
export { EditionError, type EditionErrorCode } from './edition-error';
export { canonicalJson } from './canonical-json';
export { utf8Encode } from './utf8-encode';
export { sha256 } from './sha256';
export { toHex } from './to-hex';
export { contentHash } from './content-hash';
export type { ChangedStimulus, EditionDiff, EditionSnapshot, EditionStimulus, ParameterChange, SnapshotBoundary, SnapshotStimulus, StimulusChangeField } from './types';
export { buildSnapshot, type SnapshotInput } from './build-snapshot';
export { jsonPointer } from './json-pointer';
export { numericDifference } from './numeric-difference';
export { diffEditions, EDITION_DIFF_TOLERANCE } from './diff-editions';
export { diffParameters } from './diff-parameters';
