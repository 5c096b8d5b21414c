import type { APIRoute } from 'astro';
import { z } from 'zod';
import { apiError, readQuery } from '../../../lib/server/http';
import { authorize } from '../../../lib/server/access';
import { listMaterials, teamFor } from '../../../lib/server/materials';
import { formatMaterialsCsv } from '../../../lib/materials/csv';

const query = z.object({
  teamId: z.coerce.number({ error: 'must be a team id' }).int({ error: 'must be a team id' }).positive({ error: 'must be a team id' }).optional(),
  scope: z.enum(['all', 'team', 'builtin'], { error: 'must be all, team or builtin' }).default('team'),
});

/** the team's materials (scope=team), the built-ins (builtin) or both (all) as CSV, readable by the import */
export const GET: APIRoute = async ({ locals, url }) => {
  if (!locals.user) return apiError(401, 'unauthenticated', 'Sign in first.');
  const q = readQuery(url, query);
  if ('response' in q) return q.response;
  const auth = await authorize(locals, await teamFor(locals, q.data.teamId));
  if ('response' in auth) return auth.response;
  const items = await listMaterials(auth.member.teamId, q.data.scope);
  const csv = formatMaterialsCsv(items);
  const file = `wallpulse-materials-${q.data.scope}-${new Date().toISOString().slice(0, 10)}.csv`;
  return new Response('\uFEFF' + csv + '\r\n', {
    headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': `attachment; filename="${file}"`, 'cache-control': 'no-store' },
  });
};
