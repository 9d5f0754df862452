import { anisotropyFromRates } from './anisotropy-from-rates';
import type { AuditMeasure, RayGrowth } from './types';

/**
 * The anisotropy index as an audit measure (`anisotropyFromRates` over the rays' growth rates), flagged above
 * `threshold`, naming the fastest and slowest directions. An infinite index (a direction that does not change
 * the outline) and an undefined one (no direction does) are flagged too.
 */
export function anisotropyMeasure(rays: readonly RayGrowth[], threshold: number): AuditMeasure & { rays: readonly RayGrowth[] } {
  const used = rays.filter((r) => r.ids.length > 0);
  if (used.length === 0) return { value: null, threshold, flagged: false, rays, message: 'The layout has no directions out from the centre to compare.' };
  const index = anisotropyFromRates(used.map((r) => r.rate));
  const fastest = used.reduce((f, r) => (r.rate > f.rate ? r : f));
  const slowest = used.reduce((s, r) => (r.rate < s.rate ? r : s));
  if (Number.isNaN(index)) {
    return { value: null, threshold, flagged: true, rays, message: 'No direction out from the centre changes the outline: every stimulus has the same shape.' };
  }
  if (index === Infinity) {
    return {
      value: index,
      threshold,
      flagged: true,
      rays,
      message: `Moving along ${slowest.label} does not change the outline at all (for instance a phase change that only rotates the shape), while ${fastest.label} does: the space is degenerate in that direction.`,
    };
  }
  const flagged = index > threshold;
  const message = flagged
    ? `Contour distance grows ${index.toFixed(2)} times faster along ${fastest.label} than along ${slowest.label} (limit ${threshold.toFixed(2)}): the space is stretched in some directions. Equalise re-maps the radius to even this out.`
    : `Contour distance grows at much the same rate in every direction (index ${index.toFixed(2)}, at most ${threshold.toFixed(2)}).`;
  return { value: index, threshold, flagged, rays, message };
}
