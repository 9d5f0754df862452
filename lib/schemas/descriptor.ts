import { z } from 'zod';

/**
 * Fourier descriptors as data, mirroring `lib/shape/types.ts`. The same schema checks the editor's form, every
 * API write and every jsonb value stored; `lib/shape`'s own validity checks (r > 0, simple contour) run after it.
 */

/** The highest harmonic the engine accepts (radial, elliptic); complex harmonics run from −128 to 128. */
export const MAX_HARMONIC = 128;

const finite = (label: string) =>
  z.number({ error: `${label} must be a number` }).refine(Number.isFinite, { message: `${label} must be a finite number` });

const harmonicIndex = (min: number, label: string) =>
  z
    .number({ error: `${label} must be a number` })
    .int(`${label} must be a whole number`)
    .min(min, `${label} must be at least ${min}`)
    .max(MAX_HARMONIC, `${label} must be at most ${MAX_HARMONIC}`);

export const RadialTermSchema = z.object({
  k: harmonicIndex(1, 'Harmonic'),
  amplitude: finite('Amplitude'),
  phase: finite('Phase'),
});
export const EllipticTermSchema = z.object({
  n: harmonicIndex(1, 'Harmonic'),
  a: finite('a'),
  b: finite('b'),
  c: finite('c'),
  d: finite('d'),
});
export const ComplexTermSchema = z.object({
  k: z.number().int('Harmonic must be a whole number').min(-MAX_HARMONIC).max(MAX_HARMONIC),
  re: finite('Real part'),
  im: finite('Imaginary part'),
});

function uniqueHarmonics<T>(key: (t: T) => number) {
  return (terms: T[], ctx: z.RefinementCtx) => {
    const seen = new Map<number, number>();
    terms.forEach((t, i) => {
      const h = key(t);
      if (seen.has(h)) ctx.addIssue({ code: 'custom', path: [i, 'k' in (t as object) ? 'k' : 'n'], message: `Harmonic ${h} appears twice` });
      seen.set(h, i);
    });
  };
}

export const RadialDescriptorSchema = z.object({
  family: z.literal('radial'),
  baseRadius: finite('Base radius').refine((r) => r > 0, 'Base radius must be above 0'),
  terms: z.array(RadialTermSchema).max(MAX_HARMONIC).superRefine(uniqueHarmonics((t) => t.k)),
});
export const EllipticDescriptorSchema = z.object({
  family: z.literal('elliptic'),
  center: z.tuple([finite('Centre x'), finite('Centre y')]),
  terms: z.array(EllipticTermSchema).min(1, 'Add at least the first harmonic').max(MAX_HARMONIC).superRefine(uniqueHarmonics((t) => t.n)),
});
export const ComplexDescriptorSchema = z.object({
  family: z.literal('complex'),
  terms: z.array(ComplexTermSchema).min(1, 'Add at least one harmonic').max(2 * MAX_HARMONIC + 1).superRefine(uniqueHarmonics((t) => t.k)),
});

export const DescriptorSchema = z.discriminatedUnion('family', [RadialDescriptorSchema, EllipticDescriptorSchema, ComplexDescriptorSchema]);
export type DescriptorInput = z.infer<typeof DescriptorSchema>;

export const FAMILIES = ['radial', 'elliptic', 'complex'] as const;
export type Family = (typeof FAMILIES)[number];
export const FamilySchema = z.enum(FAMILIES);

/** The product's names for the harmonic families. */
export const FAMILY_LABELS: Record<Family, string> = {
  radial: 'Radial harmonics',
  elliptic: 'Elliptic harmonics',
  complex: 'Complex harmonics',
};
