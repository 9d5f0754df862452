import { listStudiesRoute, createStudyRoute } from '@/lib/server/api';
import { toHandler } from '@/lib/server/http';

export const dynamic = 'force-dynamic';
export const GET = toHandler(listStudiesRoute);
export const POST = toHandler(createStudyRoute);
