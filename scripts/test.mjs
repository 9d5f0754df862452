// `npm test`: the whole suite on a throwaway PostgreSQL cluster, in order: typecheck, lint, unit, integration,
// build, e2e. Stops at the first failing tier and exits non-zero.
import { log } from './lib/log.mjs';
import { ensureChromium } from './lib/chromium.mjs';
import { bin, ensureDependencies, run, runTs } from './lib/run.mjs';
import { prepareTestEnvironment } from './lib/test-env.mjs';

const started = Date.now();
ensureDependencies();
ensureChromium();
const { env, e2eEnv, stop } = await prepareTestEnvironment({ fresh: true });

const tiers = [
  ['typecheck', () => run(bin('tsc'), ['--noEmit', '-p', 'tsconfig.json'], { env })],
  ['lint', () => run(bin('eslint'), ['--max-warnings=0', '.'], { env })],
  ['unit', () => run(bin('vitest'), ['run', '--project', 'unit'], { env })],
  ['integration', () => run(bin('vitest'), ['run', '--project', 'integration'], { env })],
  ['build', () => run(bin('next'), ['build'], { env: { ...env, NODE_ENV: 'production' } })],
  [
    'e2e',
    async () => {
      await runTs('scripts/db-migrate.ts', e2eEnv);
      await runTs('scripts/db-seed.ts', e2eEnv);
      return run(bin('playwright'), ['test'], { env });
    },
  ],
];

let failed;
const timings = [];
try {
  for (const [name, fn] of tiers) {
    const t0 = Date.now();
    log('test', `── ${name} ──`);
    let code;
    try {
      code = await fn();
    } catch (e) {
      log('test', e.message);
      code = 1;
    }
    timings.push(`${name} ${((Date.now() - t0) / 1000).toFixed(1)}s`);
    if (code !== 0) {
      failed = name;
      break;
    }
  }
} finally {
  stop();
}
log('test', timings.join(' · '));
log('test', `total ${((Date.now() - started) / 60000).toFixed(1)} min`);
if (failed) {
  log('test', `FAILED at ${failed}`);
  process.exit(1);
}
log('test', 'all tiers passed');
