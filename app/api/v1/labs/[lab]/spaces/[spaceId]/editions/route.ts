import { listEditionsRoute, freezeEditionRoute } from '@/lib/server/api';
import { toHandler } from '@/lib/server/http';

export const dynamic = 'force-dynamic';
export const GET = toHandler(listEditionsRoute);
export const POST = toHandler(freezeEditionRoute);
