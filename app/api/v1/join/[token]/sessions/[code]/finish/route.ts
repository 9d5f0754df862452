import { finishSessionRoute } from '@/lib/server/api/participant-sessions';
import { toHandler } from '@/lib/server/http';
export const POST = toHandler(finishSessionRoute);
