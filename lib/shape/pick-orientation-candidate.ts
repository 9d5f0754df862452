/** One way to place a shape: rotation α and start shift τ (radians), as in `transformComplexHarmonics`. */
export interface OrientationCandidate {
  readonly rotation: number;
  readonly startShift: number;
}

/** A harmonic with coefficient c (re, im) at index k, as seen by the tie-break. */
export interface TieBreakTerm {
  readonly k: number;
  readonly re: number;
  readonly im: number;
}

/**
 * Stage of every orientation rule: among candidate placements that the rule itself cannot tell apart, keep
 * the one whose transformed harmonics c_k e^{i(α + kτ)} are lexicographically largest — harmonics taken in
 * order of decreasing |c_k| (ties: smaller |k − 1|, then positive k first), each compared by real part, then
 * imaginary part. Differences within `tolerance` (absolute, shape units) are ties; harmonics smaller than it
 * are ignored. If candidates still tie, they describe the same shape (it is symmetric), so the first is kept.
 */
export function pickOrientationCandidate(
  candidates: readonly OrientationCandidate[],
  terms: readonly TieBreakTerm[],
  tolerance: number,
): OrientationCandidate {
  let alive = [...candidates];
  const ordered = terms
    .filter((t) => Math.hypot(t.re, t.im) > tolerance)
    .sort((p, q) => {
      const dm = Math.hypot(q.re, q.im) - Math.hypot(p.re, p.im);
      if (Math.abs(dm) > tolerance) return dm;
      return Math.abs(p.k - 1) - Math.abs(q.k - 1) || q.k - p.k;
    });
  for (const term of ordered) {
    if (alive.length <= 1) break;
    const transformed = alive.map((candidate) => {
      const angle = candidate.rotation + term.k * candidate.startShift;
      return {
        candidate,
        re: term.re * Math.cos(angle) - term.im * Math.sin(angle),
        im: term.re * Math.sin(angle) + term.im * Math.cos(angle),
      };
    });
    const bestRe = Math.max(...transformed.map((t) => t.re));
    const byRe = transformed.filter((t) => t.re >= bestRe - tolerance);
    const bestIm = Math.max(...byRe.map((t) => t.im));
    alive = byRe.filter((t) => t.im >= bestIm - tolerance).map((t) => t.candidate);
  }
  const chosen = alive[0] ?? candidates[0];
  if (!chosen) throw new RangeError('pickOrientationCandidate needs at least one candidate');
  return chosen;
}
