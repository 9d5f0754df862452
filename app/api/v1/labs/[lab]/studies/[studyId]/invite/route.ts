import { rotateStudyInviteRoute, revokeStudyInviteRoute } from '@/lib/server/api';
import { toHandler } from '@/lib/server/http';

export const dynamic = 'force-dynamic';
export const POST = toHandler(rotateStudyInviteRoute);
export const DELETE = toHandler(revokeStudyInviteRoute);
