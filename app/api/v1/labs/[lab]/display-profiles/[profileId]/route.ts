import { getDisplayProfileRoute, updateDisplayProfileRoute, deleteDisplayProfileRoute } from '@/lib/server/api';
import { toHandler } from '@/lib/server/http';

export const dynamic = 'force-dynamic';
export const GET = toHandler(getDisplayProfileRoute);
export const PATCH = toHandler(updateDisplayProfileRoute);
export const DELETE = toHandler(deleteDisplayProfileRoute);
