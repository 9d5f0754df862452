import type { SlopeComparison } from './compare-slopes';
import type { SlopeRatio } from './slope-ratio-interval';

/** Inputs of `describeIsotropy`: the group slope test, optionally the no-bias test, the slope ratio and α. */
export interface IsotropyEvidence {
  /** The group test of a common slope (`combineChiSquareTests` over participants' `compareSlopes`). */
  readonly slopes: SlopeComparison;
  /** The test that every PSE is 0 (`testNoBias`), if run. */
  readonly bias?: SlopeComparison;
  readonly slopeRatio: SlopeRatio;
  /** Significance level, in (0, 1); default 0.05. */
  readonly alpha?: number;
}

/** The verdict: whether each test rejected at α, and the same in plain sentences for a results page or report. */
export interface IsotropyVerdict {
  readonly hasSlopeDifference: boolean;
  /** null when no bias test was given. */
  readonly hasBias: boolean | null;
  readonly text: string;
}

/** The conventional 5 % level. */
const DEFAULT_ALPHA = 0.05;

/** p for prose: three significant digits, and "< 0.001" below that. */
function formatP(p: number): string {
  return p < 0.001 ? 'p < 0.001' : `p = ${p.toPrecision(3)}`;
}

function formatTest(test: SlopeComparison): string {
  return `χ²(${test.df}) = ${test.statistic.toFixed(2)}, ${formatP(test.p)}`;
}

/**
 * The isotropy verdict in words: whether the slopes differ across directions (likelihood-ratio test), how much the
 * steepest and shallowest direction differ (the max/min slope ratio with its 95 % interval), whether any PSE is off
 * zero, and — when a test does not reject — the reminder that this does not show the slopes (or PSEs) to be equal.
 */
export function describeIsotropy(evidence: IsotropyEvidence): IsotropyVerdict {
  const alpha = evidence.alpha ?? DEFAULT_ALPHA;
  const { slopes, bias, slopeRatio } = evidence;
  const hasSlopeDifference = slopes.p < alpha;
  const ratio = `The steepest direction is ${slopeRatio.ratio.toFixed(2)} times as steep as the shallowest (95 % interval ${slopeRatio.interval[0].toFixed(2)} to ${slopeRatio.interval[1].toFixed(2)}).`;
  const sentences: string[] = [];
  if (hasSlopeDifference) {
    sentences.push(`The slopes differ between directions (${formatTest(slopes)}): the space is not equally discriminable in every direction.`, ratio);
  } else {
    sentences.push(
      `The test found no difference in slope between directions (${formatTest(slopes)}).`,
      ratio,
      'Not finding a difference is not evidence that there is none: slope differences up to the upper end of that interval are still compatible with these data.',
    );
  }
  let hasBias: boolean | null = null;
  if (bias !== undefined) {
    hasBias = bias.p < alpha;
    sentences.push(
      hasBias
        ? `At least one direction has its PSE away from zero (${formatTest(bias)}).`
        : `No PSE was found away from zero (${formatTest(bias)}); again, this does not prove that there is no bias.`,
    );
  }
  return { hasSlopeDifference, hasBias, text: sentences.join(' ') };
}
