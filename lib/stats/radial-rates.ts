import { StatsError } from './stats-error';

/** A stimulus's designed polar place and where a perceptual map put it (aligned to the design's frame). */
export interface MappedStimulus {
  /** Designed radius (axis units, ≥ 0) and angle (radians). */
  readonly rho: number;
  readonly angle: number;
  /** The recovered position, in the design's coordinates (e.g. MDS after `procrustes`). */
  readonly recovered: readonly [number, number];
}

/** Perceived growth along one ray of the layout. */
export interface RadialRate {
  /** Radians in [0, 2π). */
  readonly angle: number;
  /** Recovered distance along the ray per designed unit: least-squares slope through the origin, Σρd / Σρ². */
  readonly rate: number;
  readonly stimuli: number;
}

/** Angles closer than this (radians) are one ray: layout angles are exact fractions of 2π. */
const SAME_RAY = 1e-9;

/**
 * Perceived spacing per ray: the stimuli off the centre are grouped by designed angle, and each one's recovered
 * position is projected onto its ray from the map's centre (the recovered position of the stimuli at ρ = 0,
 * averaged, or the origin when none was rated); the rate is the slope through the origin of that projection on
 * designed ρ. Raises `StatsError` (`not-finite`) for non-finite input.
 */
export function radialRates(stimuli: readonly MappedStimulus[]): RadialRate[] {
  if (stimuli.some((s) => !Number.isFinite(s.rho) || !Number.isFinite(s.angle) || !s.recovered.every(Number.isFinite))) {
    throw new StatsError('not-finite', 'Every radius, angle and recovered coordinate must be finite.');
  }
  const centres = stimuli.filter((s) => s.rho === 0);
  const cx = centres.length ? centres.reduce((t, s) => t + s.recovered[0], 0) / centres.length : 0;
  const cy = centres.length ? centres.reduce((t, s) => t + s.recovered[1], 0) / centres.length : 0;
  const rays: { angle: number; srd: number; srr: number; stimuli: number }[] = [];
  for (const s of stimuli) {
    if (s.rho <= 0) continue;
    const angle = ((s.angle % (2 * Math.PI)) + 2 * Math.PI) % (2 * Math.PI);
    let ray = rays.find((r) => Math.abs(r.angle - angle) < SAME_RAY);
    if (!ray) rays.push((ray = { angle, srd: 0, srr: 0, stimuli: 0 }));
    const d = (s.recovered[0] - cx) * Math.cos(angle) + (s.recovered[1] - cy) * Math.sin(angle);
    ray.srd += s.rho * d;
    ray.srr += s.rho * s.rho;
    ray.stimuli += 1;
  }
  return rays.sort((p, q) => p.angle - q.angle).map((r) => ({ angle: r.angle, rate: r.srd / r.srr, stimuli: r.stimuli }));
}
