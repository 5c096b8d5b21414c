import type { APIRoute } from 'astro';
import { z } from 'zod';
import { authorize, can, teamsOf } from '../../../lib/server/access';
import { apiError, readJson, readQuery } from '../../../lib/server/http';
import { uploadCreateSchema } from '../../../lib/schemas/upload';
import { createUpload, listUploads } from '../../../lib/server/uploads';

// ten years of hourly values as JSON is about 1.5 MB; refuse bodies far past that before parsing
const MAX_BODY_BYTES = 8 * 1024 * 1024;

async function teamFor(locals: App.Locals, teamId: number | undefined): Promise<number | null> {
  if (teamId !== undefined) return teamId;
  if (!locals.user) return null;
  return (await teamsOf(locals.user.id))[0]?.teamId ?? null;
}

const listQuery = z.object({ teamId: z.coerce.number({ error: 'must be a team id' }).int({ error: 'must be a team id' }).positive({ error: 'must be a team id' }).optional() });

/** the team's uploads without their series (members); ?teamId=, else the member's first team */
export const GET: APIRoute = async ({ locals, url }) => {
  const q = readQuery(url, listQuery);
  if ('response' in q) return q.response;
  if (!locals.user) return apiError(401, 'unauthenticated', 'Sign in first.');
  const auth = await authorize(locals, await teamFor(locals, q.data.teamId));
  if ('response' in auth) return auth.response;
  return Response.json({ uploads: await listUploads(auth.member.teamId) }, { headers: { 'cache-control': 'no-store' } });
};

/** keeps an hourly outdoor series for the team (engineers and admins) */
export const POST: APIRoute = async ({ locals, request }) => {
  if (!locals.user) return apiError(401, 'unauthenticated', 'Sign in first.');
  const length = Number(request.headers.get('content-length') ?? 0);
  if (length > MAX_BODY_BYTES) return apiError(413, 'too_large', `The upload is larger than ${MAX_BODY_BYTES / 1024 / 1024} MB; ten years of hourly values fit well within it.`);
  const body = await readJson(request, uploadCreateSchema);
  if ('response' in body) return body.response;
  const auth = await authorize(locals, await teamFor(locals, body.data.teamId), can.edit);
  if ('response' in auth) return auth.response;
  const upload = await createUpload(auth.member.teamId, auth.member.userId, body.data);
  return Response.json({ upload }, { status: 201 });
};
