import type { APIRoute } from 'astro';
import { sql } from 'drizzle-orm';
import { db } from '../../lib/server/db';
import pkg from '../../../package.json';

/** liveness and database check for the start script, monitors and tests */
export const GET: APIRoute = async () => {
  let dbOk = false;
  try {
    await db.execute(sql`SELECT 1`);
    dbOk = true;
  } catch {
    dbOk = false;
  }
  return Response.json(
    { status: dbOk ? 'ok' : 'degraded', db: dbOk ? 'ok' : 'down', version: pkg.version },
    { status: dbOk ? 200 : 503, headers: { 'cache-control': 'no-store' } },
  );
};
