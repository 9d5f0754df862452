import { getStudyPlanRoute } from '@/lib/server/api';
import { toHandler } from '@/lib/server/http';

export const dynamic = 'force-dynamic';
export const GET = toHandler(getStudyPlanRoute);
