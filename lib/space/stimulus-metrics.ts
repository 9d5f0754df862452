import { descriptorArea } from '../shape/descriptor-area';
import { descriptorPerimeter } from '../shape/descriptor-perimeter';
import type { Stimulus, StimulusMetrics } from './types';

/**
 * Area, perimeter and compactness of a stimulus, from its descriptor through `lib/shape`: the exact area from
 * the coefficients (Green's theorem; π r0²(1 + ½ΣA²) for radial harmonics), the arc length by the periodic
 * trapezoid rule (`descriptorPerimeter`, ~1e-12 relative), and compactness 4πA/P² (isoperimetric quotient, 1
 * for a circle). Independent of any sampling, so the audit's spread figures do not depend on `samples`.
 * Assumes a valid stimulus (`checkSpace`).
 */
export function stimulusMetrics(stimulus: Stimulus): StimulusMetrics {
  const area = Math.abs(descriptorArea(stimulus.descriptor));
  const perimeter = descriptorPerimeter(stimulus.descriptor);
  return { area, perimeter, compactness: perimeter === 0 ? 0 : (4 * Math.PI * area) / (perimeter * perimeter) };
}
