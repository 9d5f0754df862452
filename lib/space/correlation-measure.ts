import { condenseRdm } from './condense-rdm';
import { spearman } from './spearman';
import type { AuditMeasure, Rdm } from './types';

/**
 * Agreement of two RDMs as an audit measure: Spearman's ρ over their n(n − 1)/2 pairs (`condenseRdm`), flagged
 * below `threshold`. `names` are the two matrices in plain words, e.g. ['contour', 'designed']. With fewer
 * than two pairs ρ is not computed; with a constant matrix it is undefined and flagged (the matrix says
 * nothing about the pairs).
 */
export function correlationMeasure(x: Rdm, y: Rdm, names: readonly [string, string], threshold: number): AuditMeasure {
  const [first, second] = names;
  const subject = `${first[0]?.toUpperCase()}${first.slice(1)} and ${second} distances`;
  if (x.size < 3) return { value: null, threshold, flagged: false, message: `${subject}: too few stimulus pairs to correlate.` };
  const rho = spearman(condenseRdm(x), condenseRdm(y));
  if (Number.isNaN(rho)) {
    return { value: null, threshold, flagged: true, message: `${subject} cannot be correlated: one of them is the same for every pair.` };
  }
  const flagged = rho < threshold;
  const message = flagged
    ? `${subject} disagree (Spearman ρ = ${rho.toFixed(2)}, below ${threshold.toFixed(2)}): they rank the stimulus pairs differently.`
    : `${subject} agree (Spearman ρ = ${rho.toFixed(2)}, at least ${threshold.toFixed(2)}).`;
  return { value: rho, threshold, flagged, message };
}
