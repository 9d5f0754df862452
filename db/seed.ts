import type { Db } from './client';
import { findLabBySlug, insertLab } from './repositories/labs';

/**
 * The demo lab, an invented scenario: the Halden Form Perception Group is preparing a study on how people
 * learn arbitrary categories of smooth blob-like shapes. Seeding is idempotent.
 */
export const DEMO_LAB = { slug: 'halden-form', name: 'Halden Form Perception Group' } as const;

export async function seedDemo(db: Db): Promise<string> {
  return db.transaction().execute(async (trx) => {
    const existing = await findLabBySlug(trx, DEMO_LAB.slug);
    if (existing) return `demo lab "${DEMO_LAB.name}" already present`;
    await insertLab(trx, { slug: DEMO_LAB.slug, name: DEMO_LAB.name });
    return `created demo lab "${DEMO_LAB.name}"`;
  });
}
