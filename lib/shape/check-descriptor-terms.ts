import { ShapeError } from './errors';
import { SHAPE_LIMITS } from './shape-limits';
import type { ShapeDescriptor } from './types';

/** Summary of a well-formed descriptor's terms. */
export interface DescriptorTermSummary {
  /** Highest |harmonic| with a non-zero coefficient (0 when there is none). */
  readonly highestHarmonic: number;
  /** Number of terms with a non-zero coefficient. */
  readonly activeTerms: number;
}

function requireFinite(value: number, field: string, details: { family: ShapeDescriptor['family']; harmonic?: number; termIndex?: number }): void {
  if (!Number.isFinite(value)) {
    const where = details.harmonic === undefined ? '' : ` of harmonic ${details.harmonic}`;
    throw new ShapeError('not-finite', `${field}${where} is ${String(value)}; every value must be a finite number`, {
      ...details,
      field,
      value,
    });
  }
}

function requireHarmonic(
  family: ShapeDescriptor['family'],
  value: number,
  termIndex: number,
  minimum: number,
  seen: Set<number>,
): void {
  const field = family === 'elliptic' ? 'n' : 'k';
  const maximum = SHAPE_LIMITS.maxHarmonic;
  if (!Number.isInteger(value) || value < minimum || value > maximum) {
    throw new ShapeError(
      'harmonic-out-of-range',
      `harmonic ${field} = ${String(value)} (term ${termIndex}) must be an integer from ${minimum} to ${maximum}`,
      { family, harmonic: value, termIndex, field, value, minimum, maximum },
    );
  }
  if (seen.has(value)) {
    throw new ShapeError('harmonic-duplicated', `harmonic ${field} = ${value} appears twice (term ${termIndex})`, {
      family,
      harmonic: value,
      termIndex,
      field,
      value,
    });
  }
  seen.add(value);
}

/**
 * Checks the structure of a descriptor: harmonic indices are integers in range (radial k 1…128, elliptic n
 * 1…128, complex k −128…128) and not repeated; every number is finite; the radial base radius is positive.
 * Throws a `ShapeError` naming the harmonic and the value; returns the highest active harmonic.
 */
export function checkDescriptorTerms(descriptor: ShapeDescriptor): DescriptorTermSummary {
  const seen = new Set<number>();
  let highestHarmonic = 0;
  let activeTerms = 0;
  const family = descriptor.family;
  if (family === 'radial') {
    requireFinite(descriptor.baseRadius, 'baseRadius', { family });
    if (descriptor.baseRadius <= 0) {
      throw new ShapeError('radius-not-positive', `baseRadius is ${descriptor.baseRadius}; it must be > 0`, {
        family,
        field: 'baseRadius',
        value: descriptor.baseRadius,
      });
    }
    descriptor.terms.forEach((term, termIndex) => {
      requireHarmonic(family, term.k, termIndex, 1, seen);
      requireFinite(term.amplitude, 'amplitude', { family, harmonic: term.k, termIndex });
      requireFinite(term.phase, 'phase', { family, harmonic: term.k, termIndex });
      if (term.amplitude !== 0) {
        activeTerms++;
        highestHarmonic = Math.max(highestHarmonic, term.k);
      }
    });
  } else if (family === 'elliptic') {
    requireFinite(descriptor.center[0], 'center[0]', { family });
    requireFinite(descriptor.center[1], 'center[1]', { family });
    descriptor.terms.forEach((term, termIndex) => {
      requireHarmonic(family, term.n, termIndex, 1, seen);
      for (const field of ['a', 'b', 'c', 'd'] as const) {
        requireFinite(term[field], field, { family, harmonic: term.n, termIndex });
      }
      if (term.a !== 0 || term.b !== 0 || term.c !== 0 || term.d !== 0) {
        activeTerms++;
        highestHarmonic = Math.max(highestHarmonic, term.n);
      }
    });
  } else if (family === 'complex') {
    descriptor.terms.forEach((term, termIndex) => {
      requireHarmonic(family, term.k, termIndex, -SHAPE_LIMITS.maxHarmonic, seen);
      requireFinite(term.re, 're', { family, harmonic: term.k, termIndex });
      requireFinite(term.im, 'im', { family, harmonic: term.k, termIndex });
      if ((term.re !== 0 || term.im !== 0) && term.k !== 0) {
        activeTerms++;
        highestHarmonic = Math.max(highestHarmonic, Math.abs(term.k));
      }
    });
  } else {
    const unknown: { family?: unknown } = descriptor;
    throw new ShapeError('invalid-argument', `unknown descriptor family ${String(unknown.family)}`);
  }
  return { highestHarmonic, activeTerms };
}
