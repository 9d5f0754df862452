import type { DbHandle } from '../client';
import type { SpaceStudyLinkRow } from '../database';

export function insertSpaceStudyLink(
  db: DbHandle,
  v: { spaceId: string; labId: string; studyId: string; studyName: string; editionId: string; basis: 'slopes' | 'map'; suggestion: unknown; userId: string },
): Promise<SpaceStudyLinkRow> {
  return db
    .insertInto('space_study_links')
    .values({ space_id: v.spaceId, lab_id: v.labId, study_id: v.studyId, study_name: v.studyName, edition_id: v.editionId, basis: v.basis, suggestion: JSON.stringify(v.suggestion), created_by: v.userId })
    .returningAll()
    .executeTakeFirstOrThrow();
}

/** The study a space was made from (with the edition's space and number), or undefined for a space made by hand. */
export function findSpaceStudyLink(db: DbHandle, labId: string, spaceId: string) {
  return db
    .selectFrom('space_study_links as l')
    .leftJoin('editions as e', 'e.id', 'l.edition_id')
    .leftJoin('shape_spaces as s', 's.id', 'e.space_id')
    .selectAll('l')
    .select(['e.number as edition_number', 'e.space_id as edition_space_id', 's.name as edition_space_name', 'e.content_hash as edition_hash'])
    .where('l.lab_id', '=', labId)
    .where('l.space_id', '=', spaceId)
    .executeTakeFirst();
}

/** The spaces made from a study, oldest first. */
export function listSpacesFromStudy(db: DbHandle, labId: string, studyId: string) {
  return db
    .selectFrom('space_study_links as l')
    .innerJoin('shape_spaces as s', 's.id', 'l.space_id')
    .select(['l.space_id', 's.name', 'l.basis', 'l.created_at'])
    .where('l.lab_id', '=', labId)
    .where('l.study_id', '=', studyId)
    .orderBy('l.created_at')
    .execute();
}
