import bcrypt from 'bcryptjs';
import type { Role } from '@/lib/schemas/roles';
import type { Db } from './client';
import demo from './demo-users.json' with { type: 'json' };
import { findLabBySlug, insertLab } from './repositories/labs';
import { findMembership, insertMembership } from './repositories/memberships';
import { findUserByEmail, insertUser } from './repositories/users';

/**
 * The demo lab, an invented scenario: the Halden Form Perception Group is preparing a study on how people
 * learn arbitrary categories of smooth, blob-like shapes. One member per role. Seeding is idempotent.
 */
export const DEMO_LAB = { slug: 'halden-form', name: 'Halden Form Perception Group' } as const;
export const DEMO_PASSWORD: string = demo.password;
export const DEMO_USERS = demo.users as readonly { role: Role; name: string; email: string }[];

/** bcrypt cost for demo accounts (the same as real ones). */
const DEMO_BCRYPT_COST = 12;

export async function seedDemo(db: Db): Promise<string> {
  const created: string[] = [];
  await db.transaction().execute(async (trx) => {
    let lab = await findLabBySlug(trx, DEMO_LAB.slug);
    if (!lab) {
      lab = await insertLab(trx, { slug: DEMO_LAB.slug, name: DEMO_LAB.name });
      created.push('lab');
    }
    const hash = await bcrypt.hash(DEMO_PASSWORD, DEMO_BCRYPT_COST);
    for (const u of DEMO_USERS) {
      let user = await findUserByEmail(trx, u.email);
      if (!user) {
        user = await insertUser(trx, { email: u.email, name: u.name, passwordHash: hash, emailVerifiedAt: new Date() });
        created.push(u.email);
      }
      if (!(await findMembership(trx, lab.id, user.id))) await insertMembership(trx, lab.id, user.id, u.role);
    }
  });
  return created.length ? `demo lab "${DEMO_LAB.name}": created ${created.join(', ')}` : `demo lab "${DEMO_LAB.name}" already present`;
}
