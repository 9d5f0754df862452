import { checkSameLength } from './check-same-length';
import type { Contour } from './types';

function centred({ x, y }: Contour): { re: Float64Array; im: Float64Array } {
  const n = x.length;
  let mx = 0;
  let my = 0;
  for (let i = 0; i < n; i++) {
    mx += (x[i] as number) / n;
    my += (y[i] as number) / n;
  }
  return { re: x.map((v) => v - mx), im: y.map((v) => v - my) };
}

/**
 * Mean distance between corresponding vertices after rigid least-squares alignment (translation of the vertex
 * means, then the rotation maximising Re Σ conj(a_j)·b_j, i.e. orthogonal Procrustes/Kabsch without scaling), in
 * shape units. Vertex j of `a` corresponds to vertex j of `b`; with `matchStart` every cyclic shift of `b` is
 * tried and the best alignment kept (O(N²)).
 */
export function correspondingPointDistance(a: Contour, b: Contour, options: { readonly matchStart?: boolean } = {}): number {
  checkSameLength(a, b);
  const p = centred(a);
  const q = centred(b);
  const n = a.x.length;
  // Phase 1: the cyclic shift (if asked) with the largest |Σ conj(p_j) q_{j+s}|, which minimises the residual.
  let bestShift = 0;
  if (options.matchStart) {
    let best = -Infinity;
    for (let s = 0; s < n; s++) {
      let re = 0;
      let im = 0;
      for (let j = 0; j < n; j++) {
        const k = (j + s) % n;
        const pr = p.re[j] as number, pi = p.im[j] as number, qr = q.re[k] as number, qi = q.im[k] as number;
        re += pr * qr + pi * qi;
        im += pr * qi - pi * qr;
      }
      const magnitude = Math.hypot(re, im);
      if (magnitude > best) {
        best = magnitude;
        bestShift = s;
      }
    }
  }
  // Phase 2: optimal rotation of p onto q, then the mean distance.
  let re = 0;
  let im = 0;
  for (let j = 0; j < n; j++) {
    const k = (j + bestShift) % n;
    const pr = p.re[j] as number, pi = p.im[j] as number, qr = q.re[k] as number, qi = q.im[k] as number;
    re += pr * qr + pi * qi;
    im += pr * qi - pi * qr;
  }
  const angle = Math.atan2(im, re);
  const c = Math.cos(angle);
  const s = Math.sin(angle);
  let sum = 0;
  for (let j = 0; j < n; j++) {
    const k = (j + bestShift) % n;
    const pr = p.re[j] as number, pi = p.im[j] as number;
    sum += Math.hypot(pr * c - pi * s - (q.re[k] as number), pr * s + pi * c - (q.im[k] as number));
  }
  return sum / n;
}
