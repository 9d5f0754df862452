import { RenderError } from './render-error';
import type { SrgbColour } from './types';

const HEX_PATTERN = /^#([0-9a-f]{6})$/i;
const MAX_LEVEL = 255;

/** An sRGB colour read into 8-bit channels and its canonical lowercase `#rrggbb`. */
export interface ParsedColour {
  readonly hex: string;
  readonly r: number;
  readonly g: number;
  readonly b: number;
  /** True when R = G = B. */
  readonly isGrey: boolean;
}

/**
 * Reads `#rrggbb` (case-insensitive) or an integer grey level 0…255 into 8-bit sRGB channels; null when it is
 * neither. `parseSrgbColourOrThrow` raises `RenderError` instead.
 */
export function parseSrgbColour(colour: SrgbColour): ParsedColour | null {
  let r: number, g: number, b: number;
  if (typeof colour === 'number') {
    if (!Number.isInteger(colour) || colour < 0 || colour > MAX_LEVEL) return null;
    r = g = b = colour;
  } else if (typeof colour === 'string') {
    const match = HEX_PATTERN.exec(colour.trim());
    if (!match) return null;
    const value = Number.parseInt(match[1] as string, 16);
    r = (value >> 16) & 0xff;
    g = (value >> 8) & 0xff;
    b = value & 0xff;
  } else {
    return null;
  }
  const hex = `#${[r, g, b].map((c) => c.toString(16).padStart(2, '0')).join('')}`;
  return { hex, r, g, b, isGrey: r === g && g === b };
}

/** `parseSrgbColour`, raising `RenderError` (`invalid-argument`) for anything it cannot read. */
export function parseSrgbColourOrThrow(colour: SrgbColour): ParsedColour {
  const parsed = parseSrgbColour(colour);
  if (!parsed) throw new RenderError('invalid-argument', `"${String(colour)}" is not an sRGB colour: give #rrggbb or a grey level from 0 to 255.`);
  return parsed;
}
