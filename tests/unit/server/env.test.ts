import { describe, expect, it } from 'vitest';
import { parseEnv } from '@/lib/server/env';

describe('configuration', () => {
  it('gives every variable a loopback default locally', () => {
    const env = parseEnv({ NODE_ENV: 'development' });
    expect(env.EPICYCLE_ENV).toBe('local');
    expect(new URL(env.DATABASE_URL).hostname).toBe('127.0.0.1');
    expect(new URL(env.APP_URL).hostname).toBe('127.0.0.1');
  });

  it('in production fails naming every missing variable', () => {
    expect(() => parseEnv({ NODE_ENV: 'production' })).toThrow(/DATABASE_URL, APP_URL, AUTH_SECRET, SMTP_URL/);
    expect(() => parseEnv({ EPICYCLE_ENV: 'production', DATABASE_URL: 'postgres://u@db/x', APP_URL: 'https://e.example' })).toThrow(/AUTH_SECRET/);
  });

  it('rejects malformed values with the variable named', () => {
    expect(() => parseEnv({ DATABASE_URL: 'mysql://x' })).toThrow(/DATABASE_URL/);
    expect(() => parseEnv({ AUTH_SECRET: 'short' })).toThrow(/AUTH_SECRET/);
  });

  it('accepts a complete production configuration', () => {
    const env = parseEnv({
      EPICYCLE_ENV: 'production',
      DATABASE_URL: 'postgres://u:p@db.example/epicycle',
      APP_URL: 'https://epicycle.example',
      AUTH_SECRET: 'x'.repeat(40),
      SMTP_URL: 'smtps://mail.example:465',
      MAIL_CATCHER_URL: 'http://127.0.0.1:2580',
      S3_ACCESS_KEY_ID: 'AKIAEXAMPLE',
      S3_SECRET_ACCESS_KEY: 'secret-example',
    });
    expect(env.EPICYCLE_ENV).toBe('production');
    // No endpoint in production means AWS S3 itself; the local fake's address is never assumed.
    expect(env.S3_ENDPOINT).toBeUndefined();
    // The dev mailbox is never on in production.
    expect(env.MAIL_CATCHER_URL).toBeUndefined();
  });
});
