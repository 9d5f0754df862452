// Child-process helpers for the start and test scripts (plain Node, no dependencies).
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { join, resolve, dirname } from 'node:path';
import { fileURLToPath } from 'node:url';
import { log } from './log.mjs';

export const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');
const BIN = join(ROOT, 'node_modules', '.bin');

/** Runs a command to completion with inherited output; resolves to its exit code. */
export function run(cmd, args, { env = process.env, cwd = ROOT } = {}) {
  return new Promise((resolvePromise) => {
    const child = spawn(cmd, args, { cwd, env, stdio: 'inherit' });
    child.on('exit', (code, signal) => resolvePromise(code ?? (signal ? 1 : 0)));
    child.on('error', (e) => {
      log('run', `${cmd}: ${e.message}`);
      resolvePromise(1);
    });
  });
}

/** Runs a command and throws when it fails. */
export async function runOrThrow(cmd, args, opts) {
  const code = await run(cmd, args, opts);
  if (code !== 0) throw new Error(`${[cmd, ...args].join(' ')} exited with ${code}`);
}

/** A local binary from node_modules/.bin. */
export const bin = (name) => join(BIN, name);

/** Runs a TypeScript script under tsx with the react-server condition (so `server-only` imports resolve). */
export function runTs(script, env) {
  return runOrThrow(process.execPath, ['--conditions=react-server', '--import', 'tsx', join(ROOT, script)], { env });
}

/**
 * The production web server's command line after `node` (server/serve.ts: Next plus the answer fast path), used by
 * `npm start`, the e2e tier and `npm run load -- --kill-web`.
 */
export const SERVE_ARGS = ['--conditions=react-server', '--import', 'tsx', join(ROOT, 'server', 'serve.ts')];

/**
 * Whether node_modules holds what the lockfile asks for: npm's record of the installed tree (its hidden lockfile)
 * has every required package at the locked version. Compared by content, not by file times, so a second checkout
 * sharing this node_modules (a git worktree) does not reinstall it.
 */
function installedMatchesLock(lock, marker) {
  try {
    const wanted = JSON.parse(readFileSync(lock, 'utf8')).packages ?? {};
    const have = JSON.parse(readFileSync(marker, 'utf8')).packages ?? {};
    for (const [path, entry] of Object.entries(wanted)) {
      if (path === '' || entry.link) continue;
      const installed = have[path];
      if (!installed) {
        if (entry.optional || entry.devOptional || entry.peer) continue;
        return false;
      }
      if (installed.version !== entry.version) return false;
    }
    return true;
  } catch {
    return false;
  }
}

export function ensureDependencies() {
  const marker = join(ROOT, 'node_modules', '.package-lock.json');
  const lock = join(ROOT, 'package-lock.json');
  if (existsSync(marker) && existsSync(lock) && installedMatchesLock(lock, marker)) return;
  log('deps', 'installing dependencies with npm ci (no browser download)…');
  const r = spawnSync('npm', ['ci', '--no-audit', '--no-fund'], {
    cwd: ROOT,
    stdio: 'inherit',
    env: { ...process.env, PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: '1' },
  });
  if (r.status !== 0) throw new Error('npm ci failed');
}

/** Starts a long-running child whose output is prefixed; returns the child. */
export function startService(name, cmd, args, env) {
  const child = spawn(cmd, args, { cwd: ROOT, env, stdio: ['ignore', 'pipe', 'pipe'] });
  const prefix = (stream, out) =>
    stream.on('data', (buf) => {
      for (const line of buf.toString().split('\n')) if (line.trim()) out.write(`[${name}] ${line}\n`);
    });
  prefix(child.stdout, process.stdout);
  prefix(child.stderr, process.stderr);
  return child;
}
