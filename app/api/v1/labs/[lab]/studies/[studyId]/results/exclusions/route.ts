import { createResultExclusionRoute, listResultExclusionsRoute } from '@/lib/server/api/study-results';
import { toHandler } from '@/lib/server/http';
export const GET = toHandler(listResultExclusionsRoute);
export const POST = toHandler(createResultExclusionRoute);
