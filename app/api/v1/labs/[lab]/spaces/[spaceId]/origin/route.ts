import { getSpaceOriginRoute } from '@/lib/server/api/study-similarity';
import { toHandler } from '@/lib/server/http';
export const GET = toHandler(getSpaceOriginRoute);
