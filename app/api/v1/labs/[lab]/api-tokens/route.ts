import { listApiTokensRoute, createApiTokenRoute } from '@/lib/server/api';
import { toHandler } from '@/lib/server/http';

export const dynamic = 'force-dynamic';
export const GET = toHandler(listApiTokensRoute);
export const POST = toHandler(createApiTokenRoute);
