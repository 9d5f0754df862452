import { deriveSeed } from '../sequence/derive-seed';
import { seededRandom } from '../sequence/seeded-random';
import { catchTrialsPerDirection } from './catch-trials-per-direction';
import { categorisationLevels } from './categorisation-levels';
import { participantKeys } from './participant-keys';
import { shuffle } from './shuffle';
import { STREAM_CATEGORISATION } from './streams';
import type { Anchor, CategorisationTask, CategorisationTrial } from './types';

type Draft = Omit<CategorisationTrial, 'index' | 'block'>;

const normalizeAngle = (deg: number) => ((deg % 360) + 360) % 360;

function makeTrial(task: CategorisationTask, keys: { left: string; right: string }, d: number, level: number, position: number, leftA: boolean, flags: { isCatch: boolean; isPractice: boolean }): Draft {
  const directionDeg = task.directionsDeg[d] as number;
  const leftAnchor: Anchor = leftA ? 'A' : 'B';
  // The nearer anchor is the right answer; its side decides the key.
  const nearer: Anchor | null = position > 0 ? 'A' : position < 0 ? 'B' : null;
  const correctKey = nearer === null ? null : nearer === leftAnchor ? keys.left : keys.right;
  return {
    task: 'categorisation',
    ...flags,
    directionIndex: d,
    directionDeg,
    level,
    position,
    probe: { rho: Math.abs(position), angleDeg: normalizeAngle(position < 0 ? directionDeg + 180 : directionDeg) },
    leftAnchor,
    correctKey,
  };
}

/**
 * One participant's two-choice categorisation trials (method of constant stimuli), numbered from `firstIndex`.
 * Every (direction, level) cell gets `repetitions` trials with the anchor sides alternating (by repetition, cell
 * and participant, so odd repetitions balance across participants); catch trials on the anchors make up
 * `catchRate` of each direction; `interleaved` shuffles everything into one block, `blocked` gives each direction
 * its own shuffled block in a random order; practice trials (on the anchors) come first in block 0.
 * Randomness: `deriveSeed(seed, participant, STREAM_CATEGORISATION)`, so the same inputs give the same plan.
 */
export function planCategorisation(task: CategorisationTask, seed: number, participant: number, firstIndex = 0): { trials: CategorisationTrial[]; blocks: number } {
  const random = seededRandom(deriveSeed(seed, participant, STREAM_CATEGORISATION));
  const keys = participantKeys(task.keys, participant);
  const levels = categorisationLevels(task);
  const last = task.steps - 1;

  // Stage 1: the trials of every direction, in cell order.
  const perDirection: Draft[][] = task.directionsDeg.map((_, d) => {
    const trials: Draft[] = [];
    levels.forEach((position, level) => {
      for (let r = 0; r < task.repetitions; r++) {
        const leftA = (r + d * task.steps + level + participant) % 2 === 0;
        trials.push(makeTrial(task, keys, d, level, position, leftA, { isCatch: false, isPractice: false }));
      }
    });
    const catches = catchTrialsPerDirection(trials.length, task.catchRate);
    for (let j = 0; j < catches; j++) {
      const onA = (j + d + participant) % 2 === 0;
      const leftA = (Math.floor(j / 2) + participant) % 2 === 0;
      trials.push(makeTrial(task, keys, d, onA ? last : 0, onA ? task.extent : -task.extent, leftA, { isCatch: true, isPractice: false }));
    }
    return trials;
  });

  // Stage 2: practice on the anchors, directions drawn at random.
  const practice: Draft[] = [];
  for (let j = 0; j < task.practiceTrials; j++) {
    const d = random.nextInt(task.directionsDeg.length);
    const onA = j % 2 === 0;
    practice.push(makeTrial(task, keys, d, onA ? last : 0, onA ? task.extent : -task.extent, random.nextInt(2) === 0, { isCatch: false, isPractice: true }));
  }

  // Stage 3: blocks.
  const blocks: Draft[][] = practice.length ? [practice] : [];
  if (task.blocking === 'interleaved') blocks.push(shuffle(perDirection.flat(), random));
  else for (const d of shuffle(perDirection.map((_, i) => i), random)) blocks.push(shuffle(perDirection[d] as Draft[], random));

  // Stage 4: number the trials.
  const trials: CategorisationTrial[] = [];
  blocks.forEach((block, b) => {
    for (const t of block) trials.push({ ...t, index: firstIndex + trials.length, block: b });
  });
  return { trials, blocks: blocks.length };
}
