// Runs one test tier against the (reused) test cluster: `node scripts/with-test-db.mjs <command> [args…]`.
// For e2e (playwright) the e2e database is migrated and seeded first.
import { ensureChromium } from './lib/chromium.mjs';
import { bin, ensureDependencies, run, runTs } from './lib/run.mjs';
import { prepareTestEnvironment } from './lib/test-env.mjs';

const [cmd, ...args] = process.argv.slice(2);
ensureDependencies();
const { env, e2eEnv, stop } = await prepareTestEnvironment({ fresh: false });
let code = 1;
try {
  if (cmd === 'playwright') {
    ensureChromium();
    await runTs('scripts/db-migrate.ts', e2eEnv);
    await runTs('scripts/db-seed.ts', e2eEnv);
  }
  code = await run(bin(cmd), args, { env });
} finally {
  stop();
}
process.exit(code);
