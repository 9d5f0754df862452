import 'server-only';
import { LabPathSchema, OkSchema } from '@/lib/schemas/account';
import { PageQuerySchema, pageOf } from '@/lib/schemas/common';
import { DisplayProfileInputSchema, DisplayProfilePathSchema, DisplayProfileSchema, UpdateDisplayProfileSchema } from '@/lib/schemas/display-profile';
import { getDb } from '../db';
import { defineRoute } from '../http';
import { createDisplayProfile, deleteDisplayProfile, getDisplayProfile, listDisplayProfiles, updateDisplayProfile } from '../services/display-profiles';

export const listDisplayProfilesRoute = defineRoute({
  id: 'listDisplayProfiles',
  method: 'GET',
  path: '/api/v1/labs/{lab}/display-profiles',
  summary: "The lab's display profiles, with pixels per degree derived",
  tags: ['display profiles'],
  access: { kind: 'lab', action: 'profile:read' },
  params: LabPathSchema,
  query: PageQuerySchema,
  response: pageOf(DisplayProfileSchema),
  handler: ({ labActor, query }) => listDisplayProfiles(getDb(), labActor(), query),
});

export const getDisplayProfileRoute = defineRoute({
  id: 'getDisplayProfile',
  method: 'GET',
  path: '/api/v1/labs/{lab}/display-profiles/{profileId}',
  summary: 'One display profile',
  tags: ['display profiles'],
  access: { kind: 'lab', action: 'profile:read' },
  params: DisplayProfilePathSchema,
  response: DisplayProfileSchema,
  handler: ({ labActor, params }) => getDisplayProfile(getDb(), labActor(), params.profileId),
});

export const createDisplayProfileRoute = defineRoute({
  id: 'createDisplayProfile',
  method: 'POST',
  path: '/api/v1/labs/{lab}/display-profiles',
  summary: 'Describe a screen: resolution, physical width or px/cm, viewing distance',
  tags: ['display profiles'],
  access: { kind: 'lab', action: 'profile:write' },
  params: LabPathSchema,
  body: DisplayProfileInputSchema,
  response: DisplayProfileSchema,
  successStatus: 201,
  handler: ({ labActor, body }) => createDisplayProfile(getDb(), labActor(), body),
});

export const updateDisplayProfileRoute = defineRoute({
  id: 'updateDisplayProfile',
  method: 'PATCH',
  path: '/api/v1/labs/{lab}/display-profiles/{profileId}',
  summary: 'Change a display profile; `version` must be the one the edit started from',
  tags: ['display profiles'],
  access: { kind: 'lab', action: 'profile:write' },
  params: DisplayProfilePathSchema,
  body: UpdateDisplayProfileSchema,
  response: DisplayProfileSchema,
  handler: ({ labActor, params, body }) => updateDisplayProfile(getDb(), labActor(), params.profileId, body),
});

export const deleteDisplayProfileRoute = defineRoute({
  id: 'deleteDisplayProfile',
  method: 'DELETE',
  path: '/api/v1/labs/{lab}/display-profiles/{profileId}',
  summary: 'Delete a display profile (packs already built keep their copy in the manifest)',
  tags: ['display profiles'],
  access: { kind: 'lab', action: 'profile:write' },
  params: DisplayProfilePathSchema,
  response: OkSchema,
  successStatus: 204,
  handler: async ({ labActor, params }) => {
    await deleteDisplayProfile(getDb(), labActor(), params.profileId);
    return { ok: true as const };
  },
});
