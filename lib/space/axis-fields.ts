import type { DescriptorFamily } from '../shape/types';
import type { AxisChange } from './types';

/**
 * The descriptor entries an axis may change, per family, in the order the per-term vectors of `compileAxes` use
 * them. Radial `baseRadius` is not a per-term field and is handled apart.
 */
export const AXIS_FIELDS: Readonly<Record<DescriptorFamily, readonly AxisChange['field'][]>> = {
  radial: ['amplitude', 'phase'],
  elliptic: ['a', 'b', 'c', 'd'],
  complex: ['re', 'im'],
};
