import 'server-only';
import { z } from 'zod';
import { LabPathSchema } from '@/lib/schemas/account';
import { PageQuerySchema, pageOf } from '@/lib/schemas/common';
import { EditionPathSchema } from '@/lib/schemas/edition';
import { CreatePackSchema, DownloadLinkSchema, PackPathSchema, PackSchema } from '@/lib/schemas/pack';
import { getDb } from '../db';
import { defineRoute, jsonWithEtag } from '../http';
import { cancelPack, createPack, getPack, getPackManifest, listPacks, packDownloadLink, retryPack } from '../services/packs';

export const createPackRoute = defineRoute({
  id: 'createPack',
  method: 'POST',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}/editions/{number}/packs',
  summary: 'Ask for a pack of an edition (202 with the pack and its job; identical requests give the same pack)',
  tags: ['packs'],
  access: { kind: 'lab', action: 'pack:create' },
  params: EditionPathSchema,
  body: CreatePackSchema,
  response: PackSchema,
  successStatus: 202,
  handler: async ({ labActor, params, body }) => (await createPack(getDb(), labActor(), params.spaceId, params.number, body)).pack,
});

export const listPacksRoute = defineRoute({
  id: 'listPacks',
  method: 'GET',
  path: '/api/v1/labs/{lab}/packs',
  summary: "The lab's packs, newest first, with their job state and progress",
  tags: ['packs'],
  access: { kind: 'lab', action: 'pack:read' },
  params: LabPathSchema,
  query: PageQuerySchema,
  response: pageOf(PackSchema),
  handler: ({ labActor, query }) => listPacks(getDb(), labActor(), query),
});

export const getPackRoute = defineRoute({
  id: 'getPack',
  method: 'GET',
  path: '/api/v1/labs/{lab}/packs/{packId}',
  summary: 'One pack: state, progress, error, size and checksum (poll this for a job status)',
  tags: ['packs'],
  access: { kind: 'lab', action: 'pack:read' },
  params: PackPathSchema,
  response: PackSchema,
  handler: ({ labActor, params }) => getPack(getDb(), labActor(), params.packId),
});

export const cancelPackRoute = defineRoute({
  id: 'cancelPack',
  method: 'POST',
  path: '/api/v1/labs/{lab}/packs/{packId}/cancel',
  summary: 'Cancel a waiting or running pack',
  tags: ['packs'],
  access: { kind: 'lab', action: 'pack:create' },
  params: PackPathSchema,
  body: z.object({}).optional(),
  response: PackSchema,
  handler: ({ labActor, params }) => cancelPack(getDb(), labActor(), params.packId),
});

export const retryPackRoute = defineRoute({
  id: 'retryPack',
  method: 'POST',
  path: '/api/v1/labs/{lab}/packs/{packId}/retry',
  summary: 'Queue a failed or cancelled pack again',
  tags: ['packs'],
  access: { kind: 'lab', action: 'pack:create' },
  params: PackPathSchema,
  body: z.object({}).optional(),
  response: PackSchema,
  handler: ({ labActor, params }) => retryPack(getDb(), labActor(), params.packId),
});

export const packDownloadLinkRoute = defineRoute({
  id: 'packDownloadLink',
  method: 'POST',
  path: '/api/v1/labs/{lab}/packs/{packId}/download-link',
  summary: 'A short-lived download link for a finished pack',
  tags: ['packs'],
  access: { kind: 'lab', action: 'pack:read' },
  params: PackPathSchema,
  body: z.object({}).optional(),
  response: DownloadLinkSchema,
  handler: ({ labActor, params }) => packDownloadLink(getDb(), labActor(), params.packId),
});

export const getPackManifestRoute = defineRoute({
  id: 'getPackManifest',
  method: 'GET',
  path: '/api/v1/labs/{lab}/packs/{packId}/manifest',
  summary: "A finished pack's manifest.json, as kept in PostgreSQL",
  tags: ['packs'],
  access: { kind: 'lab', action: 'pack:read' },
  params: PackPathSchema,
  response: z.record(z.string(), z.unknown()),
  etag: true,
  handler: async ({ labActor, params, request }) => {
    const { manifest, etag } = await getPackManifest(getDb(), labActor(), params.packId);
    return jsonWithEtag(request, manifest, etag);
  },
});
