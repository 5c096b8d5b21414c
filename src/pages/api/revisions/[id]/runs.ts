import type { APIRoute } from 'astro';
import { authorize, can, teamOfRevision } from '../../../../lib/server/access';
import { apiError, readJson } from '../../../../lib/server/http';
import { runBody } from '../../../../lib/schemas/api';
import { addRun, runsOf } from '../../../../lib/server/services/revisions';
import { idOf, json } from '../../../../lib/server/services/respond';

/** the series may be large; anything above this is refused rather than stored */
const MAX_BODY_BYTES = 8 * 1024 * 1024;

export const GET: APIRoute = async ({ locals, params }) => {
  const id = idOf(params.id);
  const auth = await authorize(locals, id ? await teamOfRevision(id) : null);
  if ('response' in auth) return auth.response;
  return json({ items: await runsOf(id!) });
};

/** keep a run: its exposure, summary figures and (optionally) its series */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const id = idOf(params.id);
  const auth = await authorize(locals, id ? await teamOfRevision(id) : null, can.edit);
  if ('response' in auth) return auth.response;
  const length = Number(request.headers.get('content-length') ?? 0);
  if (length > MAX_BODY_BYTES) return apiError(413, 'too_large', 'The run is larger than 8 MB; store it without its series.');
  const body = await readJson(request, runBody);
  if ('response' in body) return body.response;
  const made = await addRun(id!, auth.member.userId, body.data as { exposure: unknown; summary: Record<string, number | string | null>; series?: unknown });
  return json({ run: made }, 201);
};
