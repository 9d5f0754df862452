// The local S3-compatible object store (s3rver from npm) on loopback, for `npm start` and `npm test`.
import { mkdirSync, rmSync } from 'node:fs';
import { log } from './log.mjs';

export const S3_BUCKET = 'epicycle-packs';

/** Starts the fake store on 127.0.0.1:`port`, keeping objects under `directory` (wiped first when `fresh`). */
export async function startS3Fake({ port, directory, fresh = false }) {
  if (fresh) rmSync(directory, { recursive: true, force: true });
  mkdirSync(directory, { recursive: true });
  // Imported here, not at the top: the scripts load this file before `npm ci` has installed anything.
  const { default: S3rver } = await import('s3rver');
  const server = new S3rver({ address: '127.0.0.1', port, directory, silent: true, configureBuckets: [{ name: S3_BUCKET }] });
  await server.run();
  const endpoint = `http://127.0.0.1:${port}`;
  log('s3', `object store (s3rver) at ${endpoint}, bucket ${S3_BUCKET}`);
  return {
    endpoint,
    env: { S3_ENDPOINT: endpoint, S3_BUCKET, S3_ACCESS_KEY_ID: 'S3RVER', S3_SECRET_ACCESS_KEY: 'S3RVER', S3_REGION: 'us-east-1' },
    stop: () => server.close(),
  };
}
