/**
 * Request limits, counted in MariaDB (the rate_limits table) by rate-limiter-flexible's MySQL
 * store, so every app instance shares them and a restart forgets nothing. The source address
 * is the one the server trusts (the socket's, or the client a configured proxy names:
 * src/stack/serve.mjs), so a made-up X-Forwarded-For gets no fresh tries.
 *
 * Sign-in failures are counted three ways: per address and source (5 in 15 minutes), per
 * address from anywhere (20 in an hour: guessing spread over many sources), and per source
 * across addresses (30 in 15 minutes: one source trying many accounts). Password-reset,
 * verification and sign-up requests are limited per source and per address or account.
 */
import { RateLimiterMySQL, RateLimiterRes } from 'rate-limiter-flexible';
import { pool } from '../db';

const MIN = 60;
const HOUR = 3600;

/** the database the pool is on (the table lives beside the app's other tables) */
const dbName = (pool.pool as unknown as { config: { connectionConfig: { database: string } } }).config.connectionConfig.database;

function limiter(keyPrefix: string, points: number, duration: number): RateLimiterMySQL {
  return new RateLimiterMySQL({
    storeClient: pool.pool,
    storeType: 'pool',
    dbName,
    tableName: 'rate_limits',
    tableCreated: true,
    keyPrefix,
    points,
    duration,
  });
}

export const LIMITS = {
  signInPair: limiter('signin-pair', 5, 15 * MIN),
  signInAccount: limiter('signin-account', 20, HOUR),
  signInSource: limiter('signin-source', 30, 15 * MIN),
  resetAddress: limiter('reset-address', 3, HOUR),
  resetSource: limiter('reset-source', 20, HOUR),
  resendAccount: limiter('resend-account', 5, HOUR),
  signUpSource: limiter('signup-source', 20, HOUR),
  signUpAddress: limiter('signup-address', 3, HOUR),
};

export const MAX_FAILURES = 5;

const norm = (email: string) => email.trim().toLowerCase();

/** seconds until the key may try again under this limiter, or 0 */
async function waitFor(l: RateLimiterMySQL, key: string): Promise<number> {
  const res = await l.get(key);
  if (!res || res.consumedPoints < l.points) return 0;
  return Math.max(1, Math.ceil(res.msBeforeNext / 1000));
}

/** count one; resolves to the seconds to wait when that went past the limit, else 0 */
async function spend(l: RateLimiterMySQL, key: string): Promise<number> {
  try {
    await l.consume(key);
    return 0;
  } catch (res) {
    if (res instanceof RateLimiterRes) return Math.max(1, Math.ceil(res.msBeforeNext / 1000));
    throw res;
  }
}

/** seconds until this address may try to sign in from this source, or 0 when it may try now */
export async function signInWait(email: string, ip: string): Promise<number> {
  const e = norm(email);
  const waits = await Promise.all([waitFor(LIMITS.signInPair, `${e}|${ip}`), waitFor(LIMITS.signInAccount, e), waitFor(LIMITS.signInSource, ip)]);
  return Math.max(...waits);
}

export async function recordSignInFailure(email: string, ip: string): Promise<void> {
  const e = norm(email);
  await spend(LIMITS.signInPair, `${e}|${ip}`);
  await spend(LIMITS.signInAccount, e);
  await spend(LIMITS.signInSource, ip);
}

/** a right password clears the count of that address from that source */
export async function clearSignInFailures(email: string, ip: string): Promise<void> {
  await LIMITS.signInPair.delete(`${norm(email)}|${ip}`);
}

/** count a request against each (limiter, key); the longest wait when any is past its limit, else 0 */
export async function spendAll(pairs: [RateLimiterMySQL, string][]): Promise<number> {
  let wait = 0;
  for (const [l, key] of pairs) wait = Math.max(wait, await spend(l, key));
  return wait;
}

export const limitKey = { address: norm };

/** "Try again in 3 minutes." */
export function tryAgainIn(seconds: number): string {
  const minutes = Math.ceil(seconds / 60);
  return minutes >= 60 ? `Try again in ${Math.ceil(minutes / 60)} hour${minutes > 60 ? 's' : ''}.` : `Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`;
}
