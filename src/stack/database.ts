import { migrate } from 'drizzle-orm/mysql2/migrator';
import path from 'node:path';
import { createDb, type Database } from '../lib/server/db/client';
import { seedDemo } from '../lib/server/seed';
import { log } from './util';

/** apply drizzle's migrations from drizzle/ and seed the demo; returns a small pool for the stack's own use */
export async function prepareDatabase(url: string, root: string): Promise<{ db: Database; close(): Promise<void> }> {
  const { db, pool } = createDb(url, 4);
  await migrate(db, { migrationsFolder: path.join(root, 'drizzle') });
  log('migrations applied');
  await seedDemo(db);
  log('demo team ready');
  return { db, close: () => pool.end() };
}
