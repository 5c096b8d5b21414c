import type { APIRoute } from 'astro';
import { authorize, can, teamOfRevision } from '../../../../lib/server/access';
import { apiError, readJson } from '../../../../lib/server/http';
import { runBody } from '../../../../lib/schemas/api';
import { addRun, checkPacked, runsOf, type RunSummary } from '../../../../lib/server/services/runs';
import { idOf, json } from '../../../../lib/server/services/respond';

/** a packed run is at most 5 MB (7 MB as base64); anything above this is refused rather than stored */
const MAX_BODY_BYTES = 8 * 1024 * 1024;

export const GET: APIRoute = async ({ locals, params }) => {
  const id = idOf(params.id);
  const auth = await authorize(locals, id ? await teamOfRevision(id) : null);
  if ('response' in auth) return auth.response;
  return json({ items: await runsOf(id!) });
};

/** keep a run: its exposure, summary figures and (optionally) the run packed */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const id = idOf(params.id);
  const auth = await authorize(locals, id ? await teamOfRevision(id) : null, can.edit);
  if ('response' in auth) return auth.response;
  const length = Number(request.headers.get('content-length') ?? 0);
  if (length > MAX_BODY_BYTES) return apiError(413, 'too_large', 'The run is larger than 8 MB; keep it without its series.');
  const body = await readJson(request, runBody);
  if ('response' in body) return body.response;
  const packed = body.data.packed ? Buffer.from(body.data.packed, 'base64') : null;
  const problem = packed ? checkPacked(packed) : null;
  if (problem) return apiError(422, 'invalid', problem, { packed: problem });
  const made = await addRun(id!, auth.member.userId, { exposure: body.data.exposure, summary: body.data.summary as RunSummary, packed });
  return json({ run: made }, 201);
};
