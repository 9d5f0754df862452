import { categorisationLevels } from './categorisation-levels';
import type { CategorisationTask, PlanCell, PlanSummary, TrialPlan } from './types';

/**
 * Counts of a plan: trials per (direction, level) cell, with catch and practice trials apart and how often
 * anchor A was on the left, and how often each stimulus appears in the similarity pairs.
 */
export function summarizePlan(plan: TrialPlan, categorisation: CategorisationTask | null): PlanSummary {
  const levels = categorisation ? categorisationLevels(categorisation) : [];
  const cells: { -readonly [K in keyof PlanCell]: PlanCell[K] }[] = [];
  const cellAt = new Map<string, (typeof cells)[number]>();
  for (const directionDeg of categorisation?.directionsDeg ?? []) {
    levels.forEach((position, level) => {
      const cell = { directionDeg, level, position, trials: 0, catchTrials: 0, practiceTrials: 0, leftA: 0 };
      cells.push(cell);
      cellAt.set(`${directionDeg}:${level}`, cell);
    });
  }
  const stimulusUse: Record<string, number> = {};
  let categorisationTrials = 0;
  let similarityTrials = 0;
  for (const t of plan.trials) {
    if (t.task === 'similarity') {
      similarityTrials++;
      stimulusUse[t.first] = (stimulusUse[t.first] ?? 0) + 1;
      stimulusUse[t.second] = (stimulusUse[t.second] ?? 0) + 1;
      continue;
    }
    categorisationTrials++;
    const cell = cellAt.get(`${t.directionDeg}:${t.level}`);
    if (!cell) continue;
    if (t.isPractice) cell.practiceTrials++;
    else if (t.isCatch) cell.catchTrials++;
    else {
      cell.trials++;
      if (t.leftAnchor === 'A') cell.leftA++;
    }
  }
  return { totalTrials: plan.trials.length, categorisationTrials, similarityTrials, cells, stimulusUse };
}
