/** The bounds a study design must keep; the schemas in lib/schemas/study.ts use the same numbers. */
export const STUDY_LIMITS = {
  /** Odd step counts from 7 (enough points for a psychometric fit) to 21. */
  minSteps: 7,
  maxSteps: 21,
  /** A participant session longer than this many trials is not a norming session any more. */
  maxTrialsPerParticipant: 5000,
  maxCatchRate: 0.5,
  maxRepetitions: 100,
  maxPracticeTrials: 100,
  maxDirections: 36,
  /** WCAG 2.3.1: no more than three flashes in any one-second period. */
  maxOnsetsPerSecond: 3,
} as const;

/**
 * The fastest plausible key press in a choice task, in ms; faster presses are anticipations. The flash check
 * assumes every response comes this fast, so it reports the worst case.
 */
export const FASTEST_RESPONSE_MS = 200;

/** Allowance for reading consent, instructions and debrief, in seconds, added to the estimated duration. */
export const READING_ALLOWANCE_S = 180;
