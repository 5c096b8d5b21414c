import type { APIRoute } from 'astro';
import { apiError } from '../../../lib/server/http';
import { revisionForReport } from '../../../lib/server/services/report';
import { idOf } from '../../../lib/server/services/respond';
import { reportPdf } from '../../../lib/server/pdf';

/** the Report of a revision (?revision=<number>, else the newest) as a PDF printed by the server */
export const GET: APIRoute = async ({ locals, params, url, request }) => {
  const user = locals.user;
  if (!user) return apiError(401, 'unauthenticated', 'Sign in to download a report.');
  const assemblyId = idOf(params.id);
  const found = assemblyId ? await revisionForReport(assemblyId, user.id, idOf(url.searchParams.get('revision') ?? undefined)) : null;
  if (!found) return apiError(404, 'not_found', 'There is no such assembly or revision in your teams.');
  const page = new URL(`/assemblies/${assemblyId}/report`, url.origin);
  page.searchParams.set('revision', String(found.number));
  page.searchParams.set('print', '1');
  try {
    // an issued revision never changes: its PDF is printed once
    const pdf = await reportPdf(page.href, request.headers.get('cookie'), found.state === 'issued' ? `revision:${found.id}` : null);
    const name = `${found.assemblyName}-revision-${found.number}.pdf`.replace(/[^\w.-]+/g, '-');
    return new Response(new Uint8Array(pdf), {
      headers: { 'content-type': 'application/pdf', 'content-disposition': `attachment; filename="${name}"`, 'cache-control': 'private, no-store' },
    });
  } catch (e) {
    return apiError(503, 'pdf_unavailable', `The PDF could not be made just now (${e instanceof Error ? e.message : String(e)}); print the report page instead.`);
  }
};
