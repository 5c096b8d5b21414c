import type { APIRoute } from 'astro';
import { authorize, teamOfRevision } from '../../../../lib/server/access';
import { apiError } from '../../../../lib/server/http';
import { packedOf, revisionOfRun } from '../../../../lib/server/services/runs';
import { idOf } from '../../../../lib/server/services/respond';

/** the run packed (src/lib/workbench/keptRun.ts), as bytes; 404 when it was kept without its series */
export const GET: APIRoute = async ({ locals, params }) => {
  const id = idOf(params.id);
  const revisionId = id ? await revisionOfRun(id) : null;
  const auth = await authorize(locals, revisionId ? await teamOfRevision(revisionId) : null);
  if ('response' in auth) return auth.response;
  const packed = await packedOf(id!);
  if (!packed) return apiError(404, 'not_found', 'This run was kept without its series.');
  return new Response(new Uint8Array(packed), {
    headers: { 'content-type': 'application/octet-stream', 'content-length': String(packed.length), 'cache-control': 'private, max-age=3600' },
  });
};
