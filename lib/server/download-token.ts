import 'server-only';
import { createHmac, timingSafeEqual } from 'node:crypto';
import { getEnv } from './env';

/** What a download link grants: one pack of one lab, until `expiresAt` (ms since the epoch). */
export interface DownloadGrant {
  packId: string;
  labId: string;
  expiresAt: number;
}

const key = () => createHmac('sha256', getEnv().AUTH_SECRET).update('epicycle download links v1').digest();
const sign = (payload: string) => createHmac('sha256', key()).update(payload).digest('base64url');

/** A signed, expiring token for the app's download link (which then redirects to a presigned object URL). */
export function signDownload(grant: DownloadGrant): string {
  const payload = Buffer.from(JSON.stringify([grant.packId, grant.labId, grant.expiresAt])).toString('base64url');
  return `${payload}.${sign(payload)}`;
}

export type DownloadCheck = { ok: true; grant: DownloadGrant } | { ok: false; reason: 'invalid' | 'expired' };

export function verifyDownload(token: string, now = Date.now()): DownloadCheck {
  const [payload, mac] = token.split('.');
  if (!payload || !mac) return { ok: false, reason: 'invalid' };
  const expected = Buffer.from(sign(payload));
  const given = Buffer.from(mac);
  if (expected.length !== given.length || !timingSafeEqual(expected, given)) return { ok: false, reason: 'invalid' };
  try {
    const [packId, labId, expiresAt] = JSON.parse(Buffer.from(payload, 'base64url').toString('utf8')) as [string, string, number];
    if (typeof packId !== 'string' || typeof labId !== 'string' || typeof expiresAt !== 'number') return { ok: false, reason: 'invalid' };
    if (expiresAt < now) return { ok: false, reason: 'expired' };
    return { ok: true, grant: { packId, labId, expiresAt } };
  } catch {
    return { ok: false, reason: 'invalid' };
  }
}
