// what the compare worker exposes, kept apart from the worker's own file so tests and the
// bench can call it directly. both calls run their documents on the batched engine and send
// back only what the page needs: the compare figures with two traces, or the sensitivity metrics.
import * as Comlink from 'comlink';
import { parseModel, type ModelData } from '../schemas/model.ts';
import { toModel, workbenchDocumentSchema, type UploadedSeries, type WorkbenchDocument } from '../schemas/workbench.ts';
import { simulateBatch } from '../thermal/batch.ts';
import { compareRun, type CompareRun } from './compare.ts';
import { coarserModel } from './runDocument.ts';
import { fractionIssue, metricsOf, perturbedDocument, type Metrics, type Perturbation } from './sensitivity.ts';

/** fraction done of this call, 0…1 */
export type ChunkProgress = (fraction: number) => void;

/** one alternative: a workbench document (its exposure already the compared one) and its upload when the outdoor air is a series */
export interface CompareItem {
  doc: unknown;
  upload?: UploadedSeries | null;
}

export type CompareOutcome = ({ kind: 'done' } & CompareRun) | { kind: 'invalid'; issues: string[] };

/** a document made into an engine model, or the `path: message` lines that stop it */
function modelOf(input: unknown, upload: UploadedSeries | null | undefined): { ok: true; doc: WorkbenchDocument; model: ModelData } | { ok: false; issues: string[] } {
  const parsed = workbenchDocumentSchema.safeParse(input);
  if (!parsed.success) return { ok: false, issues: parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`) };
  const doc = parsed.data;
  if (doc.exposure.outdoor.mode === 'series' && !upload) return { ok: false, issues: ['exposure.outdoor.uploadId: the uploaded series is not loaded'] };
  const model = parseModel(toModel(doc, upload ?? undefined));
  return model.ok ? { ok: true, doc, model: model.model } : { ok: false, issues: model.issues };
}

/** about a hundred progress reports over a run, never closer than 256 steps */
function progressEvery(models: ModelData[]): number {
  const steps = Math.max(1, ...models.map((m) => Math.ceil(m.duration / m.timeStep)));
  return Math.max(256, Math.ceil(steps / 100));
}

export const compareApi = {
  /** runs the alternatives together; the traces' arrays are transferred, not copied */
  compare(items: CompareItem[], onProgress?: ChunkProgress): CompareOutcome[] {
    const built = items.map((it) => modelOf(it.doc, it.upload));
    const ok = built.flatMap((b) => (b.ok ? [b] : []));
    // each run with its twin at twice the step and cell, for the discretisation estimate (as the workbench makes it)
    const coarse = ok.map((b) => coarserModel(b.model));
    const models = [...ok.map((b) => b.model), ...coarse.flatMap((m) => (m ? [m] : []))];
    const results = models.length > 0 ? simulateBatch(models, { storeProfiles: false, onProgress, progressEvery: progressEvery(models) }) : [];
    let nextCoarse = ok.length;
    const runs = ok.map((b, i) => {
      const c = coarse[i];
      return compareRun(b.doc, b.model, results[i], { coarse: c ? { model: c, result: results[nextCoarse++] } : null });
    });
    let next = 0;
    const outcomes: CompareOutcome[] = built.map((b) => (b.ok ? { kind: 'done', ...runs[next++] } : { kind: 'invalid', issues: b.issues }));
    const buffers = outcomes.flatMap((o) => (o.kind === 'done' ? [o.series.hours.buffer, o.series.insideSurface.buffer, o.series.insideFlux.buffer] : [])) as ArrayBuffer[];
    return Comlink.transfer(outcomes, buffers);
  },

  /**
   * Runs a share of a sensitivity plan: the document with each listed perturbation (null: the
   * document itself) and answers the metrics of each, in order. Throws with the issues when the
   * document cannot run.
   */
  sensitivity(doc: unknown, upload: UploadedSeries | null, plan: (Perturbation | null)[], fraction: number, onProgress?: ChunkProgress): Metrics[] {
    const issue = fractionIssue(fraction);
    if (issue) throw new Error(issue);
    const base = modelOf(doc, upload);
    if (!base.ok) throw new Error(base.issues.join('\n'));
    // a perturbed document differs from the valid base only in one positive layer value scaled by
    // (1 ± fraction), so it is not validated again (zod costs about as much as a short run): its model
    // is the base model with the layers toModel() makes of the perturbed document
    const runs = plan.map((p) => {
      if (!p) return base;
      const perturbed = perturbedDocument(base.doc, p, fraction);
      const layers = toModel(perturbed, upload ?? undefined).layers;
      const model: ModelData = { ...base.model, layers: base.model.layers.map((l, i) => ({ ...l, ...layers[i] })) };
      return { ok: true as const, doc: perturbed, model };
    });
    const results = simulateBatch(runs.map((r) => r.model), { storeProfiles: false, onProgress, progressEvery: progressEvery(runs.map((r) => r.model)) });
    return runs.map((r, i) => metricsOf(compareRun(r.doc, r.model, results[i], { moisture: false, withSeries: false }).figures));
  },

  /** answers at once: proves the worker is up and its modules are loaded */
  ping(): string {
    return 'ok';
  },
};

export type CompareApi = typeof compareApi;
