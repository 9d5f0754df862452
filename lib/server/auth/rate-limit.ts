import 'server-only';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { AppError } from '@/lib/errors';
import { getPool } from '../db';
import { getEnv } from '../env';

/** Sign-in attempts are limited per e-mail and per IP, counted in PostgreSQL so every server shares them. */
interface Limiters {
  email: RateLimiterPostgres;
  ip: RateLimiterPostgres;
}

const holder = globalThis as unknown as { __epicycleLimiters?: Limiters };

function limiters(): Limiters {
  if (!holder.__epicycleLimiters) {
    const env = getEnv();
    const common = {
      storeClient: getPool(),
      tableName: 'rate_limits',
      tableCreated: true,
      clearExpiredByTimeout: false,
      duration: env.SIGNIN_LIMIT_WINDOW_SECONDS,
    };
    holder.__epicycleLimiters = {
      email: new RateLimiterPostgres({ ...common, keyPrefix: 'signin-email', points: env.SIGNIN_LIMIT_PER_EMAIL }),
      ip: new RateLimiterPostgres({ ...common, keyPrefix: 'signin-ip', points: env.SIGNIN_LIMIT_PER_IP }),
    };
  }
  return holder.__epicycleLimiters;
}

/** Counts one sign-in attempt; throws `rate_limited:sign-in` (429, Retry-After) once either limit is spent. */
export async function consumeSignInAttempt(email: string, ip: string): Promise<void> {
  const { email: byEmail, ip: byIp } = limiters();
  try {
    await Promise.all([byEmail.consume(email.toLowerCase()), byIp.consume(ip)]);
  } catch (error) {
    if (error instanceof RateLimiterRes) {
      const seconds = Math.max(1, Math.ceil(error.msBeforeNext / 1000));
      throw new AppError('rate_limited:sign-in', `Too many sign-in attempts. Try again in ${Math.ceil(seconds / 60)} minute(s).`, {
        headers: { 'retry-after': String(seconds) },
      });
    }
    throw error;
  }
}

/** A successful sign-in clears the per-e-mail count (the per-IP count stays). */
export async function clearSignInAttempts(email: string): Promise<void> {
  await limiters().email.delete(email.toLowerCase());
}
