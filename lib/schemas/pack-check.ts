import { z } from 'zod';

/** Content types under which the pack check takes a zip as raw bytes. */
export const PACK_ZIP_CONTENT_TYPES = ['application/zip', 'application/x-zip-compressed', 'application/octet-stream'] as const;

/** Largest manifest or SHA256SUMS text accepted by the manifest-only check, characters. */
export const PACK_CHECK_TEXT_MAX = 48 * 1024 * 1024;

/**
 * The manifest-only check, sent as JSON: `manifest.json` and `SHA256SUMS` exactly as shipped (the manifest's hash
 * covers every byte, so it must not be re-formatted). Undefined when the request is a zip.
 */
export const PackManifestCheckSchema = z
  .object({
    manifest: z.string({ error: 'Add the manifest.json file' }).min(1, 'Add the manifest.json file').max(PACK_CHECK_TEXT_MAX, 'manifest.json is too large'),
    sums: z.string({ error: 'Add the SHA256SUMS file' }).min(1, 'Add the SHA256SUMS file').max(PACK_CHECK_TEXT_MAX, 'SHA256SUMS is too large'),
  })
  .optional();
export type PackManifestCheckInput = z.input<typeof PackManifestCheckSchema>;

const hex64 = z.string().regex(/^[0-9a-f]{64}$/);
const EditionStateSchema = z.enum(['draft', 'in_review', 'approved', 'returned']);

export const PackCheckEditionClaimSchema = z.object({
  spaceName: z.string(),
  number: z.number().int(),
  contentHash: hex64,
  state: EditionStateSchema,
  createdAt: z.string(),
});

/**
 * Whether the edition a manifest claims is one of this lab's: `matches` (content hash and number both agree),
 * `differs` (the hash is the lab's but the number or space name is not what the manifest says), `unknown` (no edition
 * of this lab has that hash: another lab's pack, or a forged one), `no-claim` (the manifest names no edition).
 */
export const PackEditionMatchSchema = z.object({
  status: z.enum(['matches', 'differs', 'unknown', 'no-claim']),
  message: z.string(),
  claimed: PackCheckEditionClaimSchema.nullable(),
  known: z
    .object({ id: z.uuid(), spaceId: z.uuid(), spaceName: z.string(), number: z.number().int(), state: EditionStateSchema, contentHash: hex64 })
    .nullable(),
});
export type PackEditionMatch = z.infer<typeof PackEditionMatchSchema>;

const PROBLEM_CODES = [
  'no-sums',
  'sums-line',
  'sums-duplicate',
  'no-manifest',
  'manifest-json',
  'manifest-schema',
  'manifest-hash',
  'lists-disagree',
  'altered',
  'size-differs',
  'missing',
  'extra',
] as const;

/** The pack check's answer: `lib/pack`'s report plus the edition match. */
export const PackCheckResultSchema = z.object({
  mode: z.enum(['zip', 'manifest']),
  verdict: z.enum(['unreadable', 'altered', 'incomplete', 'inconsistent', 'intact']),
  summary: z.string(),
  counts: z.object({
    listed: z.number().int(),
    checked: z.number().int(),
    intact: z.number().int(),
    altered: z.number().int(),
    missing: z.number().int(),
    extra: z.number().int(),
  }),
  altered: z.array(z.object({ path: z.string(), expected: hex64, actual: hex64 })),
  missing: z.array(z.string()),
  extra: z.array(z.string()),
  manifest: z.object({
    present: z.boolean(),
    parsed: z.boolean(),
    hashMatchesSums: z.boolean().nullable(),
    schemaIssues: z.array(z.object({ pointer: z.string(), message: z.string() })),
  }),
  sums: z.object({ present: z.boolean(), lines: z.number().int() }),
  folder: z.string().nullable(),
  problems: z.array(z.object({ code: z.enum(PROBLEM_CODES), message: z.string(), path: z.string().optional() })),
  problemsLeftOff: z.number().int(),
  edition: PackEditionMatchSchema,
});
export type PackCheckResult = z.infer<typeof PackCheckResultSchema>;
