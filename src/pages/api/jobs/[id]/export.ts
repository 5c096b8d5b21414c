import type { APIRoute } from 'astro';
import { authorize, can, teamOfJob } from '../../../../lib/server/access';
import { auditExport, backupFileName, exportJob } from '../../../../lib/server/services/backup';
import { clientIp, idOf, notFound } from '../../../../lib/server/services/respond';

/** the job as one backup file (engineers and admins of its team), offered as a download */
export const GET: APIRoute = async (ctx) => {
  const id = idOf(ctx.params.id);
  const auth = await authorize(ctx.locals, id ? await teamOfJob(id) : null, can.edit);
  if ('response' in auth) return auth.response;
  const backup = await exportJob(id!);
  if (!backup) return notFound();
  await auditExport(auth.member.teamId, auth.member.userId, id!, clientIp(ctx));
  return new Response(JSON.stringify(backup), {
    headers: {
      'content-type': 'application/json; charset=utf-8',
      'content-disposition': `attachment; filename="${backupFileName(backup.job.name)}"`,
      'cache-control': 'no-store',
    },
  });
};
