import { deleteRunOrderRoute, getRunOrderRoute, updateRunOrderRoute } from '@/lib/server/api/run-orders';
import { toHandler } from '@/lib/server/http';

export const dynamic = 'force-dynamic';
export const GET = toHandler(getRunOrderRoute);
export const PUT = toHandler(updateRunOrderRoute);
export const DELETE = toHandler(deleteRunOrderRoute);
