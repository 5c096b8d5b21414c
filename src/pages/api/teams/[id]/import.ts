import type { APIRoute } from 'astro';
import { authorize, can } from '../../../../lib/server/access';
import { apiError } from '../../../../lib/server/http';
import { parseBackup, readBackupBody, restoreJob } from '../../../../lib/server/services/backup';
import { clientIp, idOf, json } from '../../../../lib/server/services/respond';

/**
 * Restore a job backup file (the body, as JSON) as a new job of the team (engineers and
 * admins). The whole file is checked before anything is written, and written in one
 * transaction: a file with any problem answers with the problem and changes nothing.
 */
export const POST: APIRoute = async (ctx) => {
  const auth = await authorize(ctx.locals, idOf(ctx.params.id), can.edit);
  if ('response' in auth) return auth.response;
  const body = await readBackupBody(ctx.request);
  if (!body.ok) return apiError(body.status, body.code, body.message, body.fields);
  const parsed = parseBackup(body.text);
  if (!parsed.ok) return apiError(parsed.status, parsed.code, parsed.message, parsed.fields);
  const restored = await restoreJob(auth.member.teamId, { id: ctx.locals.user!.id, name: ctx.locals.user!.name }, parsed.backup, clientIp(ctx));
  if (!restored.ok) return apiError(restored.status, restored.code, restored.message, restored.fields);
  return json(restored.result, 201);
};
