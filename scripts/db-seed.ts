// `npm run db:seed`: the demo lab, idempotently.
import { createDb } from '@/db/client';
import { seedDemo } from '@/db/seed';
import { getEnv } from '@/lib/server/env';

const db = createDb(getEnv().DATABASE_URL, 1);
try {
  const summary = await seedDemo(db);
  console.log(`[seed] ${summary}`);
} finally {
  await db.destroy();
}
