import type { APIRoute } from 'astro';
import { authorize, can } from '../../../lib/server/access';
import { apiError, readJson, readQuery } from '../../../lib/server/http';
import { jobBody, listQuery, teamIdQuery } from '../../../lib/schemas/api';
import { createJob, listJobs } from '../../../lib/server/services/jobs';
import { json } from '../../../lib/server/services/respond';

const query = listQuery(['updatedAt', 'name', 'reference', 'client', 'location', 'createdAt', 'assemblyCount'], '-updatedAt').extend(teamIdQuery.shape);

/** the team's jobs: ?teamId=&page=&pageSize=&sort=&q= */
export const GET: APIRoute = async ({ locals, url }) => {
  if (!locals.user) return apiError(401, 'unauthenticated', 'Sign in first.');
  const q = readQuery(url, query);
  if ('response' in q) return q.response;
  const auth = await authorize(locals, q.data.teamId);
  if ('response' in auth) return auth.response;
  return json(await listJobs(q.data.teamId, q.data));
};

export const POST: APIRoute = async ({ locals, request }) => {
  if (!locals.user) return apiError(401, 'unauthenticated', 'Sign in first.');
  const body = await readJson(request, jobBody);
  if ('response' in body) return body.response;
  const auth = await authorize(locals, body.data.teamId, can.edit);
  if ('response' in auth) return auth.response;
  const { teamId, ...input } = body.data;
  const job = await createJob(teamId, auth.member.userId, input);
  return json({ job: { id: job.id, teamId, ...input } }, 201);
};
