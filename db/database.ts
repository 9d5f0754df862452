import type { ColumnType, Generated, Insertable, Selectable } from 'kysely';

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

/** The Kysely database: one interface per table. */
export interface Database {
  labs: LabsTable;
  audit_events: AuditEventsTable;
}

export type LabRow = Selectable<LabsTable>;
export type NewLabRow = Insertable<LabsTable>;
export type AuditEventRow = Selectable<AuditEventsTable>;
