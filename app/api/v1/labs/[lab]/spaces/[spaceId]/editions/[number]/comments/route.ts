import { listEditionCommentsRoute, addEditionCommentRoute } from '@/lib/server/api';
import { toHandler } from '@/lib/server/http';

export const dynamic = 'force-dynamic';
export const GET = toHandler(listEditionCommentsRoute);
export const POST = toHandler(addEditionCommentRoute);
