import 'server-only';
import { ROLES, type Role } from '@/lib/schemas/roles';

export { ROLES, ROLE_LABELS, type Role } from '@/lib/schemas/roles';

/**
 * The one policy table: which lab role may take which action. Every service and route asks `can()` here;
 * nothing else decides who may do what.
 */

const ALL: readonly Role[] = ROLES;
const OWNER: readonly Role[] = ['owner'];
const DESIGN: readonly Role[] = ['owner', 'designer'];
const EXPERIMENT: readonly Role[] = ['owner', 'experimenter'];
const BOUNDARY: readonly Role[] = ['owner', 'designer', 'experimenter'];
const DECIDE: readonly Role[] = ['owner', 'reviewer'];

export const POLICY = {
  'lab:read': ALL,
  'lab:update': OWNER,
  'audit:read': ALL,
  'members:read': ALL,
  'members:manage': OWNER,
  'tokens:manage': OWNER,
  'seed:read': ALL,
  'seed:write': DESIGN,
  'space:read': ALL,
  'space:write': DESIGN,
  // A new space from a study's perceptual equalisation: it changes no existing space, so experimenters may too.
  'space:derive': BOUNDARY,
  'boundary:write': BOUNDARY,
  'edition:read': ALL,
  'edition:freeze': DESIGN,
  'edition:submit': DESIGN,
  'edition:decide': DECIDE,
  'edition:comment': ALL,
  'profile:read': ALL,
  'profile:write': BOUNDARY,
  'pack:read': ALL,
  'pack:create': EXPERIMENT,
  'study:read': ALL,
  'study:write': EXPERIMENT,
  'session:manage': EXPERIMENT,
  'similarity:read': ALL,
  'runorder:read': ALL,
  'runorder:write': EXPERIMENT,
  'results:read': ALL,
  'results:write': EXPERIMENT,
} as const satisfies Record<string, readonly Role[]>;

export type PolicyAction = keyof typeof POLICY;
export const POLICY_ACTIONS = Object.keys(POLICY) as PolicyAction[];

/**
 * Lab API tokens act as a role of the table: `read` as a Reviewer, `write` as an Experimenter. A token never
 * does more than the Owner who made it can do now: `canWithToken` asks both the creator's role and the scope's.
 */
export const TOKEN_SCOPE_ROLES = { read: 'reviewer', write: 'experimenter' } as const satisfies Record<'read' | 'write', Role>;

/** Whether `role` may take `action`. */
export function can(role: Role, action: PolicyAction): boolean {
  return (POLICY[action] as readonly Role[]).includes(role);
}

export function isRole(value: string): value is Role {
  return (ROLES as readonly string[]).includes(value);
}

/** Whether a token of `scope`, made by a member whose role is now `creatorRole`, may take `action`. */
export function canWithToken(creatorRole: Role, scope: keyof typeof TOKEN_SCOPE_ROLES, action: PolicyAction): boolean {
  return can(creatorRole, action) && can(TOKEN_SCOPE_ROLES[scope], action);
}
