// what the Report and the Shared view read: a revision's document, its check trail and the run
// that stands for it. the run is the newest one kept with the revision; without one, a short
// document is run here within a node-step budget (about a fifth of a second of one core) and
// the result is cached per revision, since a revision never changes. nothing unbounded runs in
// a request: a longer document shows its analytic figures and asks for a kept run.
import { and, desc, eq } from 'drizzle-orm';
import { db } from '../db';
import { assemblies, jobs, revisions, users, type RevisionState } from '../db/schema';
import { membership } from '../access';
import { getUpload } from '../uploads';
import { workbenchDocumentSchema, toModel, type Exposure, type UploadedSeries, type WorkbenchDocument } from '../../schemas/workbench';
import { parseModel } from '../../schemas/model';
import { analyse, countCells, type Figures } from '../../thermal/index';
import { runDocument, type RunDone } from '../../workbench/runDocument';
import type { UploadFacts } from '../../workbench/exposureText';
import { canonical } from '../../workbench/staleness';
import { figureRows, type FigureRow } from '../../workbench/figureRows';
import { verdictsOf, type Verdict } from '../../workbench/verdicts';
import { runCharts, type RunCharts } from '../../workbench/svgCharts';
import { commentsOf, eventsOf, stateText } from './revisions';
import { latestKeptRun, type KeptRunRow } from './runs';

/**
 * cells × steps a request may run itself: the default exposure of a two-layer wall (73 cells,
 * 2,016 steps, 147,168 cell-steps) took 90 ms on one core of the 2-core test machine, so this
 * stays near 0.2 s; the result is cached per revision
 */
export const SERVER_RUN_BUDGET = 300_000;

/** cells × steps of a document's run */
export function nodeSteps(doc: WorkbenchDocument): number {
  const cells = countCells(doc.layers, { maxCellSize: doc.exposure.maxCellSize, minCellsPerLayer: 4 });
  const steps = ((doc.exposure.days + doc.exposure.warmupDays) * 86400) / doc.exposure.timeStep;
  return cells * steps;
}

/** the run that stands for a revision, and where it came from */
export type RevisionRun =
  | { kind: 'kept'; run: RunDone; exposure: Exposure; row: KeptRunRow; matches: boolean }
  | { kind: 'server'; run: RunDone; exposure: Exposure }
  | { kind: 'none'; reason: string };

const serverRuns = new Map<string, RunDone | { invalid: string[] }>();
const CACHE_LIMIT = 64;

function remember<T extends RunDone | { invalid: string[] }>(key: string, value: T): T {
  if (serverRuns.size >= CACHE_LIMIT) serverRuns.delete(serverRuns.keys().next().value!);
  serverRuns.set(key, value);
  return value;
}

/** the kept run of a revision, else a budgeted server run (cached per revision), else why there is none */
export async function runForRevision(revisionId: number, doc: WorkbenchDocument, upload: UploadedSeries | null): Promise<RevisionRun> {
  const kept = await latestKeptRun(revisionId);
  if (kept) {
    const parsed = workbenchDocumentSchema.shape.exposure.safeParse(kept.row.exposure);
    const exposure = parsed.success ? parsed.data : doc.exposure;
    return { kind: 'kept', run: kept.run, exposure, row: kept.row, matches: canonical(exposure) === canonical(doc.exposure) };
  }
  if (doc.exposure.outdoor.mode === 'series' && !upload) return { kind: 'none', reason: 'the uploaded outdoor series of this revision is not found' };
  const work = nodeSteps(doc);
  if (work > SERVER_RUN_BUDGET) {
    return {
      kind: 'none',
      reason: `no run is kept with this revision, and its run (${Math.round(work).toLocaleString('en-GB')} cell-steps) is longer than a page runs itself (${SERVER_RUN_BUDGET.toLocaleString('en-GB')}): run it in the workbench and keep the run`,
    };
  }
  const key = `${revisionId}`;
  let got = serverRuns.get(key);
  if (!got) {
    const out = runDocument(doc, upload);
    got = remember(key, out.kind === 'done' ? out : { invalid: out.kind === 'invalid' ? out.issues : ['the run was cancelled'] });
  }
  if ('invalid' in got) return { kind: 'none', reason: `the engine cannot run this revision: ${got.invalid.join('; ')}` };
  return { kind: 'server', run: got, exposure: doc.exposure };
}

/** the analytic figures of a document (steady, per layer, ISO 13786), or the problems of its model */
export function analyticOf(doc: WorkbenchDocument, upload: UploadedSeries | null): { figures: Figures | null; issues: string[] } {
  const still = doc.exposure.outdoor.mode === 'series' && !upload ? { ...doc, exposure: { ...doc.exposure, outdoor: { mode: 'sine' as const, mean: 0, swing: 0, peakHour: 0 } } } : doc;
  const m = parseModel(toModel(still, upload ?? undefined));
  return m.ok ? { figures: analyse(m.model), issues: [] } : { figures: null, issues: m.issues };
}

export interface ReportData {
  assembly: { id: number; name: string; element: string; description: string; jobName: string; jobReference: string; teamId: number };
  revision: { id: number; number: number; state: RevisionState; stateText: string; note: string; createdAt: Date; authorName: string | null };
  doc: WorkbenchDocument | null;
  upload: (UploadFacts & { series: UploadedSeries }) | null;
  events: Awaited<ReturnType<typeof eventsOf>>;
  comments: Awaited<ReturnType<typeof commentsOf>>;
  analytic: Figures | null;
  issues: string[];
  run: RevisionRun;
}

/**
 * the Report of a revision (its number, else the newest) as a member of the assembly's team sees it;
 * null when the assembly or revision does not exist or is not the person's
 */
export async function reportOf(assemblyId: number, userId: string, revisionNumber: number | null): Promise<ReportData | null> {
  const a = (
    await db
      .select({ id: assemblies.id, name: assemblies.name, element: assemblies.element, description: assemblies.description, jobName: jobs.name, jobReference: jobs.reference, teamId: jobs.teamId })
      .from(assemblies)
      .innerJoin(jobs, eq(jobs.id, assemblies.jobId))
      .where(eq(assemblies.id, assemblyId))
      .limit(1)
  )[0];
  if (!a || !(await membership(userId, a.teamId))) return null;
  const revs = await db
    .select({ id: revisions.id, number: revisions.number, state: revisions.state, note: revisions.note, model: revisions.model, createdAt: revisions.createdAt, authorName: users.name })
    .from(revisions)
    .leftJoin(users, eq(users.id, revisions.authorId))
    .where(revisionNumber === null ? eq(revisions.assemblyId, a.id) : and(eq(revisions.assemblyId, a.id), eq(revisions.number, revisionNumber)))
    .orderBy(desc(revisions.number))
    .limit(1);
  const r = revs[0];
  if (!r) return null;
  const parsed = workbenchDocumentSchema.safeParse(r.model);
  const doc = parsed.success ? parsed.data : null;
  let upload: ReportData['upload'] = null;
  if (doc && doc.exposure.outdoor.mode === 'series') {
    const u = await getUpload(doc.exposure.outdoor.uploadId);
    if (u && u.teamId === a.teamId) upload = { name: u.name, hours: u.rowCount, hasIrradiance: u.hasIrradiance, series: u.series };
  }
  const [events, comments] = await Promise.all([eventsOf(r.id), commentsOf(r.id)]);
  const analytic = doc ? analyticOf(doc, upload?.series ?? null) : { figures: null, issues: ['the stored build-up of this revision could not be read'] };
  const run: RevisionRun = doc ? await runForRevision(r.id, doc, upload?.series ?? null) : { kind: 'none', reason: 'the stored build-up of this revision could not be read' };
  const { model: _model, ...revision } = r;
  return {
    assembly: a,
    revision: { ...revision, stateText: stateText(r.state) },
    doc,
    upload,
    events,
    comments,
    analytic: analytic.figures,
    issues: analytic.issues,
    run,
  };
}

/** the revision a report would show (its number, else the newest), for a member of the team; null otherwise */
export async function revisionForReport(assemblyId: number, userId: string, revisionNumber: number | null): Promise<{ id: number; number: number; state: RevisionState; assemblyName: string } | null> {
  const rows = await db
    .select({ id: revisions.id, number: revisions.number, state: revisions.state, assemblyName: assemblies.name, teamId: jobs.teamId })
    .from(revisions)
    .innerJoin(assemblies, eq(assemblies.id, revisions.assemblyId))
    .innerJoin(jobs, eq(jobs.id, assemblies.jobId))
    .where(revisionNumber === null ? eq(revisions.assemblyId, assemblyId) : and(eq(revisions.assemblyId, assemblyId), eq(revisions.number, revisionNumber)))
    .orderBy(desc(revisions.number))
    .limit(1);
  const r = rows[0];
  if (!r || !(await membership(userId, r.teamId))) return null;
  return { id: r.id, number: r.number, state: r.state, assemblyName: r.assemblyName };
}

/** what the Shared view draws from a revision: the run that stands for it, its rows, verdicts and charts */
export interface RevisionView {
  analytic: Figures | null;
  run: RevisionRun;
  rows: FigureRow[];
  verdicts: Verdict[];
  charts: RunCharts | null;
  upload: UploadFacts | null;
}

const views = new Map<string, RevisionView>();

/**
 * the Shared view's figures and charts of a revision, computed once per revision and kept run
 * (an issued revision never changes; a newer kept run makes a new entry)
 */
export async function revisionView(revisionId: number, newestRunId: number | null, doc: WorkbenchDocument, teamId: number | null = null): Promise<RevisionView> {
  const key = `${revisionId}:${newestRunId ?? 'none'}`;
  const hit = views.get(key);
  if (hit) return hit;
  let upload: { facts: UploadFacts; series: UploadedSeries } | null = null;
  if (doc.exposure.outdoor.mode === 'series') {
    const u = await getUpload(doc.exposure.outdoor.uploadId);
    if (u && (teamId === null || u.teamId === teamId)) upload = { facts: { hasIrradiance: u.hasIrradiance }, series: u.series };
  }
  const run = await runForRevision(revisionId, doc, upload?.series ?? null);
  const done = run.kind === 'none' ? null : run;
  const view: RevisionView = {
    analytic: analyticOf(doc, upload?.series ?? null).figures,
    run,
    rows: done ? figureRows(done.run, done.exposure) : [],
    verdicts: done ? verdictsOf(done.run, done.exposure) : [],
    charts: done ? runCharts(done.run, doc.layers.map((l) => l.materialClass)) : null,
    upload: upload?.facts ?? (doc.exposure.outdoor.mode === 'series' ? { hasIrradiance: false } : null),
  };
  if (views.size >= CACHE_LIMIT) views.delete(views.keys().next().value!);
  views.set(key, view);
  return view;
}
