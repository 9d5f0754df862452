import type { ColumnType, Generated, Insertable, Selectable } from 'kysely';
import type { Role } from '@/lib/schemas/roles';

/** Timestamps are written by the database and read as Date objects. */
type CreatedAt = ColumnType<Date, never, never>;

export interface LabsTable {
  id: Generated<string>;
  slug: string;
  name: string;
  created_at: Generated<Date>;
}

export interface AuditEventsTable {
  id: Generated<string>;
  lab_id: string | null;
  actor_user_id: string | null;
  action: string;
  subject_type: string;
  subject_id: string | null;
  details: ColumnType<Record<string, unknown>, Record<string, unknown> | string, never>;
  created_at: CreatedAt;
}


export interface UsersTable {
  id: Generated<string>;
  email: string;
  name: string;
  password_hash: string | null;
  email_verified_at: Date | null;
  session_version: Generated<number>;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

export interface MembershipsTable {
  lab_id: string;
  user_id: string;
  role: Role;
  created_at: Generated<Date>;
}

export interface InvitationsTable {
  id: Generated<string>;
  lab_id: string;
  email: string;
  role: Role;
  token_hash: string;
  invited_by: string | null;
  created_at: Generated<Date>;
  expires_at: Date;
  sent_at: Generated<Date>;
  accepted_at: Date | null;
  accepted_by: string | null;
  revoked_at: Date | null;
}

export interface VerificationTokensTable {
  identifier: string;
  token: string;
  expires: Date;
}

export interface PasswordResetTokensTable {
  id: Generated<string>;
  user_id: string;
  token_hash: string;
  created_at: Generated<Date>;
  expires_at: Date;
  used_at: Date | null;
}

export interface SeedShapesTable {
  id: Generated<string>;
  lab_id: string;
  name: string;
  family: 'radial' | 'elliptic' | 'complex';
  harmonic_count: number;
  /** A descriptor as in lib/shape (validated by lib/schemas/descriptor.ts on every write). */
  descriptor: ColumnType<unknown, string, string>;
  /** Where it came from: `{ kind: 'editor' }`, `{ kind: 'preset', preset }` or `{ kind: 'upload', ... }`. */
  origin: ColumnType<Record<string, unknown>, string, string>;
  version: Generated<number>;
  created_by: string | null;
  updated_by: string | null;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

export interface ShapeSpacesTable {
  id: Generated<string>;
  lab_id: string;
  name: string;
  seed_shape_id: string;
  /** Axes, extent, layout and normalisation (lib/schemas/space.ts validates every write). */
  settings: ColumnType<unknown, string, string>;
  equalization: ColumnType<unknown | null, string | null, string | null>;
  anisotropy: ColumnType<{ designed: number | null; equalized: number | null }, string, string>;
  stimulus_count: number;
  version: Generated<number>;
  /** The space's category boundaries (`lib/boundary` Boundary[]), edited apart from the definition. */
  boundaries: ColumnType<unknown, string | undefined, string>;
  boundaries_version: Generated<number>;
  created_by: string | null;
  updated_by: string | null;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

export type EditionState = 'draft' | 'in_review' | 'approved' | 'returned';

/** A frozen snapshot of a space. A trigger keeps the snapshot, hash and identity columns immutable. */
export interface EditionsTable {
  id: Generated<string>;
  lab_id: string;
  space_id: string;
  number: number;
  snapshot: ColumnType<unknown, string, never>;
  content_hash: string;
  engine_version: string;
  stimulus_count: number;
  change_note: string;
  author_id: string | null;
  created_at: CreatedAt;
  state: ColumnType<EditionState, EditionState | undefined, EditionState>;
  submitted_by: string | null;
  submitted_at: Date | null;
  decided_by: string | null;
  decided_at: Date | null;
  decision_note: string | null;
  superseded_by: string | null;
}

export interface EditionCommentsTable {
  id: Generated<string>;
  lab_id: string;
  edition_id: string;
  stimulus_id: string | null;
  body: string;
  author_id: string | null;
  created_at: CreatedAt;
  resolved_by: string | null;
  resolved_at: Date | null;
}

/** A lab's screen: resolution, pixel pitch (physical width or px/cm) and viewing distance. */
export interface DisplayProfilesTable {
  id: Generated<string>;
  lab_id: string;
  name: string;
  width_px: number;
  height_px: number;
  width_cm: number | null;
  pixels_per_cm: number | null;
  viewing_distance_cm: number;
  notes: Generated<string>;
  version: Generated<number>;
  created_by: string | null;
  updated_by: string | null;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

export type PackState = 'queued' | 'running' | 'succeeded' | 'failed' | 'cancelled';

/** A stimulus pack: its request, its job's progress, and where the finished zip is stored. */
export interface PacksTable {
  id: Generated<string>;
  lab_id: string;
  edition_id: string;
  display_profile_id: string | null;
  profile: ColumnType<unknown, string, string>;
  render_options: ColumnType<unknown, string, string>;
  options_hash: string;
  state: ColumnType<PackState, PackState | undefined, PackState>;
  progress: Generated<number>;
  stage: Generated<string>;
  error: string | null;
  attempts: Generated<number>;
  cancel_requested: Generated<boolean>;
  job_id: string | null;
  object_key: string | null;
  size_bytes: number | null;
  sha256: string | null;
  stimulus_count: number | null;
  manifest: ColumnType<unknown | null, string | null, string | null>;
  /** Run order files attached under `sequences/`: `{ name, text }[]`, copied when the pack was asked for. */
  sequences: ColumnType<unknown, string | undefined, string>;
  created_by: string | null;
  created_at: Generated<Date>;
  started_at: Date | null;
  finished_at: Date | null;
  updated_at: Generated<Date>;
}

export type ApiTokenScope = 'read' | 'write';

/** A lab API token: stored as its SHA-256 only, with a scope, an expiry, its last use and its revocation. */
export interface LabApiTokensTable {
  id: Generated<string>;
  lab_id: string;
  name: string;
  scope: ApiTokenScope;
  token_hash: string;
  token_prefix: string;
  created_by: string;
  created_at: Generated<Date>;
  expires_at: Date;
  last_used_at: Date | null;
  revoked_at: Date | null;
  revoked_by: string | null;
}

export type StudyState = 'draft' | 'open' | 'closed';

/** A norming study: its design (fixed once Open, by a trigger), its texts and its invite link. */
export interface StudiesTable {
  id: Generated<string>;
  lab_id: string;
  edition_id: string;
  name: string;
  state: ColumnType<StudyState, StudyState | undefined, StudyState>;
  design: ColumnType<unknown, string, string>;
  edition_warning: string | null;
  consent_text: string;
  instructions_text: Generated<string>;
  debrief_text: Generated<string>;
  finish_code_prefix: Generated<string>;
  target_participants: number;
  invite_nonce: string | null;
  invite_token_hash: string | null;
  invite_rotated_at: Date | null;
  version: Generated<number>;
  created_by: string | null;
  updated_by: string | null;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
  opened_at: Date | null;
  closed_at: Date | null;
  participants_started: Generated<number>;
}

/** A participant's session of a study; its plan is regenerated from the study seed and `participant_index`. */
export interface StudySessionsTable {
  id: Generated<string>;
  study_id: string;
  participant_index: number;
  code_hash: string;
  /** The hash of the invite token the session was started from; null for sessions older than the column. */
  invite_token_hash: string | null;
  planned_trials: number;
  stored_trials: Generated<number>;
  screen: ColumnType<unknown, string | null, string | null>;
  started_at: Generated<Date>;
  last_seen_at: Generated<Date>;
  completed_at: Date | null;
  finish_code: string | null;
  withdrawn_at: Date | null;
  is_excluded: Generated<boolean>;
  exclusion_reason: string | null;
  excluded_by: string | null;
}

/** One answered trial of a session, keyed by the client's trial UUID; the first write wins. */
export interface TrialResponsesTable {
  session_id: string;
  client_trial_id: string;
  trial_index: number;
  task: 'categorisation' | 'similarity';
  is_practice: boolean;
  is_catch: boolean;
  response_key: string | null;
  rating: number | null;
  rt_ms: number | null;
  is_correct: boolean | null;
  achieved_ms: number;
  onset_ms: number;
  offset_ms: number;
  was_tab_hidden: boolean;
  left_full_screen: boolean;
  received_at: Generated<Date>;
}

/** A space made from a study's perceptual equalisation: the study (name kept), the basis and the suggestion applied. */
export interface SpaceStudyLinksTable {
  space_id: string;
  lab_id: string;
  study_id: string | null;
  study_name: string;
  edition_id: string | null;
  basis: 'slopes' | 'map';
  suggestion: ColumnType<unknown, string, string>;
  created_by: string | null;
  created_at: Generated<Date>;
}

export type RunOrderState = 'ready' | 'queued' | 'running' | 'failed';

/** A run order of an edition: its definition (with the seed) and, once built, the order itself. */
export interface RunOrdersTable {
  id: Generated<string>;
  lab_id: string;
  edition_id: string;
  name: string;
  definition: ColumnType<unknown, string, string>;
  state: ColumnType<RunOrderState, RunOrderState | undefined, RunOrderState>;
  error: string | null;
  job_id: string | null;
  result: ColumnType<unknown | null, string | null, string | null>;
  version: Generated<number>;
  created_by: string | null;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

/** The analysis settings of a study's results (link, lapse, resamples, seed, exclusion rules). */
export interface StudyResultSettingsTable {
  study_id: string;
  settings: ColumnType<unknown, string, string>;
  updated_by: string | null;
  updated_at: Generated<Date>;
}

/** A manual exclusion decision (exclude a session or a trial, or keep one a rule left out); removals stay recorded. */
export interface StudyExclusionsTable {
  id: Generated<string>;
  study_id: string;
  session_id: string;
  trial_index: number | null;
  action: 'exclude' | 'keep';
  reason: string;
  created_by: string | null;
  created_at: Generated<Date>;
  removed_at: Date | null;
  removed_by: string | null;
}

export type StudyResultState = 'queued' | 'running' | 'ready' | 'failed';

/** Computed results of a study, cached by the hash of their input; long ones are computed by a job. */
export interface StudyResultsTable {
  id: Generated<string>;
  study_id: string;
  data_hash: string;
  state: StudyResultState;
  progress: Generated<number>;
  input: ColumnType<unknown, string, string>;
  result: ColumnType<unknown | null, string | null, string | null>;
  error: string | null;
  job_id: string | null;
  compute_ms: number | null;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

/** The Kysely database: one interface per table. */
export interface Database {
  labs: LabsTable;
  audit_events: AuditEventsTable;
  users: UsersTable;
  memberships: MembershipsTable;
  invitations: InvitationsTable;
  verification_tokens: VerificationTokensTable;
  password_reset_tokens: PasswordResetTokensTable;
  seed_shapes: SeedShapesTable;
  shape_spaces: ShapeSpacesTable;
  editions: EditionsTable;
  edition_comments: EditionCommentsTable;
  display_profiles: DisplayProfilesTable;
  packs: PacksTable;
  lab_api_tokens: LabApiTokensTable;
  studies: StudiesTable;
  run_orders: RunOrdersTable;
  study_sessions: StudySessionsTable;
  trial_responses: TrialResponsesTable;
  space_study_links: SpaceStudyLinksTable;
  study_result_settings: StudyResultSettingsTable;
  study_exclusions: StudyExclusionsTable;
  study_results: StudyResultsTable;
}

export type LabRow = Selectable<LabsTable>;
export type NewLabRow = Insertable<LabsTable>;
export type AuditEventRow = Selectable<AuditEventsTable>;
export type UserRow = Selectable<UsersTable>;
export type MembershipRow = Selectable<MembershipsTable>;
export type InvitationRow = Selectable<InvitationsTable>;
export type SeedShapeRow = Selectable<SeedShapesTable>;
export type ShapeSpaceRow = Selectable<ShapeSpacesTable>;
export type EditionRow = Selectable<EditionsTable>;
export type EditionCommentRow = Selectable<EditionCommentsTable>;
export type DisplayProfileRow = Selectable<DisplayProfilesTable>;
export type PackRow = Selectable<PacksTable>;
export type LabApiTokenRow = Selectable<LabApiTokensTable>;
export type StudyRow = Selectable<StudiesTable>;
export type RunOrderRow = Selectable<RunOrdersTable>;
export type StudySessionRow = Selectable<StudySessionsTable>;
export type TrialResponseRow = Selectable<TrialResponsesTable>;
export type SpaceStudyLinkRow = Selectable<SpaceStudyLinksTable>;
export type StudyExclusionRow = Selectable<StudyExclusionsTable>;
export type StudyResultRow = Selectable<StudyResultsTable>;
