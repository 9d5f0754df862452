import { resumeSessionRoute } from '@/lib/server/api/participant-sessions';
import { toHandler } from '@/lib/server/http';
export const GET = toHandler(resumeSessionRoute);
