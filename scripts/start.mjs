// `npm start` (and `npm run dev` with --dev): installs what is missing, starts PostgreSQL on loopback, migrates,
// seeds the demo lab, and serves the app. Ctrl-C stops everything this script started.
import { log } from './lib/log.mjs';
import { join } from 'node:path';
import { startMailCatcher } from './lib/mail.mjs';
import { startS3Fake } from './lib/s3.mjs';
import { ensurePostgres } from './lib/postgres.mjs';
import { ROOT, SERVE_ARGS, bin, ensureDependencies, runOrThrow, runTs, startService } from './lib/run.mjs';

import demo from '../db/demo-users.json' with { type: 'json' };

const isDev = process.argv.includes('--dev');
// `--no-build` serves the build already in .next (e.g. a second web server beside the first, or a checkout whose
// node_modules is a symlink, built by hand with `next build --webpack`).
const skipBuild = process.argv.includes('--no-build');
// `--no-worker` starts no pack worker (e.g. for `npm run load -- --kill-worker`, which runs its own).
const noWorker = process.argv.includes('--no-worker');
const host = process.env.HOST ?? '127.0.0.1';
const port = Number(process.env.PORT ?? 3000);
const pgPort = Number(process.env.EPICYCLE_PG_PORT ?? 54329);

const cleanups = [];
let stopping = false;
async function shutdown(code) {
  if (stopping) return;
  stopping = true;
  log('start', 'stopping…');
  for (const fn of cleanups.reverse()) {
    try {
      await fn();
    } catch (e) {
      log('start', `cleanup failed: ${e.message}`);
    }
  }
  process.exit(code);
}
process.on('SIGINT', () => shutdown(0));
process.on('SIGTERM', () => shutdown(0));

try {
  ensureDependencies();

  const env = { ...process.env, EPICYCLE_ENV: process.env.EPICYCLE_ENV ?? 'local', NEXT_TELEMETRY_DISABLED: '1' };
  if (!process.env.DATABASE_URL) {
    const pg = await ensurePostgres({ name: 'dev', port: pgPort, database: 'epicycle' });
    cleanups.push(() => pg.stop());
    env.DATABASE_URL = pg.url;
  }
  // Every URL the app hands out comes from the host and port actually served.
  const appUrl = process.env.APP_URL ?? `http://${host === '0.0.0.0' ? '127.0.0.1' : host}:${port}`;
  env.APP_URL = appUrl;
  env.NEXTAUTH_URL = appUrl;
  if (!process.env.SMTP_URL) {
    const mail = await startMailCatcher({ smtpPort: Number(process.env.EPICYCLE_SMTP_PORT ?? 2525), httpPort: Number(process.env.EPICYCLE_MAIL_HTTP_PORT ?? 2580) });
    cleanups.push(() => mail.stop());
    env.SMTP_URL = mail.smtpUrl;
    env.MAIL_CATCHER_URL = mail.httpUrl;
  }
  if (!process.env.S3_ENDPOINT) {
    const store = await startS3Fake({ port: Number(process.env.EPICYCLE_S3_PORT ?? 4569), directory: join(ROOT, '.data', 's3-dev') });
    cleanups.push(() => store.stop());
    Object.assign(env, store.env);
  }

  await runTs('scripts/db-migrate.ts', env);
  await runTs('scripts/db-seed.ts', env);

  if (!isDev && !skipBuild) {
    log('start', 'building the app (next build)…');
    await runOrThrow(bin('next'), ['build'], { env: { ...env, NODE_ENV: 'production' } });
  }
  // Production: Next behind server/serve.ts, which serves the participants' answers itself (the fast path) and hands
  // every other request to Next, on the one origin. Dev mode keeps plain `next dev` (the route file answers there).
  const webEnv = { ...env, NODE_ENV: isDev ? 'development' : 'production' };
  const web = isDev
    ? startService('web', bin('next'), ['dev', '-H', host, '-p', String(port)], webEnv)
    : startService('web', process.execPath, [...SERVE_ARGS, '--hostname', host, '--port', String(port)], webEnv);
  cleanups.push(() => web.kill('SIGTERM'));
  web.on('exit', (code) => {
    if (!stopping) {
      log('start', `web server exited (${code}); stopping`);
      shutdown(code ?? 1);
    }
  });

  // One pack worker beside the web server; more can run anywhere with the same database and object store.
  if (!noWorker) {
    const worker = startService('worker', process.execPath, ['--conditions=react-server', '--import', 'tsx', 'scripts/worker.ts'], env);
    cleanups.push(() => worker.kill('SIGTERM'));
    worker.on('exit', (code) => {
      if (!stopping) log('start', `pack worker exited (${code}); packs wait until a worker runs (npm run worker)`);
    });
  }

  log('start', '');
  log('start', `Epicycle is starting at ${appUrl}`);
  log('start', `Health check:        ${appUrl}/api/health`);
  if (env.MAIL_CATCHER_URL) log('start', `Dev mailbox:         ${appUrl}/dev/mailbox`);
  log('start', `Demo sign-ins (password for all: ${demo.password}):`);
  for (const u of demo.users) log('start', `  ${u.role.padEnd(13)} ${u.email}`);
  log('start', 'Press Ctrl-C to stop everything started here.');
} catch (error) {
  console.error(`[start] ${error instanceof Error ? error.message : error}`);
  await shutdown(1);
}
