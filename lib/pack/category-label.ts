import type { ManifestPlacement } from './types';

/** The category as a table cell: `A`, `B`, or `on` for a stimulus on the boundary (neither category). */
export function categoryLabel(placement: ManifestPlacement): string {
  return placement.category ?? 'on';
}
