// what the worker exposes, kept apart from the worker's own file so it can be called
// directly (tests in node, the server) without a Worker.
import * as Comlink from 'comlink';
import type { UploadedSeries } from '../schemas/workbench.ts';
import { runDocument, transferables, type RunOutcome } from './runDocument.ts';

/** one run request: the workbench document and, for an uploaded outdoor series, its data */
export interface RunRequest {
  /** a monotonically increasing id chosen by the caller; cancel() names it */
  id: number;
  document: unknown;
  upload?: UploadedSeries | null;
}

/** progress callback: fraction 0…1 of the steps done */
export type ProgressFn = (id: number, fraction: number) => void;

const cancelled = new Set<number>();
let running: number | null = null;

export const runnerApi = {
  /**
   * Runs a document. Progress is reported through `onProgress` (a comlink proxy across
   * the worker boundary); the result's arrays are transferred, not copied.
   * `cancelFlag`, when given (a SharedArrayBuffer view on cross-origin-isolated pages,
   * or any Int32Array in the same thread), stops the run when its first entry is 1.
   */
  run(request: RunRequest, onProgress?: ProgressFn, cancelFlag?: Int32Array): RunOutcome {
    const { id } = request;
    running = id;
    try {
      const outcome = runDocument(request.document, request.upload, {
        onProgress: onProgress ? (f) => void onProgress(id, f) : undefined,
        shouldCancel: () => cancelled.has(id) || (cancelFlag !== undefined && Atomics.load(cancelFlag, 0) === 1),
      });
      return Comlink.transfer(outcome, transferables(outcome));
    } finally {
      running = null;
      cancelled.delete(id);
    }
  },
  /** asks a run to stop at its next progress check (takes effect when called from inside the run's thread, e.g. from a progress callback) */
  cancel(id: number): void {
    if (running === id) cancelled.add(id);
  },
  /** answers at once: proves the worker is up */
  ping(): string {
    return 'ok';
  },
};

export type RunnerApi = typeof runnerApi;
