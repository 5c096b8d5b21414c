// the main-thread side of the run: one module worker wrapped with comlink. a run is
// cancelled by ending the worker (the engine loop is synchronous inside it, so a message
// could not reach it); the next run starts a fresh worker.
import * as Comlink from 'comlink';
import type { UploadedSeries } from '../schemas/workbench.ts';
import type { RunOutcome } from './runDocument.ts';
import type { RunnerApi } from './runnerApi.ts';

export type { RunOutcome, RunDone } from './runDocument.ts';

export interface StartedRun {
  id: number;
  /** settles with the outcome; a cancelled run resolves with { kind: 'cancelled' } */
  result: Promise<RunOutcome>;
  cancel(): void;
}

export class Runner {
  private worker: Worker | null = null;
  private api: Comlink.Remote<RunnerApi> | null = null;
  private nextId = 1;
  private current: { id: number; settle: (o: RunOutcome) => void } | null = null;

  private ensure(): Comlink.Remote<RunnerApi> {
    if (!this.api) {
      this.worker = new Worker(new URL('./runner.worker.ts', import.meta.url), { type: 'module', name: 'wallpulse-runner' });
      this.api = Comlink.wrap<RunnerApi>(this.worker);
    }
    return this.api;
  }

  /** starts the worker ahead of the first run so the first result does not wait for it */
  warm(): void {
    void this.ensure().ping();
  }

  /** true while a run is in flight */
  get busy(): boolean {
    return this.current !== null;
  }

  /** runs a document; a run already in flight is cancelled first */
  run(document: unknown, upload: UploadedSeries | null, onProgress?: (fraction: number) => void): StartedRun {
    if (this.current) this.cancelCurrent();
    const api = this.ensure();
    const id = this.nextId++;
    let settle!: (o: RunOutcome) => void;
    const result = new Promise<RunOutcome>((resolve) => (settle = resolve));
    this.current = { id, settle };
    const progress = onProgress ? Comlink.proxy((runId: number, f: number) => runId === id && onProgress(f)) : undefined;
    api
      .run({ id, document, upload }, progress)
      .then((outcome) => {
        if (this.current?.id === id) {
          this.current = null;
          settle(outcome);
        }
      })
      .catch((e: unknown) => {
        if (this.current?.id === id) {
          this.current = null;
          settle({ kind: 'invalid', issues: [`run: ${e instanceof Error ? e.message : String(e)}`] });
        }
      });
    return { id, result, cancel: () => this.current?.id === id && this.cancelCurrent() };
  }

  private cancelCurrent(): void {
    const run = this.current;
    if (!run) return;
    this.current = null;
    this.dispose();
    run.settle({ kind: 'cancelled' });
  }

  /** ends the worker (a page leaving, or a cancelled run) */
  dispose(): void {
    if (this.api) this.api[Comlink.releaseProxy]();
    this.worker?.terminate();
    this.worker = null;
    this.api = null;
  }
}
