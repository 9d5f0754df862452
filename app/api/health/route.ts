import { getHealth } from '@/lib/server/api/health';
import { toHandler } from '@/lib/server/http';

export const dynamic = 'force-dynamic';
export const GET = toHandler(getHealth);
