// the main-thread side of compare and sensitivity: one worker pool of compare workers; a plan is cut
// into one share per worker, in whole quads (the batched engine's width).
import type { UploadedSeries, WorkbenchDocument } from '../schemas/workbench.ts';
import type { CompareApi, CompareItem, CompareOutcome } from './compareApi.ts';
import { WorkerPool, type PoolJob } from './pool.ts';
import { perturbationPlan, type Metrics, type Perturbation } from './sensitivity.ts';

/** the batched engine interleaves four models: shares are whole multiples of this */
export const CHUNK = 4;

export class CompareRunner {
  readonly pool = new WorkerPool<CompareApi>(() => new Worker(new URL('./compare.worker.ts', import.meta.url), { type: 'module', name: 'wallpulse-compare' }));

  /** starts the workers ahead of the first job */
  warm(): Promise<void> {
    return this.pool.warm((api) => api.ping());
  }

  /** the alternatives, one task per chunk of four; outcomes in the order given */
  compare(items: CompareItem[], onProgress?: (fraction: number) => void): PoolJob<CompareOutcome> {
    const chunks = chunk(items, Math.max(1, Math.min(CHUNK, Math.ceil(items.length / this.pool.size))));
    const job = this.pool.run(
      chunks.map((c) => (api, progress) => api.compare(c, progress)),
      onProgress,
      chunks.map((c) => c.length),
    );
    return { result: job.result.then((r) => (r ? r.flat() : null)), cancel: job.cancel };
  }

  /** a whole sensitivity plan of a document: metrics in plan order (perturbationPlan) */
  sensitivity(doc: WorkbenchDocument, upload: UploadedSeries | null, fraction: number, onProgress?: (fraction: number) => void): PoolJob<Metrics> {
    // one share per worker, in whole quads of the batched engine: each call validates the document and
    // builds the base model once, so fewer, larger shares cost less (the engine reports progress within one)
    const plan = perturbationPlan(doc.layers.length);
    const share = CHUNK * Math.ceil(Math.ceil(plan.length / CHUNK) / this.pool.size);
    const chunks = chunk<Perturbation | null>(plan, share);
    const job = this.pool.run(
      chunks.map((c) => (api, progress) => api.sensitivity(doc, upload, c, fraction, progress)),
      onProgress,
      chunks.map((c) => c.length),
    );
    return { result: job.result.then((r) => (r ? r.flat() : null)), cancel: job.cancel };
  }

  dispose(): void {
    this.pool.dispose();
  }
}

function chunk<T>(items: T[], size: number): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < items.length; i += size) out.push(items.slice(i, i + size));
  return out;
}
