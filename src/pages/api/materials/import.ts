import type { APIRoute } from 'astro';
import { z } from 'zod';
import { apiError, readJson } from '../../../lib/server/http';
import { authorize, can } from '../../../lib/server/access';
import { importMaterials, listMaterials } from '../../../lib/server/materials';
import { parseMaterialsCsv } from '../../../lib/materials/csv';

const body = z.object({
  teamId: z.number({ error: 'must be a team id' }).int({ error: 'must be a team id' }).positive({ error: 'must be a team id' }),
  /** the file's text */
  csv: z.string({ error: 'must be the text of a CSV file' }).max(1_000_000, { error: 'must be at most 1 MB' }),
  /** false: check and preview only; true: store the rows, all or none */
  commit: z.boolean({ error: 'must be true or false' }).default(false),
});

/** preview (commit false) or store (commit true) a CSV of materials; a file with any problem stores nothing */
export const POST: APIRoute = async ({ locals, request }) => {
  if (!locals.user) return apiError(401, 'unauthenticated', 'Sign in first.');
  const parsed = await readJson(request, body);
  if ('response' in parsed) return parsed.response;
  const { teamId, csv, commit } = parsed.data;
  const auth = await authorize(locals, teamId, can.edit);
  if ('response' in auth) return auth.response;
  const { rows, problems } = parseMaterialsCsv(csv);
  // names already in the team library are problems too
  const existing = new Set((await listMaterials(teamId, 'team')).map((m) => m.name.toLowerCase()));
  for (const r of rows) {
    if (existing.has(r.material.name.toLowerCase())) {
      problems.push({ line: r.line, field: 'Name', message: `Name “${r.material.name}” is already in the team library` });
    }
  }
  problems.sort((a, b) => a.line - b.line);
  const ok = problems.length === 0;
  const preview = { rows: ok ? rows : rows.filter((r) => !problems.some((p) => p.line === r.line)), problems };
  if (!commit) return Response.json({ ...preview, valid: ok, committed: false }, { headers: { 'cache-control': 'no-store' } });
  if (!ok) {
    return apiError(422, 'import_rejected', `The file has ${problems.length} problem${problems.length > 1 ? 's' : ''}; nothing was imported.`, undefined, preview);
  }
  const created = await importMaterials(teamId, locals.user.id, rows.map((r) => r.material));
  return Response.json({ created, committed: true }, { status: 201, headers: { 'cache-control': 'no-store' } });
};
