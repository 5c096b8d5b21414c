// what an error thrown inside a request means for its answer, and the short line the log gets
import { randomBytes } from 'node:crypto';

/** error codes that mean the database cannot be reached or is too busy: the request may be retried */
const UNAVAILABLE_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'ENOTFOUND',
  'EHOSTUNREACH',
  'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_SEQUENCE_TIMEOUT',
  'PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR',
  'POOL_BUSY',
  'ER_CON_COUNT_ERROR',
  'ER_SERVER_SHUTDOWN',
  'ER_LOCK_WAIT_TIMEOUT',
  'ER_LOCK_DEADLOCK',
  'ER_QUERY_INTERRUPTED',
]);

/** the error and its causes (drizzle wraps the driver's error as `cause`) */
function* chain(err: unknown): Generator<{ code?: unknown; message?: unknown; fatal?: unknown }> {
  let e: unknown = err;
  for (let i = 0; i < 5 && e && typeof e === 'object'; i++) {
    yield e as { code?: unknown; message?: unknown };
    e = (e as { cause?: unknown }).cause;
  }
}

export function isDatabaseUnavailable(err: unknown): boolean {
  for (const e of chain(err)) {
    if (typeof e.code === 'string' && UNAVAILABLE_CODES.has(e.code)) return true;
    if (e.fatal === true) return true;
    if (typeof e.message === 'string' && /Pool is closed|connect ETIMEDOUT|Connection lost|Can't add new command when connection is in closed state/i.test(e.message)) return true;
  }
  return false;
}

/**
 * One short line about an error: its driver code or the first line of its message, cut
 * short. Never the failed statement's parameters (a failed insert of a 12 MB body would
 * otherwise write 12 MB to the log).
 */
export function shortReason(err: unknown): string {
  for (const e of chain(err)) if (typeof e.code === 'string' && e.code) return e.code;
  const first = [...chain(err)].pop();
  const message = typeof first?.message === 'string' ? first.message : String(err);
  return message.split('\n')[0].slice(0, 120);
}

/** a short id to find the log line of an error the person saw */
export const errorId = () => randomBytes(4).toString('hex');
