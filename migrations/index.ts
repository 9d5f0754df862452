import type { Migration } from 'kysely';
import * as m20261202040000 from './20261202040000_create_labs_and_audit_events';
import * as m20261202050000 from './20261202050000_create_users_memberships_invitations';
import * as m20261202060000 from './20261202060000_create_seed_shapes';
import * as m20261202070000 from './20261202070000_create_shape_spaces';
import * as m20261202080000 from './20261202080000_create_boundaries_and_editions';
import * as m20261202090000 from './20261202090000_create_display_profiles';
import * as m20261202100000 from './20261202100000_create_packs';
import * as m20261202110000 from './20261202110000_create_studies';
import * as m20261202120000 from './20261202120000_create_run_orders';
import * as m20261202130000 from './20261202130000_create_lab_api_tokens';
import * as m20261202140000 from './20261202140000_create_sessions_and_trials';
import * as m20261202150000 from './20261202150000_create_study_results';
import * as m20261202160000 from './20261202160000_create_space_study_links';
import * as m20261202170000 from './20261202170000_keyset_timestamps_to_milliseconds';
import * as m20261202180000 from './20261202180000_bind_sessions_to_invite';

/**
 * Every migration, by name, in order. Listed statically so the same set runs under tsx, vitest and the app
 * (a test checks that every file in this folder is listed).
 */
export const MIGRATIONS: Record<string, Migration> = {
  '20261202040000_create_labs_and_audit_events': m20261202040000,
  '20261202050000_create_users_memberships_invitations': m20261202050000,
  '20261202060000_create_seed_shapes': m20261202060000,
  '20261202070000_create_shape_spaces': m20261202070000,
  '20261202080000_create_boundaries_and_editions': m20261202080000,
  '20261202090000_create_display_profiles': m20261202090000,
  '20261202100000_create_packs': m20261202100000,
  '20261202110000_create_studies': m20261202110000,
  '20261202120000_create_run_orders': m20261202120000,
  '20261202130000_create_lab_api_tokens': m20261202130000,
  '20261202140000_create_sessions_and_trials': m20261202140000,
  '20261202150000_create_study_results': m20261202150000,
  '20261202160000_create_space_study_links': m20261202160000,
  '20261202170000_keyset_timestamps_to_milliseconds': m20261202170000,
  '20261202180000_bind_sessions_to_invite': m20261202180000,
};
