import { participantKeys } from './participant-keys';
import { planCategorisation } from './plan-categorisation';
import { planSimilarity } from './plan-similarity';
import type { StudyDesign, StudyStimuli, Trial, TrialPlan } from './types';

/**
 * A participant's whole plan: the categorisation trials (if any), then the similarity trials (if any), numbered
 * 0…n−1 across both. `participant` is a whole number (0 for the first to join). Regenerating with the same
 * design, stimuli and index gives the same plan, so a session need store only the trial index of each response.
 * The design must pass `checkStudyDesign`.
 */
export function buildTrialPlan(design: StudyDesign, stimuli: StudyStimuli, participant: number): TrialPlan {
  if (!Number.isInteger(participant) || participant < 0) throw new RangeError(`A participant index is a whole number ≥ 0; got ${participant}.`);
  const trials: Trial[] = [];
  let blocks = 0;
  if (design.categorisation) {
    const part = planCategorisation(design.categorisation, design.seed, participant, 0);
    trials.push(...part.trials);
    blocks = part.blocks;
  }
  if (design.similarity) trials.push(...planSimilarity(design.similarity, stimuli.stimulusIds, design.seed, participant, trials.length, blocks));
  return { participant, keys: design.categorisation ? participantKeys(design.categorisation.keys, participant) : null, trials };
}
