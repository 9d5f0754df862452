import 'server-only';
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { validationError } from '@/lib/errors';
import {
  contourArea,
  contourCentroid,
  fitEllipticHarmonics,
  fitRadialHarmonics,
  measureReconstructionError,
  normalizeEllipticHarmonics,
  normalizeRadialHarmonics,
  parseCsvOutline,
  parseSvgOutline,
  ShapeError,
  synthesizeContour,
  validateDescriptor,
  contourToSvgPath,
  type Contour,
  type ShapeDescriptor,
} from '@/lib/shape';
import { measureShape } from '@/lib/shape/measure-shape';
import { splitPathData } from '@/lib/shape/split-path-data';
import type { FitResult } from '@/lib/schemas/seed-shapes';
import { shapeErrorToAppError } from './shape-errors';

/** Uploads are capped at 1 MiB, read as a stream (server actions would cap at 1 MB without telling why). */
export const OUTLINE_UPLOAD_MAX_BYTES = 1024 * 1024;
/** Samples for the overlay drawing and the reconstruction error. */
const OVERLAY_SAMPLES = 1024;
const OVERLAY_DECIMALS = 4;

/** Constructs never allowed in an uploaded SVG, each with the words used to name it to the user. */
const HOSTILE_PATTERNS: readonly [RegExp, string][] = [
  [/<!DOCTYPE/i, 'a DOCTYPE declaration'],
  [/<!ENTITY/i, 'an entity declaration'],
  [/&(?!(?:amp|lt|gt|quot|apos);|#[0-9]+;|#x[0-9a-f]+;)[A-Za-z_][\w.-]*;/i, 'an entity reference'],
  [/<\s*script\b/i, 'a <script> element'],
  [/\son[a-z]+\s*=/i, 'an event-handler attribute (on…=)'],
  [/<\s*foreignObject\b/i, 'a <foreignObject> element'],
  [/(?:xlink:)?href\s*=\s*["']\s*(?!#)/i, 'an external reference (href)'],
  [/url\(\s*["']?\s*(?!#)/i, 'an external reference (url())'],
  [/<\?xml-stylesheet/i, 'a stylesheet processing instruction'],
  [/<\s*(?:iframe|embed|object|image|use|style)\b/i, 'an embedded or linked element'],
  [/javascript:/i, 'a javascript: URL'],
];

/** Names every hostile construct found in the text (empty when none). */
export function findHostileSvgContent(text: string): string[] {
  return HOSTILE_PATTERNS.filter(([pattern]) => pattern.test(text)).map(([, label]) => label);
}

interface Candidate {
  label: string;
  d: string;
}

/** Walks the parsed document for <path d> and <polygon points>, depth first, in document order. */
function collectCandidates(node: unknown, out: Candidate[], depth = 0): void {
  if (depth > 64) throw validationError('outline-upload', 'The SVG nests elements too deeply.');
  if (Array.isArray(node)) {
    for (const item of node) collectCandidates(item, out, depth + 1);
    return;
  }
  if (!node || typeof node !== 'object') return;
  for (const [key, value] of Object.entries(node as Record<string, unknown>)) {
    if (key === ':@') continue;
    const attrs = ((node as Record<string, unknown>)[':@'] ?? {}) as Record<string, string>;
    if (key === 'path' && typeof attrs['@_d'] === 'string') out.push({ label: attrs['@_id'] ? `path #${attrs['@_id']}` : `path ${out.length + 1}`, d: attrs['@_d'] });
    if (key === 'polygon' && typeof attrs['@_points'] === 'string') out.push({ label: `polygon ${out.length + 1}`, d: `M${attrs['@_points'].trim()}Z` });
    collectCandidates(value, out, depth + 1);
  }
}

/** Stage: the outlines of an SVG document, after the hostile-content and well-formedness checks. */
export function extractSvgOutlines(text: string): { outline: Contour; notes: string[] } {
  const hostile = findHostileSvgContent(text);
  if (hostile.length > 0) {
    throw validationError('outline-upload', `The SVG was rejected because it contains ${hostile.join(', ')}. Upload a plain SVG with only path data.`, {
      file: [`Contains ${hostile.join(', ')}`],
    });
  }
  const valid = XMLValidator.validate(text);
  if (valid !== true) {
    throw validationError('outline-upload', `The SVG is not well-formed XML (line ${valid.err.line}: ${valid.err.msg}).`, { file: ['Malformed SVG'] });
  }
  if (/\stransform\s*=/i.test(text)) {
    throw validationError('outline-upload', 'The SVG uses a transform; apply transforms to the path before uploading (e.g. "Object to path" in your editor).', {
      file: ['Transforms are not supported'],
    });
  }
  let doc: unknown[];
  try {
    doc = new XMLParser({ ignoreAttributes: false, preserveOrder: true, processEntities: false }).parse(text) as unknown[];
  } catch (error) {
    // The parser refuses some documents the validator let through, deep nesting among them (found by the hostile corpus).
    const tooDeep = error instanceof Error && /nested/i.test(error.message);
    throw validationError('outline-upload', tooDeep ? 'The SVG nests elements too deeply.' : 'The SVG could not be read as XML.', { file: [tooDeep ? 'Nested too deeply' : 'Malformed SVG'] });
  }
  const root = doc.find((n) => n && typeof n === 'object' && 'svg' in (n as object));
  if (!root) throw validationError('outline-upload', 'The file is XML but not an SVG (no <svg> root).', { file: ['Not an SVG'] });
  const candidates: Candidate[] = [];
  collectCandidates(root, candidates);
  if (candidates.length === 0) throw validationError('outline-upload', 'The SVG has no <path> or <polygon> to use as an outline.', { file: ['No path found'] });

  const closed: { label: string; outline: Contour; area: number }[] = [];
  let open = 0;
  for (const c of candidates) {
    for (const [i, part] of splitPathData(c.d).entries()) {
      try {
        const outline = parseSvgOutline(part);
        closed.push({ label: c.label + (i > 0 ? ` (subpath ${i + 1})` : ''), outline, area: Math.abs(contourArea(outline)) });
      } catch (error) {
        if (error instanceof ShapeError && (error.code === 'outline-not-closed' || error.code === 'too-few-points')) open++;
        else throw error;
      }
    }
  }
  if (closed.length === 0) {
    throw validationError('outline-upload', 'No outline in the SVG is closed. Close the path (end it with Z) and upload again.', { file: ['Outline not closed'] });
  }
  closed.sort((a, b) => b.area - a.area);
  const chosen = closed[0]!;
  const notes: string[] = [];
  if (closed.length + open > 1) {
    notes.push(`The SVG holds ${closed.length + open} outlines${open ? ` (${open} not closed)` : ''}; the largest closed one, ${chosen.label}, was used.`);
  }
  return { outline: chosen.outline, notes };
}

function fitFamily(outline: Contour, family: 'radial' | 'elliptic', harmonics: number): { raw: ShapeDescriptor; normalized: ShapeDescriptor } {
  if (family === 'radial') {
    const raw = fitRadialHarmonics(outline, harmonics);
    return { raw, normalized: normalizeRadialHarmonics(raw) };
  }
  const raw = fitEllipticHarmonics(outline, harmonics);
  return { raw, normalized: normalizeEllipticHarmonics(raw) };
}

/** Path data of a contour centred on `centre` and divided by `unit`, for the overlay. */
function overlayPath(contour: Contour, centre: readonly [number, number], unit: number): string {
  return contourToSvgPath({ x: contour.x.map((v) => (v - centre[0]) / unit), y: contour.y.map((v) => (v - centre[1]) / unit) }, { decimals: OVERLAY_DECIMALS });
}

/**
 * Fits harmonics of one family to an uploaded outline (SVG or CSV text). Nothing uploaded is kept: the answer
 * holds the fitted descriptor, the two outlines as path data for the overlay, the reconstruction error and notes.
 */
export function fitUploadedOutline(text: string, format: 'svg' | 'csv', family: 'radial' | 'elliptic', harmonics: number): FitResult {
  try {
    const { outline, notes } = format === 'svg' ? extractSvgOutlines(text) : { outline: parseCsvOutline(text), notes: [] as string[] };
    const { raw, normalized } = fitFamily(outline, family, harmonics);
    try {
      validateDescriptor(normalized);
    } catch (error) {
      if (error instanceof ShapeError && error.code === 'self-intersecting') {
        throw validationError('outline-upload', `The fitted outline with ${harmonics} harmonics crosses itself. Try fewer harmonics.`, { harmonics: ['The fit intersects itself'] });
      }
      throw error;
    }
    const error = measureReconstructionError(outline, raw, { samples: OVERLAY_SAMPLES });
    const centre = contourCentroid(outline);
    const unit = Math.sqrt(Math.abs(contourArea(outline)) / Math.PI);
    let fitted = synthesizeContour(raw, OVERLAY_SAMPLES, { checkSimple: false });
    if (raw.family === 'radial') fitted = { x: fitted.x.map((v) => v + centre[0]), y: fitted.y.map((v) => v + centre[1]) };
    const m = measureShape(normalized);
    return {
      descriptor: normalized as FitResult['descriptor'],
      outlinePath: overlayPath(outline, centre, unit),
      fittedPath: overlayPath(fitted, centre, unit),
      meanError: error.mean,
      maxError: error.max,
      notes,
      format,
      metrics: { ...m },
    };
  } catch (error) {
    throw shapeErrorToAppError(error, 'outline-upload', 'file');
  }
}
