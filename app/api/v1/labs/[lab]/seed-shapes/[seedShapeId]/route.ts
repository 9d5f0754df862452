import { deleteSeedShapeRoute, getSeedShapeRoute, updateSeedShapeRoute } from '@/lib/server/api';
import { toHandler } from '@/lib/server/http';

export const dynamic = 'force-dynamic';
export const GET = toHandler(getSeedShapeRoute);
export const PATCH = toHandler(updateSeedShapeRoute);
export const DELETE = toHandler(deleteSeedShapeRoute);
