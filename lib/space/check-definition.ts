import { SHAPE_LIMITS } from '../shape/shape-limits';
import type { DescriptorFamily } from '../shape/types';
import { AXIS_FIELDS } from './axis-fields';
import { countStimuli } from './count-stimuli';
import { SPACE_LIMITS } from './space-limits';
import { wrapAngle } from './wrap-angle';
import type { SpaceAxis, SpaceDefinition, SpaceFailure, SpaceFailureCode, SpaceLayout } from './types';

/**
 * Two axes count as parallel when |cos| of the angle between their change vectors is within this of 1: the
 * vectors come from typed-in deltas, so anything closer is the same direction written twice up to rounding.
 */
const PARALLEL_TOLERANCE = 1e-12;
/** Equalisation angles closer than this (radians) are the same direction. */
const ANGLE_RESOLUTION = 1e-9;
const SCALES = new Set(['equal-area-radius', 'area', 'max-radius', 'perimeter', 'none']);
const FAMILIES = new Set<string>(['radial', 'elliptic', 'complex']);

function failure(id: string, code: SpaceFailureCode, reason: string): SpaceFailure {
  return { id, code, reason };
}

const isCount = (value: unknown): value is number => typeof value === 'number' && Number.isInteger(value) && value >= 0;

function checkLayout(layout: SpaceLayout): SpaceFailure[] {
  const bad = (reason: string) => [failure('layout', 'layout-invalid', reason)];
  switch (layout?.kind) {
    case 'rings':
      if (!isCount(layout.rings) || !isCount(layout.spokes)) return bad(`rings (${layout.rings}) and spokes (${layout.spokes}) must be whole numbers ≥ 0`);
      break;
    case 'lattice':
      if (!isCount(layout.size)) return bad(`the lattice size (${layout.size}) must be a whole number ≥ 0`);
      break;
    case 'diameters':
      if (!isCount(layout.directions) || !isCount(layout.steps)) return bad(`directions (${layout.directions}) and steps (${layout.steps}) must be whole numbers ≥ 0`);
      if (layout.steps > 0 && layout.steps % 2 === 0) return bad(`steps (${layout.steps}) must be odd, so that the centre lies on every diameter`);
      break;
    default:
      return bad(`unknown layout ${String((layout as { kind?: unknown } | undefined)?.kind)}; use rings, lattice or diameters`);
  }
  const count = countStimuli(layout);
  if (count === 0) return [failure('layout', 'no-stimuli', 'the layout has no stimuli; add rings and spokes, lattice points, or directions and steps')];
  if (count > SPACE_LIMITS.maxStimuli) {
    return [failure('layout', 'too-many-stimuli', `the layout has ${count} stimuli; a space holds at most ${SPACE_LIMITS.maxStimuli}`)];
  }
  return [];
}

function harmonicRange(family: DescriptorFamily): [number, number] {
  return family === 'complex' ? [-SHAPE_LIMITS.maxHarmonic, SHAPE_LIMITS.maxHarmonic] : [1, SHAPE_LIMITS.maxHarmonic];
}

function checkAxisEntries(family: DescriptorFamily, axis: SpaceAxis, name: string): SpaceFailure[] {
  const failures: SpaceFailure[] = [];
  const fields = AXIS_FIELDS[family];
  const [low, high] = harmonicRange(family);
  for (const change of axis.changes ?? []) {
    const where = `${name} ("${axis.label}")`;
    const isBaseRadius = change.field === 'baseRadius' && family === 'radial';
    if (!isBaseRadius && !fields.includes(change.field)) {
      const allowed = [...fields, ...(family === 'radial' ? ['baseRadius'] : [])].join(', ');
      failures.push(failure('axes', 'axis-invalid', `${where} changes ${String(change.field)}, which ${family} harmonics do not have (use ${allowed})`));
      continue;
    }
    if (!isBaseRadius && (!Number.isInteger(change.harmonic) || change.harmonic < low || change.harmonic > high)) {
      failures.push(failure('axes', 'axis-invalid', `${where} names harmonic ${change.harmonic}; ${family} harmonics are whole numbers from ${low} to ${high}`));
      continue;
    }
    if (typeof change.delta !== 'number' || !Number.isFinite(change.delta)) {
      failures.push(failure('axes', 'axis-invalid', `${where} has a change of ${String(change.delta)} to ${change.field}; it must be a finite number`));
    }
  }
  return failures;
}

/** An axis as a sparse vector over descriptor entries (repeated entries summed, zeros dropped). */
function axisVector(axis: SpaceAxis): Map<string, number> {
  const vector = new Map<string, number>();
  for (const { field, harmonic, delta } of axis.changes) {
    const key = field === 'baseRadius' ? field : `${field}:${harmonic}`;
    vector.set(key, (vector.get(key) ?? 0) + delta);
  }
  for (const [key, value] of vector) if (value === 0) vector.delete(key);
  return vector;
}

function checkAxisPair(axes: readonly [SpaceAxis, SpaceAxis]): SpaceFailure[] {
  const [u, v] = axes.map(axisVector) as [Map<string, number>, Map<string, number>];
  const failures: SpaceFailure[] = [];
  if (u.size === 0) failures.push(failure('axes', 'axis-zero', `Axis A ("${axes[0].label}") changes nothing, so the space has no first dimension`));
  if (v.size === 0) failures.push(failure('axes', 'axis-zero', `Axis B ("${axes[1].label}") changes nothing, so the space has no second dimension`));
  if (failures.length > 0) return failures;
  let dot = 0, uu = 0, vv = 0;
  for (const value of u.values()) uu += value * value;
  for (const [key, value] of v) {
    vv += value * value;
    dot += value * (u.get(key) ?? 0);
  }
  const identical = u.size === v.size && [...u].every(([key, value]) => v.get(key) === value);
  if (identical) return [failure('axes', 'axes-identical', 'Axis A and Axis B make the same change, so the space is one-dimensional')];
  if (Math.abs(dot) >= (1 - PARALLEL_TOLERANCE) * Math.sqrt(uu * vv)) {
    const ratio = dot / uu;
    return [failure('axes', 'axes-parallel', `Axis B is Axis A times ${ratio.toPrecision(4)}, so the space is one-dimensional`)];
  }
  return [];
}

function checkEqualization(definition: SpaceDefinition): SpaceFailure[] {
  const equalization = definition.equalization;
  if (!equalization) return [];
  const bad = (reason: string) => [failure('equalization', 'equalization-invalid', reason)];
  const seen = new Set<number>();
  for (const [i, direction] of equalization.directions.entries()) {
    if (!Number.isFinite(direction.angle)) return bad(`direction ${i} has angle ${direction.angle}; it must be finite`);
    const key = Math.round(wrapAngle(direction.angle) / ANGLE_RESOLUTION);
    if (seen.has(key)) return bad(`direction ${i} repeats the angle ${direction.angle.toFixed(6)} rad`);
    seen.add(key);
    if (direction.knots.length === 0) return bad(`direction ${i} has no knots`);
    let previous: readonly [number, number] = [0, 0];
    for (const [j, knot] of direction.knots.entries()) {
      const [rho, mapped] = knot;
      if (!Number.isFinite(rho) || !Number.isFinite(mapped)) return bad(`knot ${j} of direction ${i} is (${rho}, ${mapped}); both must be finite`);
      // A leading (0, 0) knot restates the implied one.
      if (j === 0 && rho === 0 && mapped === 0) continue;
      if (!(rho > previous[0]) || mapped < previous[1]) {
        return bad(`knot ${j} of direction ${i} is (${rho}, ${mapped}); ρ must increase from 0 and the mapped ρ must not decrease, so the re-mapping is monotone`);
      }
      previous = knot;
    }
  }
  return [];
}

/**
 * Checks the structure of a definition without generating it: a known seed family; a finite extent > 0; a layout
 * with whole counts (Diameters steps odd) and 1…2,000 stimuli; axes whose fields belong to the seed's family,
 * with harmonics in range and finite deltas; axes that are neither zero nor identical nor parallel (the space
 * would be one-dimensional); a known normalisation; an equalisation with finite, monotone knots and distinct
 * angles. Returns the failures found (`[]` when there are none); stimulus validity is `checkSpace`'s business.
 */
export function checkDefinition(definition: SpaceDefinition): SpaceFailure[] {
  const failures: SpaceFailure[] = [];
  const family = definition.seed?.family;
  if (!FAMILIES.has(family)) failures.push(failure('seed', 'seed-invalid', `unknown descriptor family ${String(family)}`));
  if (typeof definition.extent !== 'number' || !Number.isFinite(definition.extent) || definition.extent <= 0) {
    failures.push(failure('extent', 'extent-invalid', `the extent ρmax is ${String(definition.extent)}; it must be a finite number > 0`));
  }
  failures.push(...checkLayout(definition.layout));
  const axes = definition.axes;
  if (!Array.isArray(axes) || axes.length !== 2) {
    failures.push(failure('axes', 'axis-invalid', 'a space has exactly two axes'));
  } else if (FAMILIES.has(family)) {
    const entryFailures = [...checkAxisEntries(family, axes[0], 'Axis A'), ...checkAxisEntries(family, axes[1], 'Axis B')];
    failures.push(...entryFailures);
    if (entryFailures.length === 0) failures.push(...checkAxisPair(axes));
  }
  const normalization = definition.normalization;
  if (!normalization || !SCALES.has(normalization.scale) || typeof normalization.centroid !== 'boolean') {
    failures.push(failure('normalization', 'normalization-invalid', `normalisation needs a scale (${[...SCALES].join(', ')}) and a centroid flag`));
  }
  failures.push(...checkEqualization(definition));
  return failures;
}
