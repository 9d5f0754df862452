import { spearman } from './spearman';
import { StatsError } from './stats-error';

/** One pair-similarity answer: the two stimulus ids (either order) and the rating on the 1…scaleMax scale. */
export interface PairRating {
  readonly participant: number;
  readonly first: string;
  readonly second: string;
  readonly rating: number;
}

export interface PerceptualRdmOptions {
  /** The scale's top rating (7 on the 1–7 scale), meaning "most similar". */
  readonly scaleMax: number;
}

/** Split-half reliability of the perceptual RDM and its Spearman–Brown step-up: the noise ceiling. */
export interface NoiseCeiling {
  /** How the ratings were split: odd vs even participants, or (one participant) odd vs even repetitions of a pair. */
  readonly split: 'participants' | 'repetitions';
  /** Spearman ρ between the two halves' mean-rating RDMs, over the pairs rated in both halves. */
  readonly splitHalf: number;
  /** 2ρ/(1 + ρ): the expected correlation of the full data with a replication (Spearman 1910; Brown 1910). */
  readonly ceiling: number;
  readonly pairs: number;
}

export interface PerceptualRdm {
  readonly ids: readonly string[];
  /** Row-major, symmetric, zero diagonal: (scaleMax − mean rating)/(scaleMax − 1) in [0, 1]; NaN for unrated pairs. */
  readonly values: Float64Array;
  readonly size: number;
  /** Ratings per pair, row-major like `values` (0 on the diagonal). */
  readonly counts: Uint32Array;
  readonly ratings: number;
  readonly participants: number;
  /** Null when there is nothing to split (one participant who rated each pair once, or too few pairs). */
  readonly noiseCeiling: NoiseCeiling | null;
}

/** Pairs shared by both halves needed for a split-half correlation to be worth reporting. */
const MIN_SPLIT_PAIRS = 3;

/** Stage: mean-rating dissimilarities of the given answers, NaN where a pair has none. */
function meanDissimilarity(ids: readonly string[], ratings: readonly PairRating[], scaleMax: number): { values: Float64Array; counts: Uint32Array } {
  const n = ids.length;
  const index = new Map(ids.map((id, i) => [id, i]));
  const sums = new Float64Array(n * n);
  const counts = new Uint32Array(n * n);
  for (const r of ratings) {
    const i = index.get(r.first), j = index.get(r.second);
    if (i === undefined || j === undefined || i === j) continue;
    sums[i * n + j] = (sums[i * n + j] as number) + r.rating;
    sums[j * n + i] = (sums[j * n + i] as number) + r.rating;
    counts[i * n + j] = (counts[i * n + j] as number) + 1;
    counts[j * n + i] = (counts[j * n + i] as number) + 1;
  }
  const values = new Float64Array(n * n);
  for (let c = 0; c < n * n; c++) {
    const row = Math.floor(c / n);
    if (row === c % n) continue;
    const count = counts[c] as number;
    values[c] = count === 0 ? NaN : (scaleMax - (sums[c] as number) / count) / (scaleMax - 1);
  }
  return { values, counts };
}

/** Stage: Spearman ρ of two RDMs' upper triangles over the pairs finite in both. */
function halfCorrelation(n: number, a: Float64Array, b: Float64Array): { rho: number; pairs: number } {
  const xs: number[] = [], ys: number[] = [];
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const x = a[i * n + j] as number, y = b[i * n + j] as number;
      if (Number.isFinite(x) && Number.isFinite(y)) {
        xs.push(x);
        ys.push(y);
      }
    }
  }
  return { rho: xs.length >= MIN_SPLIT_PAIRS ? spearman(xs, ys) : NaN, pairs: xs.length };
}

/**
 * The perceptual RDM of pair-similarity ratings: per unordered pair, the mean rating turned into a dissimilarity
 * (scaleMax − mean)/(scaleMax − 1), so 0 = rated most similar, 1 = least. Its noise ceiling is the split-half
 * reliability stepped up by Spearman–Brown, 2ρ/(1 + ρ): the ratings are split into odd- and even-numbered
 * participants (with two or more), or into odd and even repetitions of each pair (with one), the halves' RDMs
 * correlated by Spearman ρ over the pairs both rated. Stimuli not in `ids` are ignored. Raises `StatsError`
 * (`invalid-option`) for a scale below 2 or a rating outside 1…scaleMax.
 */
export function perceptualRdm(ids: readonly string[], ratings: readonly PairRating[], options: PerceptualRdmOptions): PerceptualRdm {
  const { scaleMax } = options;
  if (!Number.isInteger(scaleMax) || scaleMax < 2) throw new StatsError('invalid-option', `The rating scale must run from 1 to a whole number ≥ 2; got ${scaleMax}.`);
  for (const r of ratings) {
    if (!Number.isInteger(r.rating) || r.rating < 1 || r.rating > scaleMax) throw new StatsError('invalid-option', `Ratings must be whole numbers from 1 to ${scaleMax}; got ${r.rating}.`);
  }
  const n = ids.length;
  const { values, counts } = meanDissimilarity(ids, ratings, scaleMax);
  const participants = [...new Set(ratings.map((r) => r.participant))].sort((p, q) => p - q);
  // Phase 2: the split, by participant when there are two or more, else by repetition of each pair.
  let halves: [PairRating[], PairRating[]];
  let split: NoiseCeiling['split'];
  if (participants.length >= 2) {
    const odd = new Set(participants.filter((_, i) => i % 2 === 1));
    halves = [ratings.filter((r) => !odd.has(r.participant)), ratings.filter((r) => odd.has(r.participant))];
    split = 'participants';
  } else {
    const seen = new Map<string, number>();
    halves = [[], []];
    for (const r of ratings) {
      const key = r.first < r.second ? `${r.first}\u0000${r.second}` : `${r.second}\u0000${r.first}`;
      const k = seen.get(key) ?? 0;
      seen.set(key, k + 1);
      halves[k % 2]!.push(r);
    }
    split = 'repetitions';
  }
  const a = meanDissimilarity(ids, halves[0], scaleMax).values;
  const b = meanDissimilarity(ids, halves[1], scaleMax).values;
  const { rho, pairs } = halfCorrelation(n, a, b);
  const noiseCeiling = Number.isFinite(rho) ? { split, splitHalf: rho, ceiling: rho <= -1 ? -1 : (2 * rho) / (1 + rho), pairs } : null;
  return { ids, values, size: n, counts, ratings: ratings.length, participants: participants.length, noiseCeiling };
}
