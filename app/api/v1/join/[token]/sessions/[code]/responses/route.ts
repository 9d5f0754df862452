import { submitResponseRoute } from '@/lib/server/api/participant-sessions';
import { toHandler } from '@/lib/server/http';
export const POST = toHandler(submitResponseRoute);
