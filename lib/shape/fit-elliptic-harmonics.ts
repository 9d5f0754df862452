import { checkOutline } from './check-outline';
import { ShapeError } from './errors';
import type { Contour, EllipticDescriptor, EllipticTerm } from './types';

/**
 * Elliptic Fourier descriptors of a closed polygon by Kuhl & Giardina's closed-form sums (1982, eqs. 6–7 and
 * the DC terms): with edge p of length Δt_p, cumulative arc length t_p, perimeter T and φ_p = 2πn t_p/T,
 *   a_n = T/(2n²π²) Σ_p (Δx_p/Δt_p)(cos φ_p − cos φ_{p−1}),  b_n = T/(2n²π²) Σ_p (Δx_p/Δt_p)(sin φ_p − sin φ_{p−1}),
 * and c_n, d_n alike with Δy. A0, C0 are the arc-length means of x and y. The parameter is arc length scaled to
 * [0, 2π), starting at vertex 0 and following the vertex order (a clockwise polygon gives a clockwise
 * descriptor; `normalizeEllipticHarmonics` fixes direction). Any vertex count ≥ 3; repeated vertices are
 * skipped. `harmonics`: 1…128.
 */
export function fitEllipticHarmonics(contour: Contour, harmonics: number): EllipticDescriptor {
  checkOutline(contour, harmonics);
  const { x, y } = contour;
  const n = x.length;
  // Phase 1: edges and cumulative arc length.
  const dxs = new Float64Array(n);
  const dys = new Float64Array(n);
  const lengths = new Float64Array(n);
  const ends = new Float64Array(n);
  let perimeter = 0;
  let meanX = 0;
  let meanY = 0;
  for (let p = 0; p < n; p++) {
    const q = p + 1 === n ? 0 : p + 1;
    const dx = (x[q] as number) - (x[p] as number);
    const dy = (y[q] as number) - (y[p] as number);
    const length = Math.hypot(dx, dy);
    dxs[p] = dx;
    dys[p] = dy;
    lengths[p] = length;
    meanX += (length * ((x[p] as number) + (x[q] as number))) / 2;
    meanY += (length * ((y[p] as number) + (y[q] as number))) / 2;
    perimeter += length;
    ends[p] = perimeter;
  }
  if (!(perimeter > 0)) throw new ShapeError('degenerate-shape', 'the outline has zero length', { value: perimeter });
  // Phase 2: the harmonic sums.
  const terms: EllipticTerm[] = [];
  for (let h = 1; h <= harmonics; h++) {
    const omega = (2 * Math.PI * h) / perimeter;
    let a = 0, b = 0, c = 0, d = 0;
    let cosBefore = 1;
    let sinBefore = 0;
    for (let p = 0; p < n; p++) {
      const phi = omega * (ends[p] as number);
      const cosAfter = Math.cos(phi);
      const sinAfter = Math.sin(phi);
      const length = lengths[p] as number;
      if (length > 0) {
        const rx = (dxs[p] as number) / length;
        const ry = (dys[p] as number) / length;
        a += rx * (cosAfter - cosBefore);
        b += rx * (sinAfter - sinBefore);
        c += ry * (cosAfter - cosBefore);
        d += ry * (sinAfter - sinBefore);
      }
      cosBefore = cosAfter;
      sinBefore = sinAfter;
    }
    const factor = perimeter / (2 * h * h * Math.PI * Math.PI);
    terms.push({ n: h, a: factor * a, b: factor * b, c: factor * c, d: factor * d });
  }
  return { family: 'elliptic', center: [meanX / perimeter, meanY / perimeter], terms };
}
