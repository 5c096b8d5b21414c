import type { APIRoute } from 'astro';
import { authorize, can, teamOfAssembly } from '../../../../lib/server/access';
import { readJson } from '../../../../lib/server/http';
import { assemblyPatchBody } from '../../../../lib/schemas/api';
import { getAssembly, updateAssembly } from '../../../../lib/server/services/jobs';
import { headOf } from '../../../../lib/server/services/revisions';
import { idOf, json } from '../../../../lib/server/services/respond';

/** the assembly, its newest revision (with the document) and the caller's role */
export const GET: APIRoute = async ({ locals, params }) => {
  const id = idOf(params.id);
  const auth = await authorize(locals, id ? await teamOfAssembly(id) : null);
  if ('response' in auth) return auth.response;
  const [assembly, head] = await Promise.all([getAssembly(id!), headOf(id!)]);
  return json({ assembly, head, role: auth.member.role });
};

export const PATCH: APIRoute = async ({ locals, params, request }) => {
  const id = idOf(params.id);
  const auth = await authorize(locals, id ? await teamOfAssembly(id) : null, can.edit);
  if ('response' in auth) return auth.response;
  const body = await readJson(request, assemblyPatchBody);
  if ('response' in body) return body.response;
  await updateAssembly(id!, body.data);
  return json({ assembly: await getAssembly(id!) });
};
