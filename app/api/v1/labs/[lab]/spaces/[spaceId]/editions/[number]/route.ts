import { getEditionRoute, updateEditionRoute } from '@/lib/server/api';
import { toHandler } from '@/lib/server/http';

export const dynamic = 'force-dynamic';
export const GET = toHandler(getEditionRoute);
export const PATCH = toHandler(updateEditionRoute);
