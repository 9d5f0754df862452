// The throwaway test cluster and the environment every test tier runs with.
import { join } from 'node:path';
import { startMailCatcher } from './mail.mjs';
import { ROOT } from './run.mjs';
import { startS3Fake } from './s3.mjs';
import { ensurePostgres } from './postgres.mjs';

export const TEST_PG_PORT = Number(process.env.EPICYCLE_TEST_PG_PORT ?? 54339);
export const E2E_PORT = Number(process.env.EPICYCLE_E2E_PORT ?? 3100);
export const TEST_S3_PORT = Number(process.env.EPICYCLE_TEST_S3_PORT ?? 4579);
/** The e2e pack worker's health port (Playwright waits on it). */
/** The test mail catcher's SMTP and HTTP ports. */
export const TEST_SMTP_PORT = Number(process.env.EPICYCLE_TEST_SMTP_PORT ?? 2535);
export const TEST_MAIL_HTTP_PORT = Number(process.env.EPICYCLE_TEST_MAIL_HTTP_PORT ?? 2590);
export const E2E_WORKER_HEALTH_PORT = Number(process.env.EPICYCLE_E2E_WORKER_PORT ?? 3199);

/**
 * Starts the test cluster (wiped first when `fresh`) with one database for integration tests and one for e2e.
 * Returns the environment for the tiers and a `stop`.
 */
export async function prepareTestEnvironment({ fresh }) {
  const it = await ensurePostgres({ name: 'test', port: TEST_PG_PORT, database: 'epicycle_it', fresh });
  const e2e = await ensurePostgres({ name: 'test', port: TEST_PG_PORT, database: 'epicycle_e2e' });
  const mail = await startMailCatcher({ smtpPort: TEST_SMTP_PORT, httpPort: TEST_MAIL_HTTP_PORT });
  const store = await startS3Fake({ port: TEST_S3_PORT, directory: join(ROOT, '.data', 's3-test'), fresh });
  const appUrl = `http://127.0.0.1:${E2E_PORT}`;
  const env = {
    ...process.env,
    EPICYCLE_ENV: 'local',
    DATABASE_URL: it.url,
    TEST_DATABASE_URL: it.url,
    TEST_ADMIN_DATABASE_URL: it.adminUrl,
    // For the tests that stop and start the cluster under a running job (tests/support/postgres-control.ts).
    TEST_PG_BIN: it.bin,
    TEST_PG_DATA: it.paths.data,
    TEST_PG_LOG: it.paths.logFile,
    TEST_PG_OPTIONS: it.options,
    E2E_DATABASE_URL: e2e.url,
    E2E_PORT: String(E2E_PORT),
    APP_URL: appUrl,
    NEXTAUTH_URL: appUrl,
    SMTP_URL: mail.smtpUrl,
    MAIL_CATCHER_URL: mail.httpUrl,
    ...store.env,
    E2E_WORKER_HEALTH_PORT: String(E2E_WORKER_HEALTH_PORT),
    // Every test comes from 127.0.0.1, so the per-IP sign-in limit is raised; the per-e-mail one is tested.
    SIGNIN_LIMIT_PER_IP: '10000',
    // Low enough that a test can spend a token's minute; the suites' own calls stay far below it per token.
    API_TOKEN_REQUESTS_PER_MINUTE: '150',
    PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: '1',
    NEXT_TELEMETRY_DISABLED: '1',
  };
  const stop = () => {
    void store.stop();
    mail.stop();
    it.stop();
  };
  return { env, e2eEnv: { ...env, DATABASE_URL: e2e.url }, stop };
}
