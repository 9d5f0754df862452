/** Which stimuli of an edition a run order uses: all, or those on chosen rings, spokes or diameters. */
export type LayoutSelection =
  | { readonly kind: 'all' }
  | { readonly kind: 'rings' | 'spokes' | 'diameters'; readonly indices: readonly number[]; readonly includeCentre: boolean };

const RING_ID = /^r(\d+)-s(\d+)$/;
const DIAMETER_ID = /^d(\d+)-[pm]\d+$/;
const CENTRE_ID = 'c';

/**
 * The ids of `ids` (layout stimulus ids, see `stimulusId`) that a selection keeps, in their given order:
 * `all` keeps every one; `rings` keeps `r{ring}-s…` with ring in `indices` (rings count from 1); `spokes` keeps
 * `r…-s{spoke}` with spoke in `indices` (from 0); `diameters` keeps `d{direction}-…` with direction in `indices`
 * (from 0). The centre `c` joins when `includeCentre` is set. Prototype stimuli are kept only by `all`.
 */
export function selectLayoutStimuli(ids: readonly string[], selection: LayoutSelection): string[] {
  if (selection.kind === 'all') return [...ids];
  const wanted = new Set(selection.indices);
  return ids.filter((id) => {
    if (id === CENTRE_ID) return selection.includeCentre;
    const ring = RING_ID.exec(id);
    if (ring) return selection.kind === 'rings' ? wanted.has(Number(ring[1])) : selection.kind === 'spokes' && wanted.has(Number(ring[2]));
    const diameter = DIAMETER_ID.exec(id);
    return diameter !== null && selection.kind === 'diameters' && wanted.has(Number(diameter[1]));
  });
}
