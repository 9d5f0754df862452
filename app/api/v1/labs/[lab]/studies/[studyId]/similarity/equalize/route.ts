import { createEqualizedSpaceRoute } from '@/lib/server/api/study-similarity';
import { toHandler } from '@/lib/server/http';
export const POST = toHandler(createEqualizedSpaceRoute);
