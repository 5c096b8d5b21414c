import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import mysql from 'mysql2/promise';
import * as schema from './schema';

export type Database = MySql2Database<typeof schema>;

/** a drizzle client over its own pool; the app makes one (index.ts), scripts and tests make theirs */
export function createDb(url: string, connectionLimit = 10): { db: Database; pool: mysql.Pool } {
  const pool = mysql.createPool({
    uri: url,
    connectionLimit,
    // dates are stored as UTC wall time
    timezone: 'Z',
    dateStrings: false,
    supportBigNumbers: true,
    connectTimeout: 3000,
  });
  const db = drizzle(pool, { schema, mode: 'default' });
  return { db, pool };
}
