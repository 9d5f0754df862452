import { changeLabMemberRole, removeLabMember } from '@/lib/server/api';
import { toHandler } from '@/lib/server/http';

export const dynamic = 'force-dynamic';
export const PATCH = toHandler(changeLabMemberRole);
export const DELETE = toHandler(removeLabMember);
