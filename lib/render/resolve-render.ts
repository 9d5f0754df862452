import { checkRender } from './check-render';
import { parseSrgbColourOrThrow } from './parse-srgb-colour';
import { RenderError } from './render-error';
import type { DisplayProfile, PngChannels, RenderOptions, ResolvedRender } from './types';

/**
 * `checkRender`, raising `RenderError` (`invalid-render`, every error in `issues`) unless the profile and options
 * are usable; otherwise the options with canonical lowercase `#rrggbb` colours (a silhouette's stroke set to
 * null), the derived sizes, the nominal contrast, the warnings and the PNG colour layout: grey when fill and
 * background are both grey, RGB otherwise, with alpha when transparent.
 */
export function resolveRender(profile: DisplayProfile, options: RenderOptions): ResolvedRender {
  const check = checkRender(profile, options);
  if (!check.ok || !check.sizes || !check.contrast) {
    throw new RenderError('invalid-render', check.errors.map((i) => i.message).join(' '), check.errors);
  }
  const fill = parseSrgbColourOrThrow(options.fill);
  const background = parseSrgbColourOrThrow(options.background);
  const grey = fill.isGrey && background.isGrey;
  const pngChannels: PngChannels = options.transparent ? (grey ? 'grey-alpha' : 'rgba') : grey ? 'grey' : 'rgb';
  return {
    profile,
    options: { ...options, fill: fill.hex, background: background.hex, strokeArcmin: options.style === 'outline' ? options.strokeArcmin : null },
    sizes: check.sizes,
    contrast: check.contrast,
    warnings: check.warnings,
    pngChannels,
  };
}
