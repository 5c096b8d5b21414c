import type { APIRoute } from 'astro';
import { z } from 'zod';
import { apiError, readJson, readQuery } from '../../../lib/server/http';
import { authorize, can } from '../../../lib/server/access';
import { createMaterial, listMaterials, nameTaken, teamFor } from '../../../lib/server/materials';
import { materialFieldsSchema } from '../../../lib/materials/schema';

const noStore = { 'cache-control': 'no-store' };

const listQuery = z.object({
  teamId: z.coerce.number({ error: 'must be a team id' }).int({ error: 'must be a team id' }).positive({ error: 'must be a team id' }).optional(),
  scope: z.enum(['all', 'team', 'builtin'], { error: 'must be all, team or builtin' }).default('all'),
});

/** the built-in library and the team's own materials */
export const GET: APIRoute = async ({ locals, url }) => {
  if (!locals.user) return apiError(401, 'unauthenticated', 'Sign in first.');
  const q = readQuery(url, listQuery);
  if ('response' in q) return q.response;
  const auth = await authorize(locals, await teamFor(locals, q.data.teamId));
  if ('response' in auth) return auth.response;
  const items = await listMaterials(auth.member.teamId, q.data.scope);
  return Response.json(
    { materials: items, team: { id: auth.member.teamId, name: auth.member.teamName, role: auth.member.role, canEdit: can.edit(auth.member.role) } },
    { headers: noStore },
  );
};

const createBody = materialFieldsSchema.extend({
  teamId: z.number({ error: 'must be a team id' }).int({ error: 'must be a team id' }).positive({ error: 'must be a team id' }),
});

/** a new material in the team's library (engineers and admins) */
export const POST: APIRoute = async ({ locals, request }) => {
  if (!locals.user) return apiError(401, 'unauthenticated', 'Sign in first.');
  const body = await readJson(request, createBody);
  if ('response' in body) return body.response;
  const { teamId, ...fields } = body.data;
  const auth = await authorize(locals, teamId, can.edit);
  if ('response' in auth) return auth.response;
  if (await nameTaken(teamId, fields.name)) {
    return apiError(422, 'invalid', 'Some fields are not valid.', { name: `a material called “${fields.name}” is already in the team library` });
  }
  const material = await createMaterial(teamId, locals.user.id, fields);
  return Response.json({ material }, { status: 201, headers: noStore });
};
