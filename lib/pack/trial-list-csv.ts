import { stringify } from 'csv-stringify/sync';
import { neutralizeCsvCell } from '../csv/neutralize-csv-cell';
import { categoryLabel } from './category-label';
import type { ManifestStimulus } from './types';

/** Fixed columns of `trial-list.csv`. */
export const TRIAL_LIST_COLUMNS = ['stimulus_id', 'kind', 'png_file', 'svg_file'] as const;

/**
 * `trial-list.csv`: one row per stimulus with its file paths (relative to the pack's root) and one
 * `category_<key>` column per boundary (`A`, `B`, or `on`), ready to load as a condition file in any experiment
 * software. RFC 4180 (csv-stringify, CRLF).
 */
export function trialListCsv(stimuli: readonly ManifestStimulus[], boundaryKeys: readonly string[]): string {
  const header = [...TRIAL_LIST_COLUMNS, ...boundaryKeys.map((k) => `category_${k}`)];
  const rows = stimuli.map((s) => [s.id, s.kind, s.files.png.path, s.files.svg.path, ...s.boundaries.map(categoryLabel)]);
  return stringify([header, ...rows].map((row) => row.map(neutralizeCsvCell)), { record_delimiter: 'windows' });
}
