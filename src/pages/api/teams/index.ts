import type { APIRoute } from 'astro';
import { apiError, readJson } from '../../../lib/server/http';
import { teamBody } from '../../../lib/schemas/api';
import { teamsOf } from '../../../lib/server/access';
import { createTeam } from '../../../lib/server/services/teams';
import { clientIp, json } from '../../../lib/server/services/respond';

/** the caller's teams */
export const GET: APIRoute = async ({ locals }) => {
  if (!locals.user) return apiError(401, 'unauthenticated', 'Sign in first.');
  const teams = await teamsOf(locals.user.id);
  return json({ items: teams.map((t) => ({ id: t.teamId, name: t.teamName, role: t.role })) });
};

/** a new team with the caller as its admin */
export const POST: APIRoute = async (ctx) => {
  if (!ctx.locals.user) return apiError(401, 'unauthenticated', 'Sign in first.');
  const body = await readJson(ctx.request, teamBody);
  if ('response' in body) return body.response;
  const team = await createTeam(ctx.locals.user.id, body.data.name, clientIp(ctx));
  return json({ team: { ...team, role: 'admin' } }, 201);
};
