import { MAX_SEED } from '../sequence/seeded-random';
import { balancedPairCounts, isBalancedPairCount } from './balanced-pair-subset';
import { countPlannedTrials } from './count-planned-trials';
import { STUDY_LIMITS } from './study-limits';
import type { StudyDesign, StudyIssue } from './types';

const isWhole = (v: number, min: number, max: number) => Number.isInteger(v) && v >= min && v <= max;
const isPositive = (v: number) => Number.isFinite(v) && v > 0;

/** The nearest valid balanced pair counts around `k`, for a helpful message. */
function nearestCounts(n: number, k: number): string {
  const counts = balancedPairCounts(n);
  const below = counts.filter((c) => c < k).at(-1);
  const above = counts.find((c) => c > k);
  return [below, above].filter((c) => c !== undefined).join(' or ');
}

/**
 * Every problem with a design, each on its field (dot path), or [] when the design can be planned: at least one
 * task; directions given, distinct and in [0°, 180°); odd steps 7–21; extent in (0, 1]; timing values > 0; two
 * distinct keys; a feasible balanced pair count; at most 5,000 trials per participant. `stimulusCount` is the
 * number of stimuli pairs are drawn from.
 */
export function checkStudyDesign(design: StudyDesign, stimulusCount: number): StudyIssue[] {
  const issues: StudyIssue[] = [];
  const add = (field: string, message: string) => issues.push({ field, message });
  if (!isWhole(design.seed, 0, MAX_SEED)) add('seed', `The seed must be a whole number from 0 to ${MAX_SEED}.`);
  if (!isPositive(design.stimulusSizeDeg)) add('stimulusSizeDeg', 'The stimulus size must be above 0°.');
  if (!design.categorisation && !design.similarity) add('tasks', 'Choose at least one task: two-choice categorisation or pair similarity.');

  const c = design.categorisation;
  if (c) {
    if (c.directionsDeg.length === 0) add('categorisation.directionsDeg', 'Give at least one direction.');
    if (c.directionsDeg.length > STUDY_LIMITS.maxDirections) add('categorisation.directionsDeg', `At most ${STUDY_LIMITS.maxDirections} directions.`);
    if (c.directionsDeg.some((a) => !Number.isFinite(a) || a < 0 || a >= 180)) add('categorisation.directionsDeg', 'A direction is a diameter: give its angle from 0° up to (not including) 180°.');
    else if (new Set(c.directionsDeg.map((a) => a.toFixed(6))).size !== c.directionsDeg.length) add('categorisation.directionsDeg', 'Each direction may appear only once.');
    if (!isWhole(c.steps, STUDY_LIMITS.minSteps, STUDY_LIMITS.maxSteps)) add('categorisation.steps', `Steps per direction must be a whole number from ${STUDY_LIMITS.minSteps} to ${STUDY_LIMITS.maxSteps}.`);
    else if (c.steps % 2 === 0) add('categorisation.steps', 'Steps per direction must be odd, so one level sits at the centre of the space.');
    if (!(Number.isFinite(c.extent) && c.extent > 0 && c.extent <= 1)) add('categorisation.extent', 'The extent is a fraction of ρmax above 0 and at most 1.');
    if (!isWhole(c.repetitions, 1, STUDY_LIMITS.maxRepetitions)) add('categorisation.repetitions', `Repetitions per level must be a whole number from 1 to ${STUDY_LIMITS.maxRepetitions}.`);
    if (!isWhole(c.practiceTrials, 0, STUDY_LIMITS.maxPracticeTrials)) add('categorisation.practiceTrials', `Practice trials must be a whole number from 0 to ${STUDY_LIMITS.maxPracticeTrials}.`);
    if (!(Number.isFinite(c.catchRate) && c.catchRate >= 0 && c.catchRate <= STUDY_LIMITS.maxCatchRate)) add('categorisation.catchRate', `The catch-trial rate must be from 0 to ${STUDY_LIMITS.maxCatchRate}.`);
    for (const [name, value] of Object.entries(c.timing)) if (!isPositive(value)) add(`categorisation.timing.${name}`, 'Each duration must be above 0 ms.');
    if (c.keys.some((k) => k.length === 0)) add('categorisation.keys', 'Give two response keys.');
    else if (c.keys[0].toLowerCase() === c.keys[1].toLowerCase()) add('categorisation.keys', 'The two response keys must differ.');
  }

  const s = design.similarity;
  if (s) {
    if (stimulusCount < 2) add('similarity', 'Pair similarity needs an edition with at least two stimuli.');
    if (s.pairSet === 'balanced' && stimulusCount >= 2 && !isBalancedPairCount(stimulusCount, s.pairCount ?? 0)) {
      const near = nearestCounts(stimulusCount, s.pairCount ?? 0);
      add('similarity.pairCount', `With ${stimulusCount} stimuli, no set of ${s.pairCount ?? 0} pairs uses each stimulus equally often${near ? `; try ${near}` : ''}.`);
    }
    if (!isWhole(s.repetitions, 1, STUDY_LIMITS.maxRepetitions)) add('similarity.repetitions', `Repetitions must be a whole number from 1 to ${STUDY_LIMITS.maxRepetitions}.`);
    if (s.scaleLow.trim() === '' || s.scaleHigh.trim() === '') add('similarity.scaleLow', 'Label both ends of the 1–7 scale.');
    for (const [name, value] of Object.entries(s.timing)) {
      if (name === 'gapMs' && s.presentation === 'simultaneous') continue;
      if (!isPositive(value)) add(`similarity.timing.${name}`, 'Each duration must be above 0 ms.');
    }
  }

  if (issues.length === 0) {
    const counts = countPlannedTrials(design, stimulusCount);
    if (counts.total > STUDY_LIMITS.maxTrialsPerParticipant) {
      const field = counts.categorisation >= counts.similarity ? 'categorisation.repetitions' : 'similarity.repetitions';
      add(field, `This plan has ${counts.total.toLocaleString('en')} trials per participant; at most ${STUDY_LIMITS.maxTrialsPerParticipant.toLocaleString('en')} are allowed.`);
    }
  }
  return issues;
}
