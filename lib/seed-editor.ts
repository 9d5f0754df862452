// Modules are imported one by one (not from lib/shape's index) so the SVG parser's paper.js stays out of the
// browser bundle.
import { ShapeError } from './shape/errors';
import { fitRadialHarmonics } from './shape/fit-radial-harmonics';
import { toComplexHarmonics } from './shape/to-complex-harmonics';
import { toEllipticHarmonics } from './shape/to-elliptic-harmonics';
import type { ComplexDescriptor, Contour, ShapeDescriptor } from './shape/types';
import { validateDescriptor } from './shape/validate-descriptor';
import { measureShape, sampleForMeasures, thumbnailPath, type ShapeMeasures } from './shape/measure-shape';
import { shapeErrorField } from './shape-error-field';
import { DescriptorSchema, MAX_HARMONIC, type DescriptorInput, type Family } from './schemas/descriptor';

/** One problem with a draft descriptor, attached to a field of the harmonic table when it names one. */
export interface DraftProblem {
  /** `terms.<i>.<field>`, `baseRadius`, or undefined for the shape as a whole. */
  field?: string;
  message: string;
}

export interface DraftAssessment {
  problems: DraftProblem[];
  contour?: Contour;
  metrics?: ShapeMeasures;
  path?: string;
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

/**
 * Checks a draft as the server will (schema, then the engine's validity rules) and samples it for the preview.
 * A draft that samples but fails validity still gets a preview, so the designer sees what is wrong.
 */
export function assessDraft(draft: DescriptorInput): DraftAssessment {
  const parsed = DescriptorSchema.safeParse(draft);
  if (!parsed.success) {
    return { problems: parsed.error.issues.map((i) => ({ field: i.path.join('.') || undefined, message: i.message })) as DraftProblem[] };
  }
  const descriptor = parsed.data as ShapeDescriptor;
  const problems: DraftProblem[] = [];
  try {
    validateDescriptor(descriptor);
  } catch (error) {
    if (!(error instanceof ShapeError)) throw error;
    problems.push({ field: shapeErrorField(error, descriptor), message: capitalise(error.message) });
  }
  try {
    const contour = sampleForMeasures(descriptor);
    return { problems, contour, metrics: measureShape(descriptor, contour), path: thumbnailPath(contour) };
  } catch (error) {
    if (!(error instanceof ShapeError)) throw error;
    return { problems: problems.length ? problems : [{ message: capitalise(error.message) }] };
  }
}

/** Radial harmonics fitted when switching an elliptic or complex draft to the radial family. */
const RADIAL_FIT_HARMONICS = 16;

/**
 * The same outline in another family: radial → complex is exact, complex ↔ elliptic are exact, and elliptic or
 * complex → radial is a fit of 16 radial harmonics to the sampled contour (it fails for outlines that are not
 * star-shaped from their centroid).
 */
export function convertFamily(draft: DescriptorInput, to: Family): { descriptor: DescriptorInput; note?: string } {
  const from = draft.family;
  if (from === to) return { descriptor: draft };
  const d = draft as ShapeDescriptor;
  if (to === 'complex') return { descriptor: prune(toComplexHarmonics(d)) };
  if (to === 'elliptic') return { descriptor: toEllipticHarmonics(prune(toComplexHarmonics(d)) as ComplexDescriptor) as DescriptorInput };
  const fitted = fitRadialHarmonics(sampleForMeasures(d), RADIAL_FIT_HARMONICS);
  return { descriptor: fitted as DescriptorInput, note: `Fitted ${RADIAL_FIT_HARMONICS} radial harmonics to the outline; check the shape.` };
}

/** Complex coefficients below this magnitude are dropped after a conversion (numerical dust). */
const NEGLIGIBLE_COEFFICIENT = 1e-12;

function prune(c: ComplexDescriptor): DescriptorInput {
  return { family: 'complex', terms: c.terms.filter((t) => Math.hypot(t.re, t.im) > NEGLIGIBLE_COEFFICIENT).map((t) => ({ ...t })) };
}

/** The draft with one more harmonic: the lowest index not yet used, starting at zero amplitude. */
export function addHarmonic(draft: DescriptorInput): DescriptorInput {
  if (draft.family === 'radial') {
    const used = new Set(draft.terms.map((t) => t.k));
    const k = firstFree(used, 2);
    return k === undefined ? draft : { ...draft, terms: [...draft.terms, { k, amplitude: 0, phase: 0 }].sort((a, b) => a.k - b.k) };
  }
  if (draft.family === 'elliptic') {
    const used = new Set(draft.terms.map((t) => t.n));
    const n = firstFree(used, 1);
    return n === undefined ? draft : { ...draft, terms: [...draft.terms, { n, a: 0, b: 0, c: 0, d: 0 }].sort((a, b) => a.n - b.n) };
  }
  const used = new Set(draft.terms.map((t) => t.k));
  for (let m = 1; m <= MAX_HARMONIC; m++) {
    for (const k of [m, -m]) if (!used.has(k)) return { ...draft, terms: [...draft.terms, { k, re: 0, im: 0 }] };
  }
  return draft;
}

function firstFree(used: Set<number>, from: number): number | undefined {
  for (let k = from; k <= MAX_HARMONIC; k++) if (!used.has(k)) return k;
  for (let k = 1; k < from; k++) if (!used.has(k)) return k;
  return undefined;
}

/** The draft without term `index`. */
export function removeHarmonic(draft: DescriptorInput, index: number): DescriptorInput {
  return { ...draft, terms: draft.terms.filter((_, i) => i !== index) } as DescriptorInput;
}

/** The draft with one field of term `index` set. */
export function setTermField(draft: DescriptorInput, index: number, field: string, value: number): DescriptorInput {
  return { ...draft, terms: draft.terms.map((t, i) => (i === index ? { ...t, [field]: value } : t)) } as DescriptorInput;
}
