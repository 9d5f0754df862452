import 'server-only';
import { HealthSchema } from '@/lib/schemas/health';
import { getDb } from '../db';
import { defineRoute } from '../http';
import { checkHealth } from '../services/health';

export const getHealth = defineRoute({
  id: 'getHealth',
  method: 'GET',
  path: '/api/health',
  summary: 'Whether the server and its database answer',
  tags: ['system'],
  access: { kind: 'public' },
  response: HealthSchema,
  handler: async () => {
    const health = await checkHealth(getDb());
    if (health.status !== 'ok') {
      return Response.json(health, { status: 503, headers: { 'cache-control': 'no-store' } });
    }
    return health;
  },
});
