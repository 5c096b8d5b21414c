import type { APIRoute } from 'astro';
import { authorize, teamOfRevision } from '../../../lib/server/access';
import { getRun, revisionOfRun } from '../../../lib/server/services/revisions';
import { idOf, json } from '../../../lib/server/services/respond';

/** one run with its series */
export const GET: APIRoute = async ({ locals, params }) => {
  const id = idOf(params.id);
  const revisionId = id ? await revisionOfRun(id) : null;
  const auth = await authorize(locals, revisionId ? await teamOfRevision(revisionId) : null);
  if ('response' in auth) return auth.response;
  return json({ run: await getRun(id!) });
};
