import type { APIRoute } from 'astro';
import { authorize, teamOfJob } from '../../../../lib/server/access';
import { compareSources } from '../../../../lib/server/services/compare';
import { getJob } from '../../../../lib/server/services/jobs';
import { idOf, json } from '../../../../lib/server/services/respond';

/** the job's assemblies with their revisions and documents: what the compare page picks from (members of the job's team) */
export const GET: APIRoute = async ({ locals, params }) => {
  const id = idOf(params.id);
  const auth = await authorize(locals, id ? await teamOfJob(id) : null);
  if ('response' in auth) return auth.response;
  const job = await getJob(id!);
  return json({ job: { id: job!.id, name: job!.name }, assemblies: await compareSources(id!) });
};
