import 'server-only';
import { LabPathSchema } from '@/lib/schemas/account';
import { PACK_ZIP_CONTENT_TYPES, PackCheckResultSchema, PackManifestCheckSchema } from '@/lib/schemas/pack-check';
import { getDb } from '../db';
import { defineRoute } from '../http';
import { PACK_MANIFEST_CHECK_MAX_BYTES, PACK_ZIP_LIMITS } from '../pack-check/pack-zip-limits';
import { checkPackUpload } from '../services/pack-checks';

export const checkPackRoute = defineRoute({
  id: 'checkPack',
  method: 'POST',
  path: '/api/v1/labs/{lab}/pack-checks',
  summary:
    'Check a stimulus pack: send the zip as application/zip (≤ 600 MiB), or JSON { manifest, sums } with manifest.json and SHA256SUMS as text; answers which files are altered, missing or extra and whether the edition is one of this lab’s. Nothing is stored.',
  tags: ['packs'],
  access: { kind: 'lab', action: 'pack:read' },
  params: LabPathSchema,
  body: PackManifestCheckSchema,
  binaryBody: { contentTypes: PACK_ZIP_CONTENT_TYPES, maxBytes: PACK_ZIP_LIMITS.maxZipBytes },
  maxBodyBytes: PACK_MANIFEST_CHECK_MAX_BYTES,
  response: PackCheckResultSchema,
  handler: ({ labActor, body, bytes }) =>
    checkPackUpload(getDb(), labActor(), bytes ? { kind: 'zip', bytes } : { kind: 'manifest', manifest: body?.manifest ?? '', sums: body?.sums ?? '' }),
});
