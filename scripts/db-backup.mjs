// `npm run db:backup [-- --out FILE]`: a consistent dump of the database (DATABASE_URL, else the local cluster) in
// pg_dump's custom format, compressed; restore it with `npm run db:restore -- FILE`. Prints what it wrote as JSON.
import { mkdirSync, statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { ROOT } from './lib/run.mjs';
import { databaseUrl, pgTool } from './lib/pg-tools.mjs';

const { values } = parseArgs({ options: { out: { type: 'string' } } });
const url = databaseUrl();
const stamp = new Date().toISOString().replace(/[-:]/g, '').replace(/\..*$/, 'Z');
const out = resolve(values.out ?? join(ROOT, '.data', 'backups', `epicycle-${stamp}.dump`));
mkdirSync(dirname(out), { recursive: true });
// One snapshot for the whole dump (pg_dump runs in a repeatable-read transaction); owners and grants are left
// out so that the dump restores under any role.
pgTool('pg_dump', ['--format=custom', '--compress=6', '--no-owner', '--no-privileges', `--file=${out}`], url);
const database = new URL(url).pathname.slice(1);
console.log(JSON.stringify({ file: out, database, bytes: statSync(out).size, at: new Date().toISOString() }));
