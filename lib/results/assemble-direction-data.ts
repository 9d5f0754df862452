import type { AssembledData, DirectionData, ResultTrial } from './types';

/** Levels closer than this (fractions of ρmax) are one level: positions come from the same design. */
const LEVEL_TOLERANCE = 1e-9;

interface Cell {
  x: number;
  n: number;
  k: number;
}

function toDirectionData(directionDeg: number, cells: readonly Cell[], misses: number): DirectionData {
  const sorted = [...cells].sort((a, b) => a.x - b.x);
  return {
    directionDeg,
    data: { x: sorted.map((c) => c.x), n: sorted.map((c) => c.n), k: sorted.map((c) => c.k) },
    trials: sorted.reduce((s, c) => s + c.n, 0),
    misses,
  };
}

function addTo(cells: Cell[], x: number, choseB: boolean): void {
  let cell = cells.find((c) => Math.abs(c.x - x) <= LEVEL_TOLERANCE);
  if (!cell) cells.push((cell = { x, n: 0, k: 0 }));
  cell.n++;
  if (choseB) cell.k++;
}

/**
 * Binomial data for the fits: for every participant and direction, the count of answered trials n and of "anchor
 * B" answers k at each level x (signed position towards B); and the pooled data of each direction, summed over
 * participants level by level. Misses (no answer) are counted, not fitted. `directionsDeg` fixes the order (the
 * design's); a direction nobody answered still appears, with no levels. Participants in increasing order.
 */
export function assembleDirectionData(trials: readonly ResultTrial[], directionsDeg: readonly number[]): AssembledData {
  const perParticipant = new Map<number, Map<number, { cells: Cell[]; misses: number }>>();
  const pooled = new Map<number, { cells: Cell[]; misses: number }>(directionsDeg.map((d) => [d, { cells: [], misses: 0 }]));
  for (const t of trials) {
    if (t.isCatch) continue;
    let directions = perParticipant.get(t.participant);
    if (!directions) perParticipant.set(t.participant, (directions = new Map(directionsDeg.map((d) => [d, { cells: [], misses: 0 }]))));
    const own = directions.get(t.directionDeg);
    const all = pooled.get(t.directionDeg);
    if (!own || !all) continue;
    if (t.choseB === null) {
      own.misses++;
      all.misses++;
      continue;
    }
    addTo(own.cells, t.x, t.choseB);
    addTo(all.cells, t.x, t.choseB);
  }
  return {
    directionsDeg: [...directionsDeg],
    participants: [...perParticipant.entries()]
      .sort((a, b) => a[0] - b[0])
      .map(([participant, directions]) => ({ participant, directions: directionsDeg.map((d) => toDirectionData(d, directions.get(d)!.cells, directions.get(d)!.misses)) })),
    pooled: directionsDeg.map((d) => toDirectionData(d, pooled.get(d)!.cells, pooled.get(d)!.misses)),
  };
}
