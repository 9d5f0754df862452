import { deleteStudySessionRoute, setSessionExclusionRoute } from '@/lib/server/api/participant-sessions';
import { toHandler } from '@/lib/server/http';
export const PATCH = toHandler(setSessionExclusionRoute);
export const DELETE = toHandler(deleteStudySessionRoute);
