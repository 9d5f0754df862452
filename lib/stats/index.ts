// lib/stats — psychometric fitting by maximum likelihood (logistic and cumulative normal, symmetric lapse, bounded
// spread). Pure and deterministic: the browser and the jobs run the same code.

export type { BoundHit, FitOptions, LapseOption, Link, PsychometricData, PsychometricFit } from './types';
export { StatsError, type StatsErrorCode } from './stats-error';

export { normalCdf, INV_SQRT_2PI } from './normal-cdf';
export { linkFunction, type LinkFunction } from './link-function';
export { validatePsychometricData } from './validate-psychometric-data';
export { spreadBoundsFor, DEFAULT_SPREAD_BOUNDS } from './spread-bounds-for';
export { binomialLogLikelihood, type PsychometricParameters } from './binomial-log-likelihood';
export { saturatedLogLikelihood } from './saturated-log-likelihood';
export { fitAtLapse, type LapseConditionalFit } from './fit-at-lapse';
export { profileLapse, type LapseProfileFit } from './profile-lapse';
export {
  createPsychometricFitter,
  type FitterOptions,
  type FitterResult,
  type FitterStart,
  type PsychometricFitter,
} from './create-psychometric-fitter';
export { fitPsychometric, completeFit, checkLapseOption } from './fit-psychometric';
export { evaluatePsychometric } from './evaluate-psychometric';

// Bootstrap
export { seededRandom, MAX_SEED } from './seeded-random';
export { drawBinomial } from './draw-binomial';
export { percentile } from './percentile';
export { runParametricBootstrap, type BootstrapOptions } from './run-parametric-bootstrap';
export { bootstrapFit, type BootstrapResult, type BootstrapSamples, type Interval } from './bootstrap-fit';
export { goodnessOfFit, type GoodnessOfFit } from './goodness-of-fit';

// Slope comparison
export { logGamma } from './log-gamma';
export { regularizedGammaQ } from './regularized-gamma-q';
export { chiSquareSurvival } from './chi-square-survival';
export { goldenSectionMaximum } from './golden-section-maximum';
export { fitCommonSlope, type CommonSlopeFit } from './fit-common-slope';
export { compareSlopes, type CompareSlopesOptions, type SlopeComparison } from './compare-slopes';
export { combineChiSquareTests } from './combine-chi-square-tests';

// Bias and the isotropy verdict
export { testNoBias, type NoBiasOptions } from './test-no-bias';
export { slopeRatioInterval, type SlopeRatio } from './slope-ratio-interval';
export { describeIsotropy, type IsotropyEvidence, type IsotropyVerdict } from './describe-isotropy';

// Perceptual vs designed similarity
export { pearson } from './pearson';
export { spearman } from './spearman';
export { checkSquareMatrix, type SquareMatrix } from './square-matrix';
export { mantelTest, MIN_MANTEL_PERMUTATIONS, type MantelOptions, type MantelResult } from './mantel-test';
export { symmetricEigen, type SymmetricEigen } from './symmetric-eigen';
export { classicalMds, type ClassicalMds } from './classical-mds';
export { smacof, type SmacofMds, type SmacofOptions } from './smacof';
export { procrustes, type ProcrustesFit } from './procrustes';
export { perceptualRdm, type NoiseCeiling, type PairRating, type PerceptualRdm, type PerceptualRdmOptions } from './perceptual-rdm';
export { directionData, type DirectionAnswer, type DirectionData } from './direction-data';
export { radialRates, type MappedStimulus, type RadialRate } from './radial-rates';
export { suggestEqualization, DEFAULT_MIN_SCALE, type DirectionRate, type EqualizationSuggestion } from './suggest-equalization';
