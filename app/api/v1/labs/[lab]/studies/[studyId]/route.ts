import { getStudyRoute, updateStudyRoute, deleteStudyRoute } from '@/lib/server/api';
import { toHandler } from '@/lib/server/http';

export const dynamic = 'force-dynamic';
export const GET = toHandler(getStudyRoute);
export const PATCH = toHandler(updateStudyRoute);
export const DELETE = toHandler(deleteStudyRoute);
