import { deleteShapeSpaceRoute, getShapeSpaceRoute, updateShapeSpaceRoute } from '@/lib/server/api';
import { toHandler } from '@/lib/server/http';

export const dynamic = 'force-dynamic';
export const GET = toHandler(getShapeSpaceRoute);
export const PATCH = toHandler(updateShapeSpaceRoute);
export const DELETE = toHandler(deleteShapeSpaceRoute);
