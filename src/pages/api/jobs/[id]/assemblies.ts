import type { APIRoute } from 'astro';
import { authorize, can, teamOfJob } from '../../../../lib/server/access';
import { readJson, readQuery } from '../../../../lib/server/http';
import { assemblyBody, listQuery } from '../../../../lib/schemas/api';
import { createAssembly, listAssemblies } from '../../../../lib/server/services/jobs';
import { idOf, json } from '../../../../lib/server/services/respond';

const query = listQuery(['name', 'element', 'updatedAt', 'headNumber', 'headState'], 'name');

export const GET: APIRoute = async ({ locals, params, url }) => {
  const id = idOf(params.id);
  const auth = await authorize(locals, id ? await teamOfJob(id) : null);
  if ('response' in auth) return auth.response;
  const q = readQuery(url, query);
  if ('response' in q) return q.response;
  return json(await listAssemblies(id!, q.data));
};

/** a new assembly; it starts with revision 1, a default build-up for its element */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const id = idOf(params.id);
  const auth = await authorize(locals, id ? await teamOfJob(id) : null, can.edit);
  if ('response' in auth) return auth.response;
  const body = await readJson(request, assemblyBody);
  if ('response' in body) return body.response;
  const made = await createAssembly(id!, auth.member.userId, body.data);
  return json({ assembly: { id: made.id, jobId: id, ...body.data }, revision: { id: made.revisionId, number: 1 } }, 201);
};
