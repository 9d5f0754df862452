import { BoundaryError } from '../boundary/boundary-error';
import { checkBoundaries } from '../boundary/check-boundaries';
import { checkRender } from '../render/check-render';
import { PACK_LIMITS } from './pack-limits';
import type { PackInput, PackIssue } from './types';

const STATES: ReadonlySet<unknown> = new Set(['draft', 'in_review', 'approved', 'returned']);
const HASH_PATTERN = /^[0-9a-f]{64}$/;
/** ISO 8601 date-time with seconds and a zone, as `Date.prototype.toISOString` and PostgreSQL write it. */
const ISO_PATTERN = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?(Z|[+-]\d{2}:\d{2})$/;
const SEQUENCE_NAME = /^(?:[A-Za-z0-9][A-Za-z0-9._-]*\/)?[A-Za-z0-9][A-Za-z0-9._-]*$/;

/** Stage: the edition metadata. */
function editionIssues(input: PackInput): PackIssue[] {
  const issues: PackIssue[] = [];
  const { edition } = input;
  if (typeof edition.spaceName !== 'string' || edition.spaceName.trim() === '') issues.push({ field: 'edition.spaceName', code: 'name-missing', message: 'The edition needs its space name.' });
  if (!Number.isSafeInteger(edition.number) || edition.number < 1) issues.push({ field: 'edition.number', code: 'number-invalid', message: `An edition number is a whole number ≥ 1; got ${String(edition.number)}.` });
  if (typeof edition.contentHash !== 'string' || !HASH_PATTERN.test(edition.contentHash)) {
    issues.push({ field: 'edition.contentHash', code: 'hash-invalid', message: 'The content hash is 64 lowercase hexadecimal digits (SHA-256).' });
  }
  if (!STATES.has(edition.state)) issues.push({ field: 'edition.state', code: 'state-invalid', message: `Unknown edition state ${String(edition.state)}.` });
  const time = typeof edition.createdAt === 'string' && ISO_PATTERN.test(edition.createdAt) ? Date.parse(edition.createdAt) : Number.NaN;
  const year = Number.isFinite(time) ? new Date(time).getUTCFullYear() : Number.NaN;
  if (!(year >= PACK_LIMITS.minZipYear && year <= PACK_LIMITS.maxZipYear)) {
    issues.push({
      field: 'edition.createdAt',
      code: 'date-invalid',
      message: `The edition date must be an ISO 8601 date-time with a time zone between ${PACK_LIMITS.minZipYear} and ${PACK_LIMITS.maxZipYear}; got ${String(edition.createdAt)}.`,
    });
  }
  return issues;
}

/** Stage: versions and attached sequences. */
function otherIssues(input: PackInput): PackIssue[] {
  const issues: PackIssue[] = [];
  for (const field of ['product', 'engine'] as const) {
    const value = input.versions?.[field];
    if (typeof value !== 'string' || value.trim() === '') issues.push({ field: `versions.${field}`, code: 'version-missing', message: `The ${field} version is required.` });
  }
  const seen = new Set<string>();
  (input.sequences ?? []).forEach((file, index) => {
    if (typeof file.name !== 'string' || !SEQUENCE_NAME.test(file.name) || seen.has(file.name)) {
      issues.push({ field: `sequences.${index}.name`, code: 'sequence-name-invalid', message: `Sequence file names are unique letters, digits, '.', '_' and '-' (one folder level at most); got ${String(file.name)}.` });
    }
    seen.add(file.name);
  });
  return issues;
}

/** Stage: the boundaries, through `lib/boundary`'s own checks. */
function boundaryIssues(input: PackInput): PackIssue[] {
  try {
    checkBoundaries(input.boundaries);
    return [];
  } catch (error) {
    if (error instanceof BoundaryError) return [{ field: 'boundaries', code: error.code, message: error.message }];
    throw error;
  }
}

/**
 * Every problem with a pack input that can be seen without generating the space: edition metadata (name,
 * number ≥ 1, 64-hex content hash, state, ISO date 1980–2107), versions, sequence file names, boundaries
 * (`checkBoundaries`), and the display profile and render options (`checkRender`, fields prefixed `render.`,
 * the profile's `render.profile.`). Errors only; `checkRender`'s warnings travel in the manifest. Pure.
 */
export function checkPackInput(input: PackInput): PackIssue[] {
  const render = checkRender(input.profile, input.render).errors.map((i) => ({ field: `render.${i.field}`, code: i.code, message: i.message }));
  return [...editionIssues(input), ...otherIssues(input), ...boundaryIssues(input), ...render];
}
