/** Durations of the screens of a two-choice categorisation trial, in milliseconds (each > 0). */
export interface CategorisationTiming {
  readonly fixationMs: number;
  readonly probeMs: number;
  readonly blankMs: number;
  /** The longest wait for a key press; a trial without one is a miss. */
  readonly responseMs: number;
  readonly itiMs: number;
}

/**
 * Two-choice categorisation (2AFC match-to-category, method of constant stimuli): a probe on a diameter of the
 * space is shown with the diameter's two endpoints (the anchors), and the participant picks the anchor it matches.
 */
export interface CategorisationTask {
  /** Diameters by angle in degrees, each in [0, 180); 0° and 180° are the same diameter. */
  readonly directionsDeg: readonly number[];
  /** Levels along each diameter, odd, 7–21; the middle level is the centre of the space. */
  readonly steps: number;
  /** Half the length of the diameter used, as a fraction of ρmax, in (0, 1]: the anchors sit at ±extent. */
  readonly extent: number;
  /** Presentations of every (direction, level) cell. */
  readonly repetitions: number;
  /** `interleaved`: every direction mixed in one block; `blocked`: one block per direction, in random order. */
  readonly blocking: 'interleaved' | 'blocked';
  /** Practice trials before the first block, on the anchors themselves, with feedback (0 for none). */
  readonly practiceTrials: number;
  /** Catch trials (the probe is one of the anchors) as a fraction of all trials, in [0, 0.5]. */
  readonly catchRate: number;
  readonly timing: CategorisationTiming;
  /** The two response keys (KeyboardEvent.key values); which one means "left" is counterbalanced. */
  readonly keys: readonly [string, string];
}

export interface SimilarityTiming {
  readonly fixationMs: number;
  /** How long each stimulus (sequential) or the pair (simultaneous) is on screen. */
  readonly stimulusMs: number;
  /** The blank between the two stimuli of a sequential pair (unused for simultaneous pairs). */
  readonly gapMs: number;
  readonly responseMs: number;
  readonly itiMs: number;
}

/** Pair similarity: pairs of the edition's stimuli rated on a 1–7 scale. */
export interface SimilarityTask {
  /** `all`: every unordered pair; `balanced`: a random subset of `pairCount` pairs using each stimulus equally often. */
  readonly pairSet: 'all' | 'balanced';
  /** K, for `balanced` only. */
  readonly pairCount: number | null;
  readonly presentation: 'sequential' | 'simultaneous';
  readonly scaleLow: string;
  readonly scaleHigh: string;
  readonly repetitions: number;
  readonly timing: SimilarityTiming;
}

/** What a study's design fixes when it opens. At least one task is set. */
export interface StudyDesign {
  /** Integer 0…2³²−1; with the participant index it decides every participant's plan. */
  readonly seed: number;
  /** Stimulus size in degrees of visual angle (> 0). */
  readonly stimulusSizeDeg: number;
  readonly categorisation: CategorisationTask | null;
  readonly similarity: SimilarityTask | null;
}

/** What a plan needs from the edition. */
export interface StudyStimuli {
  /** Ids of the edition's stimuli that pairs are drawn from, in the edition's order. */
  readonly stimulusIds: readonly string[];
}

/** Which anchor: A sits at +extent along the direction (polar angle θ), B at −extent (θ + 180°). */
export type Anchor = 'A' | 'B';

export interface CategorisationTrial {
  readonly task: 'categorisation';
  /** Position in the participant's plan, 0-based; sessions store responses against it. */
  readonly index: number;
  /** 0-based; practice trials are in block 0 when there are any. */
  readonly block: number;
  readonly isPractice: boolean;
  readonly isCatch: boolean;
  readonly directionIndex: number;
  readonly directionDeg: number;
  /** 0…steps−1 along the diameter, from anchor B (0) to anchor A (steps−1). */
  readonly level: number;
  /** Signed position along the diameter as a fraction of ρmax, in [−extent, extent]. */
  readonly position: number;
  /** The probe in polar form: ρ as a fraction of ρmax (≥ 0) and its angle in degrees [0, 360). */
  readonly probe: { readonly rho: number; readonly angleDeg: number };
  /** Which anchor is on the left; the other is on the right. */
  readonly leftAnchor: Anchor;
  /** The key that picks the nearer anchor, or null at the centre (no right answer). */
  readonly correctKey: string | null;
}

export interface SimilarityTrial {
  readonly task: 'similarity';
  readonly index: number;
  readonly block: number;
  /** The pair as stimulus ids, in presentation order (first / left, then second / right). */
  readonly first: string;
  readonly second: string;
  /** Index of the unordered pair in the participant's pair set. */
  readonly pairIndex: number;
}

export type Trial = CategorisationTrial | SimilarityTrial;

/** One participant's trials, regenerable from (study seed, participant index). */
export interface TrialPlan {
  readonly participant: number;
  /** Key for the left anchor and key for the right one (counterbalanced across participants). */
  readonly keys: { readonly left: string; readonly right: string } | null;
  readonly trials: readonly Trial[];
}

/** Count of planned trials in one (direction, level) cell; catch and practice trials counted apart. */
export interface PlanCell {
  readonly directionDeg: number;
  readonly level: number;
  readonly position: number;
  readonly trials: number;
  readonly catchTrials: number;
  readonly practiceTrials: number;
  readonly leftA: number;
}

export interface PlanSummary {
  readonly totalTrials: number;
  readonly categorisationTrials: number;
  readonly similarityTrials: number;
  readonly cells: readonly PlanCell[];
  /** Times each stimulus id appears in the participant's pairs (each repetition counted). */
  readonly stimulusUse: Readonly<Record<string, number>>;
}

/** A problem with a design, on the field it concerns (dot path such as `categorisation.steps`). */
export interface StudyIssue {
  readonly field: string;
  readonly message: string;
}
