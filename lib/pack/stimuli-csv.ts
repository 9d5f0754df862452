import { stringify } from 'csv-stringify/sync';
import { neutralizeCsvCell } from '../csv/neutralize-csv-cell';
import { categoryLabel } from './category-label';
import type { ManifestStimulus } from './types';

/** Fixed columns of `stimuli.csv`, before the per-boundary ones; described in README.txt. */
export const STIMULI_COLUMNS = [
  'id',
  'kind',
  'prototype_boundary',
  'prototype_side',
  'a',
  'b',
  'rho',
  'angle_deg',
  'area',
  'perimeter',
  'compactness',
  'equal_area_diameter_deg',
  'max_extent_deg',
  'svg_file',
  'svg_sha256',
  'png_file',
  'png_sha256',
] as const;

/** Per-boundary columns, for a boundary key. */
export function boundaryColumns(key: string): readonly [string, string, string] {
  return [`category_${key}`, `distance_${key}`, `fraction_${key}`];
}

/**
 * `stimuli.csv`: a header, then one row per stimulus in manifest order — the fixed columns, three columns per
 * boundary in boundary order (category A / B / on, signed distance in axis units, distance / ρmax), and the
 * descriptor as JSON last. RFC 4180 through csv-stringify: CRLF line ends, fields with commas, quotes or line
 * breaks quoted, quotes doubled. Numbers in shortest round-trip form.
 */
export function stimuliCsv(stimuli: readonly ManifestStimulus[], boundaryKeys: readonly string[]): string {
  const header = [...STIMULI_COLUMNS, ...boundaryKeys.flatMap((k) => boundaryColumns(k)), 'descriptor_json'];
  const rows = stimuli.map((s) => [
    s.id,
    s.kind,
    s.prototypeOf?.boundaryKey ?? '',
    s.prototypeOf?.side ?? '',
    String(s.position.a),
    String(s.position.b),
    String(s.polar.rho),
    String(s.polar.angleDeg),
    String(s.metrics.area),
    String(s.metrics.perimeter),
    String(s.metrics.compactness),
    String(s.metrics.equalAreaDiameterDeg),
    String(s.metrics.maxExtentDeg),
    s.files.svg.path,
    s.files.svg.sha256,
    s.files.png.path,
    s.files.png.sha256,
    ...s.boundaries.flatMap((p) => [categoryLabel(p), String(p.signedDistance), String(p.fraction)]),
    JSON.stringify(s.descriptor),
  ]);
  return stringify([header, ...rows].map((row) => row.map(neutralizeCsvCell)), { record_delimiter: 'windows' });
}
