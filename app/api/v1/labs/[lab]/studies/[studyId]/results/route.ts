import { getStudyResultsRoute } from '@/lib/server/api/study-results';
import { toHandler } from '@/lib/server/http';
export const GET = toHandler(getStudyResultsRoute);
