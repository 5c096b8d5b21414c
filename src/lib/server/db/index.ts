import { DATABASE_URL } from 'astro:env/server';
import { createDb } from './client';

// the app's one pool; created on first import of this module. A request never holds two
// connections at once (a transaction passes its own to whatever it calls), so the pool cannot
// deadlock on itself; when it is busy, at most 50 requests wait, none longer than 5 s, and the
// rest are answered 503 at once (middleware.ts).
const created = createDb(DATABASE_URL, { connectionLimit: 10, queueLimit: 50, acquireTimeoutMs: 5000 });

// a row lock held too long is an error after 5 s, not a stall of every request behind it
created.pool.pool.on('connection', (conn) => {
  conn.query('SET SESSION innodb_lock_wait_timeout = 5');
});

export const db = created.db;
export const pool = created.pool;
export * as tables from './schema';
