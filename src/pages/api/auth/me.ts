import type { APIRoute } from 'astro';
import { apiError } from '../../../lib/server/http';
import { teamsOf } from '../../../lib/server/access';
import { json } from '../../../lib/server/services/respond';

export const GET: APIRoute = async ({ locals }) => {
  if (!locals.user) return apiError(401, 'unauthenticated', 'Sign in first.');
  const teams = await teamsOf(locals.user.id);
  return json({ user: locals.user, teams: teams.map((t) => ({ id: t.teamId, name: t.teamName, role: t.role })) });
};
