import { evaluateDescriptor } from './evaluate-descriptor';
import type { Contour, ShapeDescriptor } from './types';

/**
 * Samples a descriptor at t_j = 2πj/N by evaluating the defining formula at every sample
 * (`evaluateDescriptor`): O(N · terms) transcendental calls, slow, for checks and odd N. No validation and no
 * orientation change: callers use `synthesizeContour`.
 */
export function synthesizeExact(descriptor: ShapeDescriptor, size: number): Contour {
  const x = new Float64Array(size);
  const y = new Float64Array(size);
  const step = (2 * Math.PI) / size;
  for (let j = 0; j < size; j++) {
    const [px, py] = evaluateDescriptor(descriptor, step * j);
    x[j] = px;
    y[j] = py;
  }
  return { x, y };
}
