import { z } from 'zod';

/** The lab roles, in order of reach. */
export const ROLES = ['owner', 'designer', 'experimenter', 'reviewer'] as const;
export type Role = (typeof ROLES)[number];
export const RoleSchema = z.enum(ROLES);

export const ROLE_LABELS: Record<Role, string> = {
  owner: 'Owner',
  designer: 'Designer',
  experimenter: 'Experimenter',
  reviewer: 'Reviewer',
};

export const ROLE_SUMMARIES: Record<Role, string> = {
  owner: 'Everything, members and tokens included',
  designer: 'Seed shapes, shape spaces, boundaries, editions',
  experimenter: 'Boundaries, norming studies, run orders, stimulus packs',
  reviewer: 'Reads everything, comments, approves or returns editions',
};
