import type { APIRoute } from 'astro';
import { eq } from 'drizzle-orm';
import { authorize, can } from '../../../lib/server/access';
import { apiError, readQuery } from '../../../lib/server/http';
import { listQuery, teamIdQuery } from '../../../lib/schemas/api';
import { listAudit } from '../../../lib/server/services/auditLog';
import { db } from '../../../lib/server/db';
import { memberships, users } from '../../../lib/server/db/schema';
import { json } from '../../../lib/server/services/respond';

const query = listQuery(['createdAt', 'action', 'actorName', 'target'], '-createdAt').extend(teamIdQuery.shape);

/** the team's audit log (admins): ?teamId=&page=&pageSize=&sort=&q= */
export const GET: APIRoute = async ({ locals, url }) => {
  if (!locals.user) return apiError(401, 'unauthenticated', 'Sign in first.');
  const q = readQuery(url, query);
  if ('response' in q) return q.response;
  const auth = await authorize(locals, q.data.teamId, can.administer);
  if ('response' in auth) return auth.response;
  const emails = await db.select({ email: users.email }).from(memberships).innerJoin(users, eq(users.id, memberships.userId)).where(eq(memberships.teamId, q.data.teamId));
  return json(await listAudit(q.data.teamId, emails.map((e) => e.email), q.data));
};
