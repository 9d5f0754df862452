import { orientation } from './orientation';
import type { Contour } from './types';

/** Lexicographic order of vertices (x first, then y): the sweep order. */
function compareVertices(x: Float64Array, y: Float64Array, i: number, j: number): number {
  const dx = (x[i] as number) - (x[j] as number);
  if (dx !== 0) return dx;
  return (y[i] as number) - (y[j] as number);
}

/** Exact: does point c, known to be collinear with a and b, lie within the segment ab? */
function withinBox(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): boolean {
  return Math.min(ax, bx) <= cx && cx <= Math.max(ax, bx) && Math.min(ay, by) <= cy && cy <= Math.max(ay, by);
}

/**
 * Stage: edges of zero length and adjacent edges that fold back over each other. Returns the offending edge
 * pair ([i, i] for a zero-length edge i) or undefined.
 */
function findLocalDegeneracy(x: Float64Array, y: Float64Array): readonly [number, number] | undefined {
  const n = x.length;
  for (let i = 0; i < n; i++) {
    const j = (i + 1) % n;
    if (x[i] === x[j] && y[i] === y[j]) return [i, i];
  }
  for (let i = 0; i < n; i++) {
    const v = (i + 1) % n;
    const w = (i + 2) % n;
    const turn = orientation(x[i] as number, y[i] as number, x[v] as number, y[v] as number, x[w] as number, y[w] as number);
    if (turn !== 0) continue;
    // Collinear: the path folds back when both neighbours lie on the same side of the middle vertex.
    if (Math.sign(compareVertices(x, y, i, v)) === Math.sign(compareVertices(x, y, w, v))) {
      return i < v ? [i, v] : [v, i];
    }
  }
  return undefined;
}

/**
 * Shamos & Hoey's sweep (1976) for "does any pair of edges of this closed polygon meet, other than adjacent
 * edges at their shared vertex?", with every decision made by an exact orientation predicate (Shewchuk's
 * adaptive arithmetic via robust-predicates), so touching, collinear overlap and repeated vertices all count.
 * O(N log N) comparisons; the active list is a sorted array, so insertion costs a memmove of its length.
 *
 * Returns the indices [i, j] (i ≤ j) of two offending edges (edge i runs from vertex i to vertex i+1), with
 * [i, i] for a zero-length edge i; undefined when the polygon is simple. Assumes N ≥ 3 finite vertices.
 */
export function findSelfIntersection(contour: Contour): readonly [number, number] | undefined {
  const { x, y } = contour;
  const n = x.length;
  // Phase 1: local degeneracies, which the sweep's tie rules assume away.
  const local = findLocalDegeneracy(x, y);
  if (local || n === 3) return local;

  // Phase 2: vertices in sweep order; two distinct vertices at one point are a self-touch.
  const order = new Uint32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  order.sort((i, j) => compareVertices(x, y, i, j));
  for (let s = 1; s < n; s++) {
    const i = order[s - 1] as number;
    const j = order[s] as number;
    if (x[i] === x[j] && y[i] === y[j]) return i < j ? [i, j] : [j, i];
  }

  // Phase 3: edge endpoints, left = earlier in sweep order.
  const left = new Uint32Array(n);
  const right = new Uint32Array(n);
  for (let e = 0; e < n; e++) {
    const f = (e + 1) % n;
    const eFirst = compareVertices(x, y, e, f) < 0;
    left[e] = eFirst ? e : f;
    right[e] = eFirst ? f : e;
  }
  const isAdjacent = (e: number, f: number): boolean => {
    const d = Math.abs(e - f);
    return d === 1 || d === n - 1;
  };
  const intersects = (e: number, f: number): boolean => {
    if (e === f || isAdjacent(e, f)) return false;
    const a = left[e] as number;
    const b = right[e] as number;
    const c = left[f] as number;
    const d = right[f] as number;
    const ax = x[a] as number, ay = y[a] as number, bx = x[b] as number, by = y[b] as number;
    const cx = x[c] as number, cy = y[c] as number, dx = x[d] as number, dy = y[d] as number;
    const o1 = orientation(ax, ay, bx, by, cx, cy);
    const o2 = orientation(ax, ay, bx, by, dx, dy);
    const o3 = orientation(cx, cy, dx, dy, ax, ay);
    const o4 = orientation(cx, cy, dx, dy, bx, by);
    if (o1 * o2 < 0 && o3 * o4 < 0) return true;
    if (o1 === 0 && withinBox(ax, ay, bx, by, cx, cy)) return true;
    if (o2 === 0 && withinBox(ax, ay, bx, by, dx, dy)) return true;
    if (o3 === 0 && withinBox(cx, cy, dx, dy, ax, ay)) return true;
    if (o4 === 0 && withinBox(cx, cy, dx, dy, bx, by)) return true;
    return false;
  };

  // Phase 4: the sweep. `active` holds edges crossing the sweep line, bottom to top.
  const active = new Int32Array(n);
  let count = 0;
  let found: readonly [number, number] | undefined;
  const report = (e: number, f: number): void => {
    found = e < f ? [e, f] : [f, e];
  };
  /** Sign of (new edge e relative to active edge s): +1 above, −1 below; 0 means they meet. */
  const side = (e: number, s: number): number => {
    const sl = left[s] as number;
    const sr = right[s] as number;
    const p = left[e] as number;
    const o = orientation(x[sl] as number, y[sl] as number, x[sr] as number, y[sr] as number, x[p] as number, y[p] as number);
    if (o !== 0) return o;
    if (!isAdjacent(e, s)) return 0;
    const q = right[e] as number;
    return orientation(x[sl] as number, y[sl] as number, x[sr] as number, y[sr] as number, x[q] as number, y[q] as number);
  };
  const insert = (e: number): void => {
    let low = 0;
    let high = count;
    while (low < high) {
      const mid = (low + high) >> 1;
      const s = active[mid] as number;
      const o = side(e, s);
      if (o === 0) return report(e, s);
      if (o > 0) low = mid + 1;
      else high = mid;
    }
    active.copyWithin(low + 1, low, count);
    active[low] = e;
    count++;
    if (low > 0 && intersects(e, active[low - 1] as number)) return report(e, active[low - 1] as number);
    if (low + 1 < count && intersects(e, active[low + 1] as number)) return report(e, active[low + 1] as number);
  };
  const remove = (e: number): void => {
    let position = -1;
    for (let i = 0; i < count; i++) {
      if (active[i] === e) {
        position = i;
        break;
      }
    }
    if (position < 0) return;
    active.copyWithin(position, position + 1, count);
    count--;
    if (position > 0 && position < count) {
      const below = active[position - 1] as number;
      const above = active[position] as number;
      if (intersects(below, above)) report(below, above);
    }
  };
  for (let s = 0; s < n && !found; s++) {
    const v = order[s] as number;
    const incoming = (v + n - 1) % n;
    const outgoing = v;
    // Deletions first: an edge ending here can only meet an edge starting here at this shared vertex.
    if (right[incoming] === v) remove(incoming);
    if (!found && right[outgoing] === v) remove(outgoing);
    if (!found && left[incoming] === v) insert(incoming);
    if (!found && left[outgoing] === v) insert(outgoing);
  }
  return found;
}
