import { createRunOrderRoute, listRunOrdersRoute } from '@/lib/server/api/run-orders';
import { toHandler } from '@/lib/server/http';

export const dynamic = 'force-dynamic';
export const GET = toHandler(listRunOrdersRoute);
export const POST = toHandler(createRunOrderRoute);
