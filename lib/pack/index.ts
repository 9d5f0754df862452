// lib/pack — stimulus packs: the manifest and its JSON Schema, CSV and TSV tables, model RDMs, README, SHA-256
// checksums and a byte-reproducible zip (jszip). Pure: PNG rasterisation and hashing come in as back ends, so
// Node-only code (sharp, worker threads, node:crypto) stays at the edge.

export type {
  BuiltPack,
  EditionState,
  ManifestPlacement,
  ManifestRdm,
  ManifestStimulus,
  PackBackends,
  PackEdition,
  PackFile,
  PackFileRef,
  PackInput,
  PackIssue,
  PackManifest,
  PackPngRequest,
  PackSequenceFile,
  PackStage,
} from './types';
export { PackError, type PackErrorCode } from './pack-error';
export { PACK_LIMITS, PRODUCT_NAME } from './pack-limits';
export { checkPackInput } from './check-pack-input';
export { packStimuli, type PackStimulus } from './pack-stimuli';
export { synthesizeStimuli } from './synthesize-stimuli';
export { modelRdms, computeModelRdms, type ModelRdms } from './model-rdms';
export { runPackJob, type PackJob, type PackJobResult, type PackJobResults, type PackJobRunner } from './pack-job';
export { rdmTsv, rdmTsvRows, formatRdmValue, RDM_DECIMALS } from './rdm-tsv';
export { rdmTsvBytes } from './rdm-tsv-bytes';
export { stimuliCsv, STIMULI_COLUMNS, boundaryColumns } from './stimuli-csv';
export { trialListCsv, TRIAL_LIST_COLUMNS } from './trial-list-csv';
export { categoryLabel } from './category-label';
export { packReadme, type PackReadmeContext } from './pack-readme';
export { nonApprovedNotice } from './non-approved-notice';
export { sha256Sums } from './sha256-sums';
export { MANIFEST_SCHEMA } from './manifest-schema';
export { zipBytes, zipPack } from './zip-pack';
export { buildPack } from './build-pack';
export type {
  ManifestSchemaIssue,
  PackCheckAltered,
  PackCheckEditionClaim,
  PackCheckEntry,
  PackCheckMode,
  PackCheckOptions,
  PackCheckProblem,
  PackCheckProblemCode,
  PackCheckReport,
  PackCheckVerdict,
} from './check-pack-types';
export { checkPack, checkPackManifest, MANIFEST_PATH, SUMS_PATH, MAX_REPORTED_PROBLEMS } from './check-pack';
export { checkPackManifestSchema, MAX_SCHEMA_ISSUES, SUPPORTED_SCHEMA_KEYWORDS } from './check-pack-schema';
export { parsePackSums, type ParsedSums, type SumsLine } from './check-pack-sums';
