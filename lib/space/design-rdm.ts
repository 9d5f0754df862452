import type { Rdm, Stimulus } from './types';

/**
 * The designed dissimilarity: Euclidean distance between stimuli's designed coordinates (a, b), in axis
 * units (before equalisation, which is meant to make contour distance follow exactly these). Row-major,
 * symmetric, zero diagonal.
 */
export function designRdm(stimuli: readonly Pick<Stimulus, 'position'>[]): Rdm {
  const n = stimuli.length;
  const values = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    const p = (stimuli[i] as Pick<Stimulus, 'position'>).position;
    for (let j = i + 1; j < n; j++) {
      const q = (stimuli[j] as Pick<Stimulus, 'position'>).position;
      const d = Math.hypot(p.a - q.a, p.b - q.b);
      values[i * n + j] = d;
      values[j * n + i] = d;
    }
  }
  return { size: n, values };
}
