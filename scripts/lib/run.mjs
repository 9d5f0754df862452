// Child-process helpers for the start and test scripts (plain Node, no dependencies).
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';
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

/** Installs dependencies with `npm ci` when node_modules is missing or older than the lockfile. */
export function ensureDependencies() {
  const marker = join(ROOT, 'node_modules', '.package-lock.json');
  const lock = join(ROOT, 'package-lock.json');
  const stale = !existsSync(marker) || (existsSync(lock) && statSync(lock).mtimeMs > statSync(marker).mtimeMs + 1000);
  if (!stale) return;
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
