// a pool of module workers wrapped with comlink: at most one worker per core
// (navigator.hardwareConcurrency), each taking the next task when it is free. progress is the
// weighted sum of the tasks' own fractions. the engine loop is synchronous inside a worker, so a
// message could not stop it: cancel ends the workers, and the next job starts fresh ones.
import * as Comlink from 'comlink';

/** workers for this machine: one per core the browser reports, at least one */
export function poolSize(cores = typeof navigator !== 'undefined' ? navigator.hardwareConcurrency : 1): number {
  return Math.max(1, Math.floor(cores || 1));
}

/** one piece of work for a worker: call its api, report its own fraction done (0…1) */
export type PoolTask<Api, R> = (api: Comlink.Remote<Api>, progress: (fraction: number) => void) => Promise<R>;

export interface PoolJob<R> {
  /** every task's answer in task order, or null when the job was cancelled (or replaced by a newer one) */
  result: Promise<R[] | null>;
  cancel(): void;
}

interface Slot<Api> {
  worker: Worker;
  api: Comlink.Remote<Api>;
}

export class WorkerPool<Api> {
  private slots: Slot<Api>[] = [];
  private current: { stop: () => void } | null = null;

  /** `make` starts one worker (a `new Worker(new URL(...), { type: 'module' })` the bundler can see) */
  constructor(
    private readonly make: () => Worker,
    readonly size = poolSize(),
  ) {}

  private ensure(): Slot<Api>[] {
    while (this.slots.length < this.size) {
      const worker = this.make();
      this.slots.push({ worker, api: Comlink.wrap<Api>(worker) });
    }
    return this.slots;
  }

  /** starts the workers ahead of the first job; `ping` is a cheap call that proves each is up */
  async warm(ping: (api: Comlink.Remote<Api>) => Promise<unknown>): Promise<void> {
    await Promise.all(this.ensure().map((s) => ping(s.api)));
  }

  /** true while a job runs */
  get busy(): boolean {
    return this.current !== null;
  }

  /**
   * Runs the tasks over the workers (a job already running is cancelled first). `weights`
   * (default 1 each) say how much of the whole each task is, for the progress.
   */
  run<R>(tasks: PoolTask<Api, R>[], onProgress?: (fraction: number) => void, weights?: number[]): PoolJob<R> {
    this.cancel();
    const slots = this.ensure();
    const w = weights ?? tasks.map(() => 1);
    const total = w.reduce((a, b) => a + b, 0) || 1;
    const done = new Float64Array(tasks.length);
    const answers: R[] = new Array(tasks.length);
    let next = 0;
    let stopped = false;
    let settle!: (r: R[] | null) => void;
    let fail!: (e: unknown) => void;
    const result = new Promise<R[] | null>((resolve, reject) => {
      settle = resolve;
      fail = reject;
    });
    const report = () => {
      if (!onProgress || stopped) return;
      let sum = 0;
      for (let i = 0; i < done.length; i++) sum += done[i] * w[i];
      onProgress(Math.min(1, sum / total));
    };
    const job = {
      stop: () => {
        if (stopped) return;
        stopped = true;
        settle(null);
      },
    };
    this.current = job;
    const worker = async (slot: Slot<Api>) => {
      while (!stopped && next < tasks.length) {
        const i = next++;
        const progress = Comlink.proxy((f: number) => {
          // monotonic: an engine that reports per model restarts at 0 for the next one
          if (f > done[i]) {
            done[i] = f;
            report();
          }
        });
        answers[i] = await tasks[i](slot.api, progress);
        done[i] = 1;
        report();
      }
    };
    Promise.all(slots.map(worker)).then(
      () => {
        if (stopped) return;
        stopped = true;
        if (this.current === job) this.current = null;
        settle(answers);
      },
      (e: unknown) => {
        if (stopped) return;
        // one task failed: end the others too, the job's answer is the error
        stopped = true;
        if (this.current === job) {
          this.current = null;
          this.terminate();
        }
        fail(e);
      },
    );
    return {
      result,
      cancel: () => {
        if (this.current === job) this.cancel();
      },
    };
  }

  /** stops the running job (its result resolves with null) by ending the workers */
  cancel(): void {
    const job = this.current;
    if (!job) return;
    this.current = null;
    job.stop();
    this.terminate();
  }

  private terminate(): void {
    for (const s of this.slots) {
      s.api[Comlink.releaseProxy]();
      s.worker.terminate();
    }
    this.slots = [];
  }

  /** ends the workers (the page is leaving) */
  dispose(): void {
    this.cancel();
    this.terminate();
  }
}
