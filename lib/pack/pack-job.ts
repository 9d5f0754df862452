import { descriptorPerimeter } from '../shape/descriptor-perimeter';
import type { Contour, RasterExtent, ShapeDescriptor } from '../shape/types';
import { silhouetteRdmRows } from '../space/silhouette-rdm-rows';
import { spectrumRdmRows } from '../space/spectrum-rdm-rows';
import type { ContourSpectrum, RdmRows } from '../space/types';
import { rdmTsvRowBytes } from './rdm-tsv';
import type { PackFile } from './types';
import { compressFiles, type CompressedFiles } from './compress-files';

/**
 * A CPU-heavy, pure piece of a pack build, as plain data (typed arrays and plain objects), so a back end can run
 * it in another thread (`PackBackends.runJob`) and the result is the same wherever it runs:
 * - `contour-rows`: rows `from` … `to − 1` of the contour RDM of all `spectra` (`spectrumRdmRows`);
 * - `silhouette-rows`: rows `from` … `to − 1` of the silhouette RDM; `contours` are the stimuli from `from` on
 *   (the rows need no earlier ones), `size` the whole matrix's, `extent` the one of all stimuli;
 * - `perimeters`: `descriptorPerimeter` of each descriptor;
 * - `tsv-rows`: lines `from` … `to − 1` of an RDM table (`rdmTsvRowBytes`; the header too when `from` is 0) as
 *   UTF-8, from those full rows of the matrix (`rows`, row-major, `ids.length` values each);
 * - `compress`: pack files compressed ahead for `zipPack` (`compressFiles`: native DEFLATE or STORE, CRC-32).
 */
export type PackJob =
  | { readonly kind: 'contour-rows'; readonly spectra: readonly ContourSpectrum[]; readonly from: number; readonly to: number }
  | {
      readonly kind: 'silhouette-rows';
      readonly contours: readonly Contour[];
      readonly size: number;
      readonly from: number;
      readonly to: number;
      readonly resolution: number;
      readonly extent: RasterExtent;
    }
  | { readonly kind: 'perimeters'; readonly descriptors: readonly ShapeDescriptor[] }
  | { readonly kind: 'tsv-rows'; readonly ids: readonly string[]; readonly rows: Float64Array; readonly from: number; readonly to: number }
  | { readonly kind: 'compress'; readonly files: readonly Pick<PackFile, 'path' | 'data' | 'compression'>[] };

/** What each kind of job gives back. */
export interface PackJobResults {
  readonly 'contour-rows': RdmRows;
  readonly 'silhouette-rows': RdmRows;
  readonly perimeters: Float64Array;
  readonly 'tsv-rows': Uint8Array;
  readonly compress: CompressedFiles;
}

/** The result of a job of kind K. */
export type PackJobResult<K extends PackJob['kind'] = PackJob['kind']> = PackJobResults[K];

/** Runs a `PackJob` somewhere (a worker thread, or here) and resolves with its result. */
export type PackJobRunner = <J extends PackJob>(job: J) => Promise<PackJobResult<J['kind']>>;

/** Runs one `PackJob` here. Worker threads call this with the jobs `buildPack` hands to `runJob`. */
export function runPackJob<J extends PackJob>(job: J): Promise<PackJobResult<J['kind']>>;
export async function runPackJob(job: PackJob): Promise<PackJobResult> {
  switch (job.kind) {
    case 'contour-rows':
      return spectrumRdmRows(job.spectra, job.from, job.to);
    case 'silhouette-rows': {
      // Rows are relative to the first contour given; their indices in the whole matrix are `from` on.
      const block = silhouetteRdmRows(job.contours, 0, job.to - job.from, { resolution: job.resolution, extent: job.extent });
      if (job.from + job.contours.length !== job.size) throw new RangeError(`a silhouette block from ${job.from} needs ${job.size - job.from} contours, got ${job.contours.length}`);
      return { size: job.size, from: job.from, to: job.to, values: block.values };
    }
    case 'perimeters':
      return Float64Array.from(job.descriptors, descriptorPerimeter);
    case 'tsv-rows':
      return rdmTsvRowBytes(job.rows, job.ids, job.from, job.to);
    case 'compress':
      return compressFiles(job.files);
  }
}
