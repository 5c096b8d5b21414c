import type { APIRoute } from 'astro';
import { z } from 'zod';
import { apiError, readJson } from '../../../lib/server/http';
import { authorize, can } from '../../../lib/server/access';
import { deleteMaterial, getMaterial, nameTaken, toLibraryMaterial, updateMaterial } from '../../../lib/server/materials';
import { materialFieldsSchema } from '../../../lib/materials/schema';

const noStore = { 'cache-control': 'no-store' };
// no defaults here: a field left out stays as it is
const patchBody = materialFieldsSchema
  .extend({ notes: z.string().trim().max(2000, { error: 'must be at most 2000 characters' }) })
  .partial()
  .strict();

function idOf(raw: string | undefined): number | null {
  return raw && /^\d{1,10}$/.test(raw) && Number(raw) > 0 ? Number(raw) : null;
}

/** the material and the caller's right over it, or the error response */
async function target(locals: App.Locals, raw: string | undefined, allowed = can.read) {
  if (!locals.user) return { response: apiError(401, 'unauthenticated', 'Sign in first.') };
  const id = idOf(raw);
  const row = id ? await getMaterial(id) : null;
  if (!row) return { response: apiError(404, 'not_found', 'Not found.') };
  if (row.teamId === null) {
    if (allowed === can.read) return { row };
    return { response: apiError(403, 'builtin_read_only', 'Built-in materials cannot be changed; add a team material with your product’s values instead.') };
  }
  const auth = await authorize(locals, row.teamId, allowed);
  if ('response' in auth) return { response: auth.response };
  return { row };
}

export const GET: APIRoute = async ({ locals, params }) => {
  const t = await target(locals, params.id);
  if ('response' in t) return t.response!;
  return Response.json({ material: toLibraryMaterial(t.row) }, { headers: noStore });
};

export const PATCH: APIRoute = async ({ locals, params, request }) => {
  const t = await target(locals, params.id, can.edit);
  if ('response' in t) return t.response!;
  const body = await readJson(request, patchBody);
  if ('response' in body) return body.response;
  if (body.data.name && (await nameTaken(t.row.teamId!, body.data.name, t.row.id))) {
    return apiError(422, 'invalid', 'Some fields are not valid.', { name: `a material called “${body.data.name}” is already in the team library` });
  }
  const material = await updateMaterial(t.row.id, body.data);
  return Response.json({ material }, { headers: noStore });
};

export const DELETE: APIRoute = async ({ locals, params }) => {
  const t = await target(locals, params.id, can.edit);
  if ('response' in t) return t.response!;
  await deleteMaterial(t.row.id);
  return new Response(null, { status: 204 });
};
