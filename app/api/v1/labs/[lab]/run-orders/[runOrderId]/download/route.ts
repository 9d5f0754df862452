import { downloadRunOrderRoute } from '@/lib/server/api/run-orders';
import { toHandler } from '@/lib/server/http';

export const dynamic = 'force-dynamic';
export const GET = toHandler(downloadRunOrderRoute);
