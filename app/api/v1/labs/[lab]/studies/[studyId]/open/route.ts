import { openStudyRoute } from '@/lib/server/api';
import { toHandler } from '@/lib/server/http';

export const dynamic = 'force-dynamic';
export const POST = toHandler(openStudyRoute);
