import 'server-only';
import { createHash } from 'node:crypto';
import { AppError, validationError } from '@/lib/errors';
import type { Db } from '@/db/client';
import { findEditionByHash } from '@/db/repositories/editions';
import { checkPack, checkPackManifest, type PackCheckEditionClaim, type PackCheckReport } from '@/lib/pack';
import type { PackCheckResult, PackEditionMatch } from '@/lib/schemas/pack-check';
import { PackZipError } from '../pack-check/pack-zip-error';
import { readPackZip } from '../pack-check/read-pack-zip';
import { authorize, type LabActor } from './access';

const sha256Hex = (bytes: Uint8Array): string => createHash('sha256').update(bytes).digest('hex');

/** What the caller sent: a whole pack zip, or a manifest with its SHA256SUMS. */
export type PackCheckInput = { kind: 'zip'; bytes: Uint8Array } | { kind: 'manifest'; manifest: string; sums: string };

/** Maps a refused zip onto the error vocabulary: limits are 413, malformed or unsafe zips 400. */
function refused(error: PackZipError): AppError {
  const code = error.isSizeLimit ? 'too_large:pack-zip' : 'validation:pack-zip';
  return new AppError(code, error.message, { fields: { file: [error.message] }, cause: error });
}

/** Stage: does the edition the manifest claims belong to this lab? Looked up by content hash, then compared. */
async function matchEdition(db: Db, labId: string, claim: PackCheckEditionClaim | null): Promise<PackEditionMatch> {
  if (!claim) return { status: 'no-claim', message: 'The manifest names no edition that can be read, so the pack cannot be matched to one.', claimed: null, known: null };
  const row = await findEditionByHash(db, labId, claim.contentHash, claim.number);
  if (!row) {
    return {
      status: 'unknown',
      message: `No edition of this lab has the content hash ${claim.contentHash.slice(0, 12)}…: the pack is not from this lab, or its manifest was changed.`,
      claimed: claim,
      known: null,
    };
  }
  const known = { id: row.id, spaceId: row.space_id, spaceName: row.space_name, number: row.number, state: row.state, contentHash: row.content_hash };
  if (row.number !== claim.number || row.space_name !== claim.spaceName) {
    return {
      status: 'differs',
      message: `The content hash is that of ${row.space_name}, edition ${row.number}, but the manifest says ${claim.spaceName}, edition ${claim.number}.`,
      claimed: claim,
      known,
    };
  }
  return { status: 'matches', message: `Made from ${row.space_name}, edition ${row.number}, of this lab.`, claimed: claim, known };
}

/**
 * Checks a pack (zip) or a manifest with its SHA256SUMS against its own lists (`lib/pack` `checkPack` /
 * `checkPackManifest`), then matches the edition it claims against the lab's editions by content hash. A zip is
 * read with limits (`readPackZip`); one that is refused, or is no pack at all, is a 400 or 413 with the reason.
 */
export async function checkPackUpload(db: Db, actor: LabActor, input: PackCheckInput): Promise<PackCheckResult> {
  authorize(actor, 'pack:read');
  let report: PackCheckReport;
  if (input.kind === 'zip') {
    let files;
    try {
      files = await readPackZip(Buffer.from(input.bytes.buffer, input.bytes.byteOffset, input.bytes.byteLength));
    } catch (error) {
      if (error instanceof PackZipError) throw refused(error);
      throw error;
    }
    report = checkPack(files, { sha256Hex });
    if (report.verdict === 'unreadable') {
      const message = 'This zip is not a stimulus pack: it holds neither manifest.json nor SHA256SUMS at its top level (or in one folder).';
      throw new AppError('validation:pack-zip', message, { fields: { file: [message] } });
    }
  } else {
    if (!input.manifest.trim() || !input.sums.trim()) throw validationError('pack-check', 'Add both manifest.json and SHA256SUMS.');
    report = checkPackManifest(input.manifest, input.sums, { sha256Hex });
  }
  const { edition, ...rest } = report;
  return { ...rest, altered: [...report.altered], missing: [...report.missing], extra: [...report.extra], problems: [...report.problems], manifest: { ...report.manifest, schemaIssues: [...report.manifest.schemaIssues] }, edition: await matchEdition(db, actor.labId, edition) };
}
