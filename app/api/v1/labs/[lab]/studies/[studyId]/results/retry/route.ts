import { retryStudyResultsRoute } from '@/lib/server/api/study-results';
import { toHandler } from '@/lib/server/http';
export const POST = toHandler(retryStudyResultsRoute);
