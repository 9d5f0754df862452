import { removeResultExclusionRoute } from '@/lib/server/api/study-results';
import { toHandler } from '@/lib/server/http';
export const DELETE = toHandler(removeResultExclusionRoute);
