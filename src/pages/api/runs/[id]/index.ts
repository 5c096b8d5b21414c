import type { APIRoute } from 'astro';
import { authorize, teamOfRevision } from '../../../../lib/server/access';
import { getRun, revisionOfRun } from '../../../../lib/server/services/runs';
import { idOf, json } from '../../../../lib/server/services/respond';

/** one run: what ran, what it found, who ran it when (its packed series: ./packed) */
export const GET: APIRoute = async ({ locals, params }) => {
  const id = idOf(params.id);
  const revisionId = id ? await revisionOfRun(id) : null;
  const auth = await authorize(locals, revisionId ? await teamOfRevision(revisionId) : null);
  if ('response' in auth) return auth.response;
  return json({ run: await getRun(id!) });
};
