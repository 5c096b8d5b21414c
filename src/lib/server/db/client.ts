import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import mysql from 'mysql2/promise';
import * as schema from './schema';

export type Database = MySql2Database<typeof schema>;

/** how a pool behaves when it is busy: it answers "busy" fast rather than queue without end */
export interface PoolLimits {
  connectionLimit?: number;
  /** requests that may wait for a connection at once; one more is refused at once */
  queueLimit?: number;
  /** how long a request waits for a connection before it gives up (ms) */
  acquireTimeoutMs?: number;
}

/** the error a busy or unreachable pool raises; the app answers 503 for it */
export class PoolBusyError extends Error {
  code = 'POOL_BUSY';
}

type CoreCallback = (err: Error | null, conn?: { release(): void }) => void;

/**
 * mysql2 has a queue limit but no acquire timeout: a request waiting for a connection waits
 * for ever. Wrap the core pool's getConnection (which query, execute and transactions all go
 * through) so that a waiter gives up after acquireTimeoutMs; a connection handed to a waiter
 * that gave up goes straight back to the pool.
 */
function addAcquireTimeout(pool: mysql.Pool, timeoutMs: number): void {
  const core = (pool as unknown as { pool: { getConnection(cb: CoreCallback): void } }).pool;
  const original = core.getConnection.bind(core);
  core.getConnection = (cb: CoreCallback) => {
    let settled = false;
    const timer = setTimeout(() => {
      if (settled) return;
      settled = true;
      cb(new PoolBusyError(`no database connection became free within ${timeoutMs} ms`));
    }, timeoutMs);
    original((err, conn) => {
      clearTimeout(timer);
      if (settled) {
        conn?.release();
        return;
      }
      settled = true;
      if (err && /Queue limit reached/.test(err.message)) cb(new PoolBusyError('too many requests are waiting for a database connection'));
      else cb(err, conn);
    });
  };
}

/** a drizzle client over its own pool; the app makes one (index.ts), scripts and tests make theirs */
export function createDb(url: string, limitsOrCount: number | PoolLimits = 10): { db: Database; pool: mysql.Pool } {
  const limits: PoolLimits = typeof limitsOrCount === 'number' ? { connectionLimit: limitsOrCount } : limitsOrCount;
  const pool = mysql.createPool({
    uri: url,
    connectionLimit: limits.connectionLimit ?? 10,
    queueLimit: limits.queueLimit ?? 0,
    // dates are stored as UTC wall time
    timezone: 'Z',
    dateStrings: false,
    supportBigNumbers: true,
    connectTimeout: 3000,
  });
  if (limits.acquireTimeoutMs) addAcquireTimeout(pool, limits.acquireTimeoutMs);
  const db = drizzle(pool, { schema, mode: 'default' });
  return { db, pool };
}
