import 'server-only';
import { z } from 'zod';
import { OkSchema } from '@/lib/schemas/account';
import { PageQuerySchema, pageOf } from '@/lib/schemas/common';
import { EditionPathSchema } from '@/lib/schemas/edition';
import { CreateRunOrderSchema, RunOrderPathSchema, RunOrderSchema, UpdateRunOrderSchema } from '@/lib/schemas/run-order';
import { getDb } from '../db';
import { defineRoute } from '../http';
import { createRunOrder, deleteRunOrder, getRunOrder, listRunOrders, runOrderZip, updateRunOrderOf } from '../services/run-orders';

export const createRunOrderRoute = defineRoute({
  id: 'createRunOrder',
  method: 'POST',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}/editions/{number}/run-orders',
  summary: 'Create a run order of an edition (built at once; a type-1 index-1 order of more than 12 conditions is searched in the background)',
  tags: ['run-orders'],
  access: { kind: 'lab', action: 'runorder:write' },
  params: EditionPathSchema,
  body: CreateRunOrderSchema,
  response: RunOrderSchema,
  successStatus: 201,
  handler: ({ labActor, params, body }) => createRunOrder(getDb(), labActor(), params.spaceId, params.number, body),
});

export const listRunOrdersRoute = defineRoute({
  id: 'listRunOrders',
  method: 'GET',
  path: '/api/v1/labs/{lab}/spaces/{spaceId}/editions/{number}/run-orders',
  summary: "The edition's run orders, newest first",
  tags: ['run-orders'],
  access: { kind: 'lab', action: 'runorder:read' },
  params: EditionPathSchema,
  query: PageQuerySchema,
  response: pageOf(RunOrderSchema),
  handler: ({ labActor, params, query }) => listRunOrders(getDb(), labActor(), params.spaceId, params.number, query),
});

export const getRunOrderRoute = defineRoute({
  id: 'getRunOrder',
  method: 'GET',
  path: '/api/v1/labs/{lab}/run-orders/{runOrderId}',
  summary: 'One run order: definition, state, and the summary (durations, volumes, counts, transitions, flash check)',
  tags: ['run-orders'],
  access: { kind: 'lab', action: 'runorder:read' },
  params: RunOrderPathSchema,
  response: RunOrderSchema,
  handler: ({ labActor, params }) => getRunOrder(getDb(), labActor(), params.runOrderId),
});

export const updateRunOrderRoute = defineRoute({
  id: 'updateRunOrder',
  method: 'PUT',
  path: '/api/v1/labs/{lab}/run-orders/{runOrderId}',
  summary: "Replace a run order's name and definition (409 when it changed since `version`)",
  tags: ['run-orders'],
  access: { kind: 'lab', action: 'runorder:write' },
  params: RunOrderPathSchema,
  body: UpdateRunOrderSchema,
  response: RunOrderSchema,
  handler: ({ labActor, params, body }) => updateRunOrderOf(getDb(), labActor(), params.runOrderId, body),
});

export const deleteRunOrderRoute = defineRoute({
  id: 'deleteRunOrder',
  method: 'DELETE',
  path: '/api/v1/labs/{lab}/run-orders/{runOrderId}',
  summary: 'Delete a run order (packs that carry its files keep them)',
  tags: ['run-orders'],
  access: { kind: 'lab', action: 'runorder:write' },
  params: RunOrderPathSchema,
  response: OkSchema,
  successStatus: 204,
  handler: async ({ labActor, params }) => {
    await deleteRunOrder(getDb(), labActor(), params.runOrderId);
    return { ok: true as const };
  },
});

export const downloadRunOrderRoute = defineRoute({
  id: 'downloadRunOrder',
  method: 'GET',
  path: '/api/v1/labs/{lab}/run-orders/{runOrderId}/download',
  summary: 'A zip of the BIDS files: sub-<label>_task-<label>_run-<n>_events.tsv with their _events.json sidecars',
  tags: ['run-orders'],
  access: { kind: 'lab', action: 'runorder:read' },
  params: RunOrderPathSchema,
  /** The body is the zip itself; `response` is never used to parse a JSON answer. */
  response: z.string(),
  produces: 'application/zip',
  handler: async ({ labActor, params }) => {
    const { fileName, bytes } = await runOrderZip(getDb(), labActor(), params.runOrderId);
    return new Response(bytes as BodyInit, {
      status: 200,
      headers: { 'content-type': 'application/zip', 'content-disposition': `attachment; filename="${fileName}"`, 'cache-control': 'no-store', 'content-length': String(bytes.byteLength) },
    });
  },
});
