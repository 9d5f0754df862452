import type { AuditMeasure, LineSpacing } from './types';

const percent = (v: number) => `${(100 * v).toFixed(1)} %`;

/**
 * Spacing uniformity across the layout's lines as an audit measure: the largest per-line CV of neighbour
 * distances, flagged above `threshold`, naming the worst line.
 */
export function spacingMeasure(lines: readonly LineSpacing[], threshold: number): AuditMeasure & { lines: readonly LineSpacing[] } {
  const flat = lines.find((l) => l.cv === null && l.gaps.length >= 2);
  if (flat) {
    return {
      value: null,
      threshold,
      flagged: true,
      lines,
      message: `Along ${flat.label} the outline does not change from one stimulus to the next, so its stimuli cannot be told apart by shape.`,
    };
  }
  const judged = lines.filter((l): l is LineSpacing & { cv: number } => l.cv !== null);
  if (judged.length === 0) {
    return { value: null, threshold, flagged: false, lines, message: 'Too few stimuli along each line to judge spacing (at least three per line are needed).' };
  }
  const worst = judged.reduce((w, l) => (l.cv > w.cv ? l : w));
  const flagged = worst.cv > threshold;
  const message = flagged
    ? `Spacing is uneven along ${worst.label} (CV ${percent(worst.cv)}, above ${percent(threshold)}): neighbouring stimuli there are not equally far apart in contour distance.`
    : `Spacing is even along every line (largest CV ${percent(worst.cv)}, along ${worst.label}; at most ${percent(threshold)}).`;
  return { value: worst.cv, threshold, flagged, lines, message };
}
