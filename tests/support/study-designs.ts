/**
 * The study designs and screen check the integration and e2e tests build their studies from. Each test names only
 * what its study needs to differ from the plain design below, so what a test depends on stands out.
 */

/** Timings of an ordinary lab study (ms). */
export const LAB_TIMING = { fixationMs: 300, probeMs: 200, blankMs: 100, responseMs: 1500, itiMs: 300 };
/** Short timings for browser tests, with a long response window so that a slow CI machine still answers in time. */
export const QUICK_TIMING = { fixationMs: 60, probeMs: 50, blankMs: 40, responseMs: 5000, itiMs: 60 };

/** A categorisation task: one direction, 7 levels, one repetition, no practice or catch trials, unless told. */
export function categorisation(over: Partial<ReturnType<typeof plainCategorisation>> = {}) {
  return { ...plainCategorisation(), ...over };
}

function plainCategorisation() {
  return {
    directionsDeg: [0] as number[],
    steps: 7,
    extent: 0.8,
    repetitions: 1,
    blocking: 'interleaved' as string,
    practiceTrials: 0,
    catchRate: 0,
    timing: LAB_TIMING,
    keys: ['f', 'j'] as [string, string],
  };
}

/** A participant's screen check: a 96-dpi screen at 57 cm, typed, full screen at 60 Hz. */
export const SCREEN = { pxPerMm: 3.78, viewingDistanceCm: 57, distanceMethod: 'typed', refreshHz: 60, isFullScreen: true };
