import { BoundaryError } from '../boundary/boundary-error';
import { classifyStimuli } from '../boundary/classify-stimuli';
import { sha256 } from '../edition/sha256';
import { toHex } from '../edition/to-hex';
import { drawnSize } from '../render/drawn-size';
import { frameStimuli } from '../render/frame-stimuli';
import { RenderError } from '../render/render-error';
import { resolveRender } from '../render/resolve-render';
import { stimulusSvgPair } from '../render/stimulus-svg';
import { SpaceError } from '../space/space-error';
import { descriptorArea } from '../shape/descriptor-area';
import { checkPackInput } from './check-pack-input';
import { MANIFEST_SCHEMA } from './manifest-schema';
import { computeModelRdms } from './model-rdms';
import { runPackJob, type PackJobRunner } from './pack-job';
import { nonApprovedNotice } from './non-approved-notice';
import { PackError } from './pack-error';
import { PACK_LIMITS, PRODUCT_NAME } from './pack-limits';
import { packReadme } from './pack-readme';
import { packStimuli } from './pack-stimuli';
import { rdmTsvBytes } from './rdm-tsv-bytes';
import { sha256Sums } from './sha256-sums';
import { stimuliCsv } from './stimuli-csv';
import { synthesizeStimuli } from './synthesize-stimuli';
import { trialListCsv } from './trial-list-csv';
import type { CompressedFiles } from './compress-files';
import { zipPack } from './zip-pack';
import type { BuiltPack, ManifestRdm, ManifestStimulus, PackBackends, PackFile, PackInput, PackManifest, PackStage } from './types';

const DEGREES_PER_RADIAN = 180 / Math.PI;
const CONTRAST_BASIS = 'Nominal sRGB values (IEC 61966-2-1 decoding, WCAG 2.x relative luminance), not measured luminance; calibrate with a photometer for luminance-critical work.';

const RDM_FILES: readonly Omit<ManifestRdm, 'path'>[] = [
  { name: 'design', unit: 'axis units', description: 'Euclidean distance between designed coordinates (a, b).' },
  { name: 'contour', unit: 'shape units', description: 'RMS distance between corresponding outline points after the best translation, rotation and start point.' },
  { name: 'silhouette', unit: '1 - IoU (0 to 1)', description: 'One minus intersection over union of the filled shapes on one common 256 x 256 raster.' },
];

const encoder = new TextEncoder();
const byPath = (p: { path: string }, q: { path: string }): number => (p.path < q.path ? -1 : p.path > q.path ? 1 : 0);
const defaultSha256Hex = (bytes: Uint8Array): string => toHex(sha256(bytes));
/** Without a `runJob` back end, each job runs here when it is handed out. */
const runHere: PackJobRunner = (job) => runPackJob(job);

/** Splits 0 … n into at most `parts` consecutive, non-empty, about equal ranges. */
function splitEvenly(n: number, parts: number): { from: number; to: number }[] {
  const count = Math.max(1, Math.min(parts, n));
  return Array.from({ length: count }, (_, b) => ({ from: Math.round((n * b) / count), to: Math.round((n * (b + 1)) / count) }));
}

/** Stage: refuse unusable input with every reason, mapping the cores' own errors onto `PackError`. */
function checked<T>(work: () => T): T {
  try {
    return work();
  } catch (error) {
    if (error instanceof SpaceError) throw new PackError('invalid-space', error.message, error.failures.map((f) => ({ field: `definition.${f.id}`, code: f.code, message: f.reason })), { cause: error });
    if (error instanceof BoundaryError) throw new PackError('invalid-input', error.message, [{ field: 'boundaries', code: error.code, message: error.message }], { cause: error });
    if (error instanceof RenderError) {
      const code = error.code === 'does-not-fit' ? 'invalid-space' : 'invalid-input';
      throw new PackError(code, error.message, error.issues.map((i) => ({ field: `render.${i.field}`, code: i.code, message: i.message })), { cause: error });
    }
    throw error;
  }
}

/**
 * Builds a stimulus pack from plain data, deterministically: the same input gives the same manifest and the same
 * zip bytes. Pipeline: check the input (`checkPackInput`, `resolveRender`) → generate the layout stimuli and the
 * boundaries' prototypes (`packStimuli`) → synthesise and validate every outline at `render.samples` points →
 * one frame for all (`frameStimuli`) → both SVGs per stimulus (`stimulusSvgPair`), each pixel-unit SVG handed
 * to `backends.renderPng` as soon as it is made → hand out the pure heavy work as `PackJob`s to `backends.runJob` (contour and
 * silhouette RDM rows of the layout stimuli, perimeters; default: run here) → meanwhile categories and signed
 * distances (`classifyStimuli`), areas, drawn sizes and the design RDM here → the RDM tables as jobs → metrics,
 * manifest, tables, README, schema, SHA256SUMS. Every file is held once; the zip is streamed by `writeZip`.
 * Raises `PackError` (`invalid-input`, `invalid-space`, `render-failed`). Pure apart from the back ends it is
 * given; nothing here touches Node.
 */
export async function buildPack(input: PackInput, backends: PackBackends): Promise<BuiltPack> {
  const timings: Record<PackStage, number> = { check: 0, synthesize: 0, svg: 0, rdm: 0, png: 0, tables: 0, hash: 0 };
  const hashHex = backends.sha256Hex ?? defaultSha256Hex;
  const progress = backends.onProgress;
  const run = backends.runJob ?? runHere;
  const time = <T>(stage: PackStage, work: () => T): T => {
    const start = performance.now();
    const hashBefore = timings.hash;
    try {
      return work();
    } finally {
      // Hashing inside a stage is counted under 'hash' only, so the stages add up to the whole.
      timings[stage] += performance.now() - start - (stage === 'hash' ? 0 : timings.hash - hashBefore);
    }
  };
  const hashed = (path: string, data: Uint8Array, compression: PackFile['compression'] = 'DEFLATE'): PackFile => ({
    path,
    sha256: time('hash', () => hashHex(data)),
    bytes: data.length,
    data,
    compression,
  });

  // Phase 1: input, render settings, stimuli.
  const { render, stimuli } = time('check', () => {
    const issues = checkPackInput(input);
    if (issues.length > 0) throw new PackError('invalid-input', issues.map((i) => i.message).join(' '), issues);
    return checked(() => ({ render: resolveRender(input.profile, input.render), stimuli: packStimuli(input.definition, input.boundaries) }));
  });
  progress?.('check', 1);
  const ids = stimuli.map((s) => s.id);

  // Phase 2: outlines and the common frame.
  const { contours, frame } = time('synthesize', () => {
    const drawn = checked(() => synthesizeStimuli(stimuli, render.options.samples));
    return { contours: drawn, frame: checked(() => frameStimuli(drawn, render, ids)) };
  });
  progress?.('synthesize', 1);

  // Phase 3: SVGs, each PNG handed to the back end as soon as its SVG is made, so the renderers start at once and
  // work on while the RDMs are computed; each PNG is hashed as it arrives.
  let rendered = 0;
  const pngFilesReady: Promise<PackFile>[] = [];
  const svgFiles = time('svg', () =>
    stimuli.map((s, i) => {
      const { physical, pixels } = stimulusSvgPair(contours[i]!, frame, render);
      const png = backends.renderPng({ id: s.id, svg: pixels, sizePx: frame.canvasPx, channels: render.pngChannels }).then((bytes) => {
        rendered++;
        progress?.('png', rendered / stimuli.length);
        return hashed(`stimuli/png/${s.id}.png`, bytes, 'STORE');
      });
      // Awaited below; marked handled now, so a failed render while the rest runs is not an unhandled rejection.
      png.catch(() => undefined);
      pngFilesReady.push(png);
      return hashed(`stimuli/svg/${s.id}.svg`, encoder.encode(physical));
    }),
  );
  progress?.('svg', 1);

  // Phase 4: the heavy pure work as jobs, handed out after the PNGs so they run meanwhile: the contour and
  // silhouette RDMs of the layout stimuli in blocks of rows, and the perimeters.
  const layoutCount = stimuli.filter((s) => s.kind === 'layout').length;
  const layoutIds = ids.slice(0, layoutCount);
  const rdmStart = performance.now();
  const rdmsReady = computeModelRdms(stimuli.slice(0, layoutCount), contours.slice(0, layoutCount), run, (f) => progress?.('rdm', f));
  const perimetersReady = Promise.all(
    splitEvenly(stimuli.length, PACK_LIMITS.perimeterBlocks).map(({ from, to }) => run({ kind: 'perimeters', descriptors: stimuli.slice(from, to).map((s) => s.descriptor) })),
  );
  perimetersReady.catch(() => undefined);
  // The SVGs' DEFLATE work, ahead of the zip (compressFiles).
  const date = new Date(Date.parse(input.edition.createdAt));
  const compressed: Promise<CompressedFiles>[] = splitEvenly(svgFiles.length, PACK_LIMITS.svgCompressBlocks).map(({ from, to }) =>
    run({ kind: 'compress', files: svgFiles.slice(from, to).map(({ path, data, compression }) => ({ path, data, compression })) }),
  );
  timings.rdm += performance.now() - rdmStart;

  // Phase 5: what needs no job result, here meanwhile: categories, areas, drawn sizes.
  const measured = time('tables', () => ({
    classification: checked(() => classifyStimuli(stimuli, input.boundaries, input.definition.extent)),
    areas: stimuli.map((s) => Math.abs(descriptorArea(s.descriptor))),
    sizes: contours.map((c) => drawnSize(c, frame, input.profile)),
  }));

  // Phase 6: the RDM tables, formatted as jobs too.
  const rdmWait = performance.now();
  const rdms = await rdmsReady;
  const rdmTexts = await Promise.all(RDM_FILES.map((r) => rdmTsvBytes(rdms[r.name], layoutIds, run)));
  timings.rdm += performance.now() - rdmWait;
  const rdmFiles = RDM_FILES.map((r) => ({ ...r, path: `rdm/${r.name}.tsv` }));
  const rdmPackFiles = rdmFiles.map((r, i) => hashed(r.path, rdmTexts[i]!));
  for (const { path, data, compression } of rdmPackFiles) compressed.push(run({ kind: 'compress', files: [{ path, data, compression }] }));
  for (const p of compressed) p.catch(() => undefined);
  const perimeters = (await perimetersReady).flatMap((block) => Array.from(block));

  // Phase 7: the PNGs.
  const pngWait = performance.now();
  let pngFiles: PackFile[];
  try {
    pngFiles = await Promise.all(pngFilesReady);
  } catch (error) {
    throw new PackError('render-failed', `A PNG could not be rendered: ${error instanceof Error ? error.message : String(error)}`, [], { cause: error });
  }
  timings.png = performance.now() - pngWait;

  // Phase 8: manifest, tables, README, checksums.
  const built = time('tables', () => {
    const { classification, areas, sizes } = measured;
    const manifestStimuli = stimuli.map((s, i): ManifestStimulus => {
      const area = areas[i]!;
      const perimeter = perimeters[i]!;
      const size = sizes[i]!;
      const ref = (f: PackFile) => ({ path: f.path, sha256: f.sha256, bytes: f.bytes });
      return {
        id: s.id,
        kind: s.kind,
        prototypeOf: s.prototypeOf,
        files: { svg: ref(svgFiles[i]!), png: ref(pngFiles[i]!) },
        position: { a: s.position.a, b: s.position.b },
        polar: { rho: s.polar.rho, angleDeg: s.polar.angle * DEGREES_PER_RADIAN },
        descriptor: s.descriptor,
        contourOffset: [s.contourOffset[0], s.contourOffset[1]],
        metrics: { area, perimeter, compactness: perimeter === 0 ? 0 : (4 * Math.PI * area) / (perimeter * perimeter), equalAreaDiameterDeg: size.equalAreaDiameterDeg, maxExtentDeg: size.maxExtentDeg },
        boundaries: (classification[i]?.placements ?? []).map((p) => ({
          boundaryKey: p.boundaryKey,
          category: p.side === 'on' ? null : p.side,
          onBoundary: p.isAmbiguous,
          signedDistance: p.distance,
          fraction: p.fraction,
        })),
      };
    });
    const boundaryKeys = input.boundaries.map((b) => b.key);
    const boundaries = input.boundaries.map((b) => ({
      key: b.key,
      label: b.label ?? null,
      angleDeg: b.angleDeg,
      prototypeDistance: b.prototypeDistance ?? 0.75 * input.definition.extent,
    }));
    const notice = nonApprovedNotice(input.edition);
    const readme = packReadme({
      notice,
      edition: input.edition,
      productVersion: input.versions.product,
      engineVersion: input.versions.engine,
      profileName: input.profile.name,
      viewingDistanceCm: input.profile.viewingDistanceCm,
      render: render.options,
      sizes: render.sizes,
      contrast: render.contrast,
      boundaries,
      layoutStimuli: layoutCount,
      prototypes: stimuli.length - layoutCount,
      hasSequences: (input.sequences ?? []).length > 0,
    });
    const otherFiles = [
      hashed('README.txt', encoder.encode(readme)),
      hashed('manifest.schema.json', encoder.encode(JSON.stringify(MANIFEST_SCHEMA, null, 2) + '\n')),
      hashed('stimuli.csv', encoder.encode(stimuliCsv(manifestStimuli, boundaryKeys))),
      hashed('trial-list.csv', encoder.encode(trialListCsv(manifestStimuli, boundaryKeys))),
      ...rdmPackFiles,
      ...(input.sequences ?? []).map((f) => hashed(`sequences/${f.name}`, encoder.encode(f.text))),
    ].sort(byPath);
    const manifest: PackManifest = {
      ...(notice ? { notice } : {}),
      schemaVersion: PACK_LIMITS.schemaVersion,
      approved: input.edition.state === 'approved',
      product: { name: PRODUCT_NAME, version: input.versions.product },
      engine: { version: input.versions.engine },
      edition: { ...input.edition },
      displayProfile: { ...input.profile, derived: { pixelsPerCm: render.sizes.pixelsPerCm, pixelsPerDegree: render.sizes.pixelsPerDegree } },
      render: {
        options: render.options,
        sizes: render.sizes,
        pxPerUnit: frame.pxPerUnit,
        png: { channels: render.pngChannels, widthPx: frame.canvasPx, heightPx: frame.canvasPx },
        contrast: { ...render.contrast, basis: CONTRAST_BASIS },
        warnings: render.warnings,
      },
      space: { definition: input.definition, layoutStimuli: layoutCount, prototypes: stimuli.length - layoutCount },
      boundaries,
      rdms: rdmFiles.map(({ name, path, unit, description }) => ({ name, path, unit, description })),
      files: otherFiles.map(({ path, sha256: hash, bytes }) => ({ path, sha256: hash, bytes })),
      stimuli: manifestStimuli,
    };
    const manifestFile = hashed('manifest.json', encoder.encode(JSON.stringify(manifest, null, 2) + '\n'));
    const listed = [manifestFile, ...otherFiles, ...svgFiles, ...pngFiles].sort(byPath);
    const sums = hashed('SHA256SUMS', encoder.encode(sha256Sums(listed)));
    return { manifest, files: [...listed, sums].sort(byPath) };
  });
  progress?.('tables', 1);

  return {
    manifest: built.manifest,
    files: built.files,
    timings,
    writeZip: async (sink) => zipPack(built.files, date, sink, await Promise.all(compressed)),
  };
}
