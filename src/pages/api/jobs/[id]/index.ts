import type { APIRoute } from 'astro';
import { authorize, can, teamOfJob } from '../../../../lib/server/access';
import { readJson } from '../../../../lib/server/http';
import { jobPatchBody } from '../../../../lib/schemas/api';
import { getJob, updateJob } from '../../../../lib/server/services/jobs';
import { idOf, json } from '../../../../lib/server/services/respond';

export const GET: APIRoute = async ({ locals, params }) => {
  const id = idOf(params.id);
  const auth = await authorize(locals, id ? await teamOfJob(id) : null);
  if ('response' in auth) return auth.response;
  return json({ job: await getJob(id!), role: auth.member.role });
};

export const PATCH: APIRoute = async ({ locals, params, request }) => {
  const id = idOf(params.id);
  const auth = await authorize(locals, id ? await teamOfJob(id) : null, can.edit);
  if ('response' in auth) return auth.response;
  const body = await readJson(request, jobPatchBody);
  if ('response' in body) return body.response;
  await updateJob(id!, body.data);
  return json({ job: await getJob(id!) });
};
