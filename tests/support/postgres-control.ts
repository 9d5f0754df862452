import { spawnSync } from 'node:child_process';
import { join } from 'node:path';

/**
 * Stops and starts the test cluster, as an operator's restart would (the scripts' cluster, found through the
 * environment that scripts/lib/test-env.mjs sets). As root the server runs as `postgres`, so pg_ctl does too.
 */
function pgCtl(args: string[]): void {
  const { TEST_PG_BIN: bin, TEST_PG_DATA: data } = process.env;
  if (!bin || !data) throw new Error('TEST_PG_BIN / TEST_PG_DATA are not set: run through `npm test` or `npm run test:integration`.');
  const isRoot = process.getuid?.() === 0;
  const ctl = join(bin, 'pg_ctl');
  const r = isRoot ? spawnSync('runuser', ['-u', 'postgres', '--', ctl, '-D', data, ...args], { encoding: 'utf8' }) : spawnSync(ctl, ['-D', data, ...args], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`pg_ctl ${args.join(' ')} failed: ${r.stdout}${r.stderr}`);
}

/** Stops the test cluster at once (open connections are cut, as in a crash or an operator's fast shutdown). */
export function stopTestCluster(): void {
  pgCtl(['stop', '-m', 'fast', '-w', '-t', '60']);
}

/** Starts the test cluster again with the options it was started with, and waits until it takes connections. */
export function startTestCluster(): void {
  pgCtl(['start', '-w', '-t', '60', '-l', process.env.TEST_PG_LOG!, '-o', process.env.TEST_PG_OPTIONS!]);
}
