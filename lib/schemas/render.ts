import { z } from 'zod';

/** An sRGB colour: `#rrggbb` or an 8-bit grey level. */
const Colour = z.union([z.string().regex(/^#[0-9a-fA-F]{6}$/, 'Use #rrggbb'), z.number().int().min(0).max(255)]);

/** How a pack draws its stimuli (checked again, with sizes in pixels, by `lib/render` `checkRender`). */
export const RenderOptionsSchema = z.object({
  sizeDeg: z.number().positive('The size must be above 0°').lt(180),
  sizeMeasure: z.enum(['equal-area-diameter', 'max-extent']),
  canvasDeg: z.number().positive('The image must be above 0°').lt(180),
  style: z.enum(['silhouette', 'outline']),
  strokeArcmin: z.number().positive().max(600).nullable(),
  fill: Colour,
  background: Colour,
  antiAlias: z.boolean(),
  transparent: z.boolean(),
  samples: z.number().int().min(64).max(8192),
});
export type RenderOptionsValue = z.infer<typeof RenderOptionsSchema>;

export const DEFAULT_RENDER_OPTIONS: RenderOptionsValue = {
  sizeDeg: 4,
  sizeMeasure: 'equal-area-diameter',
  canvasDeg: 6,
  style: 'silhouette',
  strokeArcmin: null,
  fill: 0,
  background: 128,
  antiAlias: true,
  transparent: false,
  samples: 512,
};
