// an issued revision with its whole record, made through the API as the demo team would:
// a two-layer wall saved by the engineer, a run kept with it (packed as the browser packs it),
// a comment, the check (sent to check, checked, issued, each with a note) and a share link.
import { packRun, toBase64 } from '../../src/lib/workbench/keptRun';
import { runDocument, type RunDone } from '../../src/lib/workbench/runDocument';
import { summaryOf } from '../../src/lib/workbench/figures';
import { defaultExposure, type WorkbenchDocument } from '../../src/lib/schemas/workbench';
import { demoClimate } from '../../src/lib/moisture/index';
import { DEMO, call, demoTeamId, uid } from './teamFixtures';

/** brick outside mineral wool, typical values (from memory), under the Harrow Lane demo climate for the moisture check */
export function twoLayerDocument(): WorkbenchDocument {
  return {
    version: 2,
    layers: [
      { id: 'brick', name: 'Facing brick', materialRef: null, materialClass: 'masonry', thickness: 0.102, conductivity: 0.77, density: 1700, specificHeat: 800, vapourResistanceFactor: 10, source: 'typical value (from memory)', note: '' },
      { id: 'wool', name: 'Mineral wool', materialRef: null, materialClass: 'insulation', thickness: 0.1, conductivity: 0.035, density: 30, specificHeat: 1030, vapourResistanceFactor: 1, source: 'typical value (from memory)', note: '' },
      { id: 'block', name: 'Dense block', materialRef: null, materialClass: 'concrete', thickness: 0.1, conductivity: 1.13, density: 2000, specificHeat: 1000, vapourResistanceFactor: 15, source: 'typical value (from memory)', note: '' },
    ],
    exposure: { ...defaultExposure(), indoorRelativeHumidity: 60, climate: demoClimate('harrow-lane') },
  };
}

async function ok(res: Response | Promise<Response>, status: number) {
  const r = await res;
  if (r.status !== status) throw new Error(`${r.url}: expected ${status}, got ${r.status}: ${await r.text()}`);
  return r.json();
}

export interface IssuedRecord {
  assemblyId: number;
  revisionId: number;
  revisionNumber: number;
  runId: number;
  run: RunDone;
  summary: Record<string, number | string | null>;
  token: string;
  notes: { sent: string; checked: string; issued: string; comment: string };
}

/** the record of one issued revision; `issue: false` stops at a revision with its kept run */
export async function issuedRecord(opts: { issue?: boolean } = {}): Promise<IssuedRecord> {
  const teamId = await demoTeamId();
  const tag = uid();
  const job = await ok(call('POST', '/api/jobs', { userId: DEMO.engineer, body: { teamId, name: `Harrow Lane reading room ${tag}` } }), 201);
  const made = await ok(call('POST', `/api/jobs/${job.job.id}/assemblies`, { userId: DEMO.engineer, body: { name: `Reading room wall ${tag}`, element: 'wall' } }), 201);
  const doc = twoLayerDocument();
  const saved = await ok(call('POST', `/api/assemblies/${made.assembly.id}/revisions`, { userId: DEMO.engineer, body: { baseRevisionId: made.revision.id, model: doc, note: 'Brick, wool and block as surveyed' } }), 201);
  const revisionId: number = saved.revision.id;
  const run = runDocument(doc) as RunDone;
  if (run.kind !== 'done') throw new Error('the fixture document does not run');
  const summary = summaryOf(run.figures);
  const kept = await ok(call('POST', `/api/revisions/${revisionId}/runs`, { userId: DEMO.engineer, body: { exposure: doc.exposure, summary, packed: toBase64(packRun(run)) } }), 201);
  const notes = { sent: `Please check the wool thickness ${tag}`, checked: `Checked against the survey ${tag}`, issued: `Issued for tender ${tag}`, comment: `Brick density looks right for the 1930s stock ${tag}` };
  await ok(call('POST', `/api/revisions/${revisionId}/comments`, { userId: DEMO.checker, body: { body: notes.comment } }), 201);
  let token = '';
  if (opts.issue !== false) {
    await ok(call('POST', `/api/revisions/${revisionId}/transitions`, { userId: DEMO.engineer, body: { to: 'in_check', note: notes.sent } }), 201);
    await ok(call('POST', `/api/revisions/${revisionId}/transitions`, { userId: DEMO.checker, body: { to: 'checked', note: notes.checked } }), 201);
    await ok(call('POST', `/api/revisions/${revisionId}/transitions`, { userId: DEMO.engineer, body: { to: 'issued', note: notes.issued } }), 201);
    const share = await ok(call('POST', `/api/revisions/${revisionId}/shares`, { userId: DEMO.engineer, body: { label: `for the architect ${tag}` } }), 201);
    token = String(share.share.url).split('/s/')[1];
  }
  return { assemblyId: made.assembly.id, revisionId, revisionNumber: saved.revision.number, runId: kept.run.id, run, summary, token, notes };
}
