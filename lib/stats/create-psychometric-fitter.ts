import * as limits from './fisher-scoring-limits';
import { INV_SQRT_2PI, normalCdf } from './normal-cdf';
import type { BoundHit, LapseOption, Link } from './types';

/** Options of `createPsychometricFitter`. */
export interface FitterOptions {
  readonly link: Link;
  /** Spread range [min, max] in units of x, 0 < min < max (see `spreadBoundsFor`). */
  readonly spreadBounds: { readonly min: number; readonly max: number };
  /** Absent: λ = 0. `{ max }`: λ free on [0, max]. `{ fixed }`: λ held. Both in [0, 0.5), checked by the caller. */
  readonly lapse?: LapseOption;
  /** Hold the threshold at this value (units of x) and fit the spread (and λ) alone; absent: threshold free. */
  readonly fixedThreshold?: number;
  /**
   * Newton decrement (natural-log units) below which a full Newton step ends the climb; default 1e−7. A resample
   * needs less: 1e−4 leaves ℓ within ~1e−8 of its maximum and the parameters within ~1e−4 standard errors.
   */
  readonly newtonTolerance?: number;
}

/** A starting point: a previous fit of the same design, e.g. the fit a parametric-bootstrap resample came from. */
export interface FitterStart {
  readonly threshold: number;
  readonly spread: number;
  readonly lapse: number;
}

/** One fit by a `PsychometricFitter`: ML parameters (units of x; λ a probability), ℓ kernel and bound reports. */
export interface FitterResult {
  readonly threshold: number;
  readonly spread: number;
  readonly lapse: number;
  readonly logLikelihood: number;
  readonly spreadAtBound: BoundHit;
  readonly lapseAtBound: BoundHit;
  /** Newton/Fisher steps taken (for benchmarks and diagnostics). */
  readonly iterations: number;
}

/** A fitter bound to one design (levels, trial counts, link, bounds): call `fit` with the counts k of each level. */
export interface PsychometricFitter {
  /** Number of levels the counts must have. */
  readonly levels: number;
  /**
   * Fits counts k (integers 0…n_i, not checked: validate first): climbs from each start given (e.g. the modes of
   * the fit a resample came from), or from the cold starts, and with λ free also from the best step between levels
   * when that beats them; returns the best local maximum, `iterations` summed over the climbs.
   */
  fit(k: ArrayLike<number>, start?: FitterStart | readonly FitterStart[]): FitterResult;
  /** The distinct local maxima within `margin` (natural-log units) of the best, best first (see the fitter doc). */
  findModes(k: ArrayLike<number>, margin: number): FitterResult[];
}

/**
 * Default: stop after a full Newton step whose decrement gᵀd (twice the gain the quadratic model predicts) was below this,
 * in natural-log units: Newton converges quadratically, so the next decrement would be of order 1e−14 to 1e−13 and
 * ℓ is that close to its maximum, far inside the 1e−6 at which ℓ differences start to matter for a test.
 */
const NEWTON_DECREMENT_TOLERANCE = 1e-7;
/**
 * A further start is abandoned when ℓ at it plus its Newton decrement (twice the gain its quadratic model
 * predicts) plus this margin (natural-log units) stays below the best maximum found: generous, since the model is
 * only local, yet it spares a whole climb for most starts in another basin than a resample's best.
 */
const SCREEN_MARGIN = 1;
/** The same rule for any other step (Fisher scoring converges only linearly, so it must get closer first). */
const DECREMENT_TOLERANCE = 1e-11;
/** Cholesky pivots below this fraction of their diagonal count as singular (then Fisher scoring is used). */
const PIVOT_TOLERANCE = 1e-12;
/** Two local maxima are one when threshold (in spreads), ln spread and λ (in units of max) differ by less. */
const MODE_SEPARATION = 1e-3;
// Local copies of the shared stopping rules: module bindings can compile to property reads in hot loops.
const { BOUND_TOLERANCE, LOG_LIKELIHOOD_TOLERANCE, MAX_HALVINGS, MAX_ITERATIONS, VARIANCE_FLOOR } = limits;
/** Variables: 0 the offset c, 1 the inverse spread b, 2 the lapse λ. */
const VARIABLES = 3;

// Slots of an evaluation buffer: ℓ, the score g, the negative observed Hessian A and the expected information I.
const LL = 0;
const G = 1;
const A = 4;
const I = 13;
/** 1 once the information of the buffer's point is filled in. */
const HAS_I = 22;
const EVALUATION_SIZE = 23;

/**
 * A maximum-likelihood fitter for one design of ψ(x) = λ + (1 − 2λ)F((x − threshold)/spread) that fits threshold,
 * spread and a bounded symmetric lapse jointly: Newton's method on the log-likelihood in the GLM form
 * η = c + b(x − x̄), b = 1/spread, falling back to Fisher scoring (Nelder & Wedderburn 1972) when the observed
 * Hessian is not negative definite, with an active set for the box 1/spread_max ≤ b ≤ 1/spread_min, 0 ≤ λ ≤ max
 * (a variable on a bound whose step leaves the box is held there; Bertsekas, Nonlinear Programming, §2.4), steps
 * shortened to the box and halved until ℓ does not fall, and the Newton decrement as the stopping rule. All work
 * arrays are allocated once per fitter, so a parametric bootstrap refits thousands of resamples without
 * allocating in its inner loops. Pure and deterministic.
 */
export function createPsychometricFitter(x: readonly number[], n: readonly number[], options: FitterOptions): PsychometricFitter {
  const m = x.length;
  const isLogit = options.link === 'logit';
  const thresholdFixed = options.fixedThreshold !== undefined;
  const lapseOption = options.lapse;
  const lapseFree = lapseOption !== undefined && 'max' in lapseOption && lapseOption.max > 0;
  const lapseMax = lapseOption !== undefined && 'max' in lapseOption ? lapseOption.max : 0;
  const lapseHeld = lapseOption !== undefined && 'fixed' in lapseOption ? lapseOption.fixed : 0;
  const newtonTolerance = options.newtonTolerance ?? NEWTON_DECREMENT_TOLERANCE;
  const bLow = 1 / options.spreadBounds.max;
  const bHigh = 1 / options.spreadBounds.min;

  // Centred levels: about x̄ when the threshold is free (c carries it), about the held threshold otherwise (c ≡ 0).
  let xMin = Number.POSITIVE_INFINITY;
  let xMax = Number.NEGATIVE_INFINITY;
  let xSum = 0;
  for (const v of x) {
    xMin = Math.min(xMin, v);
    xMax = Math.max(xMax, v);
    xSum += v;
  }
  const centre = thresholdFixed ? (options.fixedThreshold as number) : xSum / m;
  const xc = Float64Array.from(x, (v) => v - centre);
  const trials = Float64Array.from(n);
  const counts = new Float64Array(m);
  const startB = Math.min(bHigh, Math.max(bLow, 4 / (xMax - xMin)));
  // Levels in ascending order and the total trial count, for the screen of steep maxima (`steepStart`).
  const order = Int32Array.from(x.keys()).sort((i, j) => (x[i] as number) - (x[j] as number));
  const xSorted = Float64Array.from(order, (i) => x[i] as number);
  let totalTrials = 0;
  for (const v of n) totalTrials += v;

  let current = new Float64Array(EVALUATION_SIZE);
  let trial = new Float64Array(EVALUATION_SIZE);
  const matrix = new Float64Array(VARIABLES * VARIABLES);
  const cholesky = new Float64Array(VARIABLES * VARIABLES);
  const score = new Float64Array(VARIABLES);
  const direction = new Float64Array(VARIABLES);
  const free = [true, true, true];
  const index = new Int32Array(VARIABLES);

  function swap(): void {
    const held = current;
    current = trial;
    trial = held;
  }

  /**
   * ℓ, the score and the negative observed Hessian at (c, b, λ) into `out` (ℓ alone when `derivatives` is false).
   * The expected information, needed only where the observed Hessian is not negative definite, is left to
   * `addInformation`.
   */
  function evaluate(c: number, b: number, lapse: number, out: Float64Array, derivatives = true): void {
    const s = 1 - 2 * lapse;
    let ll = 0;
    let g0 = 0, g1 = 0, g2 = 0;
    let a00 = 0, a01 = 0, a02 = 0, a11 = 0, a12 = 0, a22 = 0;
    for (let i = 0; i < m; i++) {
      const u = xc[i] as number;
      const eta = c + b * u;
      // F(η), F(−η) = 1 − F(η) computed without cancellation, the density f and its derivative f′.
      let F: number;
      let Fc: number;
      let f: number;
      let fPrime: number;
      if (isLogit) {
        const e = Math.exp(-Math.abs(eta));
        const big = 1 / (1 + e);
        const small = e * big;
        F = eta >= 0 ? big : small;
        Fc = eta >= 0 ? small : big;
        f = big * small;
        fPrime = f * (Fc - F);
      } else {
        const tail = normalCdf(-Math.abs(eta));
        F = eta >= 0 ? 1 - tail : tail;
        Fc = eta >= 0 ? tail : 1 - tail;
        f = INV_SQRT_2PI * Math.exp(-0.5 * eta * eta);
        fPrime = -eta * f;
      }
      const psi = lapse + s * F;
      const psiC = lapse + s * Fc;
      const nk = trials[i] as number;
      const k = counts[i] as number;
      const miss = nk - k;
      // dℓ/dψ and −d²ℓ/dψ², zero counts contributing nothing (so ψ = 0 or 1 is allowed there).
      let r1 = 0;
      let r2 = 0;
      if (k > 0) {
        const inverse = 1 / psi;
        ll += k * Math.log(psi);
        r1 = k * inverse;
        r2 = r1 * inverse;
      }
      if (miss > 0) {
        const inverse = 1 / psiC;
        const q = miss * inverse;
        ll += miss * Math.log(psiC);
        r1 -= q;
        r2 += q * inverse;
      }
      if (!derivatives) continue;
      // ∂ψ/∂(c, b, λ) and the second derivatives ∂²ψ (∂²ψ/∂λ² = 0).
      const dc = s * f;
      const db = dc * u;
      const dl = Fc - F;
      const hcc = s * fPrime;
      const hcb = hcc * u;
      const hcl = -2 * f;
      g0 += r1 * dc;
      g1 += r1 * db;
      g2 += r1 * dl;
      a00 += r2 * dc * dc - r1 * hcc;
      a01 += r2 * dc * db - r1 * hcb;
      a02 += r2 * dc * dl - r1 * hcl;
      a11 += r2 * db * db - r1 * hcb * u;
      a12 += r2 * db * dl - r1 * hcl * u;
      a22 += r2 * dl * dl;
    }
    out[LL] = ll;
    out[G] = g0;
    out[G + 1] = g1;
    out[G + 2] = g2;
    out[A] = a00;
    out[A + 1] = out[A + 3] = a01;
    out[A + 2] = out[A + 6] = a02;
    out[A + 4] = a11;
    out[A + 5] = out[A + 7] = a12;
    out[A + 8] = a22;
    out[HAS_I] = 0;
  }

  /** The expected (Fisher) information at (c, b, λ) into `out`, once per point. */
  function addInformation(c: number, b: number, lapse: number, out: Float64Array): void {
    if (out[HAS_I] === 1) return;
    const s = 1 - 2 * lapse;
    let i00 = 0, i01 = 0, i02 = 0, i11 = 0, i12 = 0, i22 = 0;
    for (let i = 0; i < m; i++) {
      const u = xc[i] as number;
      const eta = c + b * u;
      let F: number;
      let Fc: number;
      let f: number;
      if (isLogit) {
        const e = Math.exp(-Math.abs(eta));
        const big = 1 / (1 + e);
        const small = e * big;
        F = eta >= 0 ? big : small;
        Fc = eta >= 0 ? small : big;
        f = big * small;
      } else {
        const tail = normalCdf(-Math.abs(eta));
        F = eta >= 0 ? 1 - tail : tail;
        Fc = eta >= 0 ? tail : 1 - tail;
        f = INV_SQRT_2PI * Math.exp(-0.5 * eta * eta);
      }
      const w = (trials[i] as number) / Math.max((lapse + s * F) * (lapse + s * Fc), VARIANCE_FLOOR);
      const dc = s * f;
      const db = dc * u;
      const dl = Fc - F;
      i00 += w * dc * dc;
      i01 += w * dc * db;
      i02 += w * dc * dl;
      i11 += w * db * db;
      i12 += w * db * dl;
      i22 += w * dl * dl;
    }
    out[I] = i00;
    out[I + 1] = out[I + 3] = i01;
    out[I + 2] = out[I + 6] = i02;
    out[I + 4] = i11;
    out[I + 5] = out[I + 7] = i12;
    out[I + 8] = i22;
    out[HAS_I] = 1;
  }

  /** Solves M_ff d_f = g_f over the free variables by Cholesky (M from slot `from` of `current`); false if not PD. */
  function solve(from: number): boolean {
    let size = 0;
    for (let j = 0; j < VARIABLES; j++) {
      direction[j] = 0;
      if (free[j]) index[size++] = j;
    }
    for (let r = 0; r < size; r++) {
      for (let col = 0; col < size; col++) matrix[r * VARIABLES + col] = current[from + (index[r] as number) * VARIABLES + (index[col] as number)] as number;
      score[r] = current[G + (index[r] as number)] as number;
    }
    // M = L Lᵀ, L in the lower triangle of `cholesky`.
    for (let r = 0; r < size; r++) {
      for (let col = 0; col <= r; col++) {
        let sum = matrix[r * VARIABLES + col] as number;
        for (let q = 0; q < col; q++) sum -= (cholesky[r * VARIABLES + q] as number) * (cholesky[col * VARIABLES + q] as number);
        if (r === col) {
          const diagonal = matrix[r * VARIABLES + r] as number;
          if (!(sum > PIVOT_TOLERANCE * diagonal) || !(diagonal > 0)) return false;
          cholesky[r * VARIABLES + r] = Math.sqrt(sum);
        } else {
          cholesky[r * VARIABLES + col] = sum / (cholesky[col * VARIABLES + col] as number);
        }
      }
    }
    // Forward then back substitution.
    for (let r = 0; r < size; r++) {
      let sum = score[r] as number;
      for (let q = 0; q < r; q++) sum -= (cholesky[r * VARIABLES + q] as number) * (score[q] as number);
      score[r] = sum / (cholesky[r * VARIABLES + r] as number);
    }
    for (let r = size - 1; r >= 0; r--) {
      let sum = score[r] as number;
      for (let q = r + 1; q < size; q++) sum -= (cholesky[q * VARIABLES + r] as number) * (score[q] as number);
      score[r] = sum / (cholesky[r * VARIABLES + r] as number);
    }
    for (let r = 0; r < size; r++) direction[index[r] as number] = score[r] as number;
    return true;
  }

  /** Newton direction (returns true), else Fisher scoring, else a diagonally scaled score step (false). */
  function chooseDirection(c: number, b: number, lapse: number): boolean {
    if (solve(A)) return true;
    addInformation(c, b, lapse, current);
    if (solve(I)) return false;
    for (let j = 0; j < VARIABLES; j++) {
      const info = current[I + j * VARIABLES + j] as number;
      direction[j] = free[j] && info > 0 ? (current[G + j] as number) / info : 0;
    }
    return false;
  }

  /**
   * Climbs from a start (the given fit, or a neutral one) to a local maximum of ℓ within the box. Gives up
   * (undefined) at once if the first step's quadratic model cannot reach `mustBeat`: ℓ + gᵀd + SCREEN_MARGIN below it.
   */
  function climb(start: FitterStart | undefined, mustBeat = Number.NEGATIVE_INFINITY): FitterResult | undefined {
    // Neutral start: threshold at the mean level, spread a quarter of the range and λ = 0.
    let b = start ? Math.min(bHigh, Math.max(bLow, 1 / start.spread)) : startB;
    let c = start && !thresholdFixed ? (centre - start.threshold) * b : 0;
    let lapse = lapseFree ? Math.min(lapseMax, Math.max(0, start?.lapse ?? 0)) : lapseHeld;
    evaluate(c, b, lapse, current);

    let iterations = 0;
    let lastDb = 0;
    while (iterations < MAX_ITERATIONS) {
      iterations++;
      // Active set: a variable on a bound is held there while the score pushes it outward.
      const gb = current[G + 1] as number;
      const gl = current[G + 2] as number;
      free[0] = !thresholdFixed;
      free[1] = !((b >= bHigh && gb > 0) || (b <= bLow && gb < 0));
      free[2] = lapseFree && !((lapse <= 0 && gl < 0) || (lapse >= lapseMax && gl > 0));
      if (!free[0] && !free[1] && !free[2]) break;
      let isNewton = chooseDirection(c, b, lapse);
      // A variable on a bound whose step would leave the box is held too, and the direction recomputed.
      for (let round = 0; round < VARIABLES; round++) {
        const leavesB = free[1] && ((b >= bHigh && (direction[1] as number) > 0) || (b <= bLow && (direction[1] as number) < 0));
        const leavesL = free[2] && ((lapse <= 0 && (direction[2] as number) < 0) || (lapse >= lapseMax && (direction[2] as number) > 0));
        if (!leavesB && !leavesL) break;
        if (leavesB) free[1] = false;
        if (leavesL) free[2] = false;
        isNewton = chooseDirection(c, b, lapse);
      }
      const dc = direction[0] as number;
      const db = direction[1] as number;
      const dl = direction[2] as number;
      const decrement = (current[G] as number) * dc + gb * db + gl * dl;
      if (iterations === 1 && (current[LL] as number) + Math.max(0, decrement) + SCREEN_MARGIN < mustBeat) return undefined;
      if (!(decrement > 0)) break;
      // Shorten the step to the box; the variable that limits it lands exactly on its bound.
      let tMax = 1;
      let limiter = -1;
      if (db > 0 && b + db > bHigh) {
        tMax = (bHigh - b) / db;
        limiter = 1;
      } else if (db < 0 && b + db < bLow) {
        tMax = (bLow - b) / db;
        limiter = 1;
      }
      if (dl > 0 && lapse + tMax * dl > lapseMax) {
        tMax = (lapseMax - lapse) / dl;
        limiter = 2;
      } else if (dl < 0 && lapse + tMax * dl < 0) {
        tMax = -lapse / dl;
        limiter = 2;
      }
      // Halve the step until ℓ does not fall.
      let t = tMax;
      let accepted = false;
      let gain = 0;
      for (let h = 0; h < MAX_HALVINGS; h++) {
        const cNew = c + t * dc;
        const bNew = t === tMax && limiter === 1 ? (db > 0 ? bHigh : bLow) : Math.min(bHigh, Math.max(bLow, b + t * db));
        const lNew = t === tMax && limiter === 2 ? (dl > 0 ? lapseMax : 0) : Math.min(lapseMax, Math.max(0, lapse + t * dl));
        // The step that ends the climb once accepted needs ℓ alone there: nothing after the climb uses derivatives.
        const ends = decrement < DECREMENT_TOLERANCE || (isNewton && t === 1 && decrement < newtonTolerance);
        evaluate(cNew, bNew, lapseFree ? lNew : lapse, trial, !ends);
        if ((trial[LL] as number) >= (current[LL] as number)) {
          gain = (trial[LL] as number) - (current[LL] as number);
          c = cNew;
          b = bNew;
          if (lapseFree) lapse = lNew;
          swap();
          accepted = true;
          break;
        }
        t /= 2;
      }
      lastDb = db;
      // A step that gains (next to) nothing is stuck on a ridge where ℓ is flat and the model is not: on a steep
      // maximum with λ held, scoring can step back and forth between two points of equal ℓ.
      if (!accepted || gain < LOG_LIKELIHOOD_TOLERANCE || decrement < DECREMENT_TOLERANCE || (isNewton && t === 1 && decrement < newtonTolerance)) break;
    }

    // Separable (or flat) data gain ever less while b still creeps toward a bound, so the decrement stops the
    // search short of it; the supremum is then on that bound (same threshold), so move there if that is no worse.
    if (lastDb !== 0) {
      const bound = lastDb > 0 ? bHigh : bLow;
      if (bound !== b) {
        const cBound = c * (bound / b);
        // ℓ alone first: the bound rarely wins, and only then are its derivatives needed.
        evaluate(cBound, bound, lapse, trial, false);
        if ((trial[LL] as number) >= (current[LL] as number)) {
          evaluate(cBound, bound, lapse, trial);
          c = cBound;
          b = bound;
          swap();
        }
      }
    }
    const spreadAtBound: BoundHit = b >= bHigh * (1 - BOUND_TOLERANCE) ? 'lower' : b <= bLow * (1 + BOUND_TOLERANCE) ? 'upper' : null;
    const lapseAtBound: BoundHit = !lapseFree ? (lapseOption !== undefined && 'max' in lapseOption ? 'lower' : null) : lapse <= 0 ? 'lower' : lapse >= lapseMax ? 'upper' : null;
    return {
      threshold: centre - c / b,
      spread: 1 / b,
      lapse,
      logLikelihood: current[LL] as number,
      spreadAtBound,
      lapseAtBound,
      iterations,
    };
  }

  /**
   * With λ free the likelihood is not log-concave: besides the smooth maximum there can be steep ones, a near-step
   * between two neighbouring levels with the stray answers on either side put down to lapses, and a local climb
   * finds whichever is nearer. A step with λ at its own MLE (errors/trials, capped at max) scores almost what the
   * steep maximum at that gap does, for the price of one logarithm per gap, so the best step is climbed from too
   * whenever it beats the local maximum found. Returns the start to climb from, or undefined.
   */
  function steepStart(logLikelihood: number): FitterStart | undefined {
    // Errors if the step sits just above level `order[j]`: answers "B" at or below it, "A" above it.
    let errors = 0;
    for (let i = 0; i < m; i++) errors += (trials[i] as number) - (counts[i] as number);
    let bestLogLikelihood = logLikelihood;
    let best: FitterStart | undefined;
    for (let j = 0; j < m - 1; j++) {
      const i = order[j] as number;
      errors += 2 * (counts[i] as number) - (trials[i] as number);
      const here = xSorted[j] as number;
      const next = xSorted[j + 1] as number;
      if (next === here) continue;
      const lapse = Math.min(lapseMax, errors / totalTrials);
      const ll = (errors > 0 ? errors * Math.log(lapse) : 0) + (totalTrials - errors) * Math.log(1 - lapse);
      if (ll > bestLogLikelihood) {
        bestLogLikelihood = ll;
        best = { threshold: (here + next) / 2, spread: options.spreadBounds.min, lapse };
      }
    }
    return best;
  }

  // The best climb of the current `fit` call and the iterations spent on it.
  let best: FitterResult | undefined;
  let spent = 0;

  /** Climbs from one more start (only while its first step could beat the best so far) and keeps the better. */
  function consider(from: FitterStart | undefined): void {
    const result = climb(from, best === undefined ? Number.NEGATIVE_INFINITY : best.logLikelihood);
    spent += result === undefined ? 1 : result.iterations;
    if (result !== undefined && (best === undefined || result.logLikelihood > best.logLikelihood)) best = result;
  }

  /** The best climb so far (read through a call, as `consider` updates it). */
  function bestSoFar(): FitterResult {
    return best as FitterResult;
  }

  function fit(k: ArrayLike<number>, start?: FitterStart | readonly FitterStart[]): FitterResult {
    for (let i = 0; i < m; i++) counts[i] = k[i] as number;
    best = undefined;
    spent = 0;
    if (start === undefined) for (const from of coldStarts()) consider(from);
    else if (Array.isArray(start)) for (const from of start as readonly FitterStart[]) consider(from);
    else consider(start as FitterStart);
    if (lapseFree && !thresholdFixed) {
      const steep = steepStart(bestSoFar().logLikelihood);
      if (steep !== undefined) consider(steep);
    }
    const result = bestSoFar();
    return spent === result.iterations ? result : { ...result, iterations: spent };
  }

  /** Starts of a fit without a previous one: neutral with λ = 0, and with λ free also neutral with λ = max. */
  function coldStarts(): readonly (FitterStart | undefined)[] {
    if (!lapseFree) return [undefined];
    const threshold = thresholdFixed ? centre : xSum / m;
    return [undefined, { threshold, spread: 1 / startB, lapse: lapseMax }];
  }

  /**
   * The distinct local maxima of ℓ for counts k reached from the cold starts and from a step at every gap between
   * levels (λ = max, spread at its minimum), best first, those more than `margin` below the best left out. A
   * parametric bootstrap climbs from each of them, so a resample whose best maximum lies in another basin than the
   * fit's still reaches it.
   */
  function findModes(k: ArrayLike<number>, margin: number): FitterResult[] {
    for (let i = 0; i < m; i++) counts[i] = k[i] as number;
    const starts = [...coldStarts()];
    if (lapseFree && !thresholdFixed) {
      for (let j = 0; j < m - 1; j++) {
        const here = xSorted[j] as number;
        const next = xSorted[j + 1] as number;
        if (next !== here) starts.push({ threshold: (here + next) / 2, spread: options.spreadBounds.min, lapse: lapseMax });
      }
    }
    const modes: FitterResult[] = [];
    for (const from of starts) {
      const result = climb(from) as FitterResult;
      const isKnown = modes.some(
        (mode) =>
          Math.abs(mode.threshold - result.threshold) < MODE_SEPARATION * mode.spread &&
          Math.abs(Math.log(mode.spread / result.spread)) < MODE_SEPARATION &&
          Math.abs(mode.lapse - result.lapse) < MODE_SEPARATION * Math.max(lapseMax, Number.MIN_VALUE),
      );
      if (!isKnown) modes.push(result);
    }
    modes.sort((p, q) => q.logLikelihood - p.logLikelihood);
    const top = (modes[0] as FitterResult).logLikelihood;
    return modes.filter((mode) => mode.logLikelihood >= top - margin);
  }

  return { levels: m, fit, findModes };
}
